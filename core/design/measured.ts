/**
 * Measured data kept with a design (format 10): Touchstone files of the whole board, each with the map from the
 * file's ports to the design's ports. The whole file text is kept in the design, so the data survive without the
 * original file (the file's name is kept for the reader); `ports[k]` is the design port node measured at port k + 1
 * of the file, '' for a file port that was not connected to the design. The map is guessed in order when a file is
 * loaded and edited by the user; it is checked where it is used (core/network/measured.ts), not at load, so a design
 * whose ports were renamed still opens with its data.
 */
import * as v from 'valibot';
import type { Out } from './infer.ts';
import { DESIGN_LIMITS as L } from './limits.ts';

/**
 * One measured file: `id`, `name` (the file's name when it was loaded, e.g. 'board-3.s5p'), `touchstone` (the whole
 * text, 1.x or 2.0) and `ports` (the design port node id at each port of the file, in file order; '' = not connected).
 */
export type MeasuredFile = Out<typeof measuredFileSchema>;

/** At most this many measured files per design (each up to DESIGN_LIMITS.touchstone characters). */
export const MAX_MEASURED = 8;

const ID_WHAT = 'an id of 1 to 64 letters, digits, \'_\', \'-\', \'.\' or \':\'';
const PORT_WHAT = 'a design port id, or "" for a file port not connected';

export const measuredFileSchema = v.looseObject({
  id: v.pipe(v.string(ID_WHAT), v.regex(/^[A-Za-z0-9_.:-]{1,64}$/, ID_WHAT)),
  name: v.pipe(v.string(`a file name of 1 to ${L.name} characters`), v.minLength(1, `a file name of 1 to ${L.name} characters`), v.maxLength(L.name, `a file name of 1 to ${L.name} characters`)),
  touchstone: v.pipe(v.string(`Touchstone text of at most ${L.touchstone} characters`), v.minLength(1, 'Touchstone text'), v.maxLength(L.touchstone, `Touchstone text of at most ${L.touchstone} characters`)),
  ports: v.pipe(v.array(v.pipe(v.string(PORT_WHAT), v.regex(/^([A-Za-z0-9_.:-]{1,64})?$/, PORT_WHAT)), 'a list of design port ids, one per file port'), v.maxLength(4097, 'at most 4097 ports')),
}, 'a measured file {id, name, touchstone, ports}');

export const measuredListSchema = v.pipe(v.array(measuredFileSchema, 'a list of measured files'), v.maxLength(MAX_MEASURED, `at most ${MAX_MEASURED} measured files`));
