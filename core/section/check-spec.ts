/** Input checks of a cross-section: InputError in the user's words (field, what was expected, what was found). */
import { InputError, describe } from '../util/errors.ts';
import type { SectionSpec } from './types.ts';

function need(field: string, v: unknown, lo: number, hi: number, what: string, hint?: string): void {
  if (typeof v !== 'number' || !(v >= lo && v <= hi)) {
    throw new InputError(typeof v === 'number' && Number.isFinite(v) ? 'out-of-range' : 'invalid-number', field, what, describe(v), hint);
  }
}

const mm = (x: number) => `${Number((x * 1e3).toPrecision(4))} mm`;

/** Throws InputError naming the first field that cannot be solved. */
export function checkSection(s: SectionSpec): void {
  if (typeof s !== 'object' || s === null) throw new InputError('invalid-number', 'section', 'a cross-section description', describe(s));
  need('er', s.er, 1, 128, 'a relative permittivity from 1 to 128');
  need('h', s.h, 1e-6, 0.1, 'a substrate height from 1 µm to 100 mm');
  need('width', s.width, 1e-3 * s.h, 100 * s.h, `a strip width from 0.001·h to 100·h (${mm(1e-3 * s.h)} to ${mm(100 * s.h)})`);
  need('t', s.t, 0, s.h, `a copper thickness from 0 to h (${mm(s.h)})`);
  if (s.etchAngleDeg !== undefined) {
    need('etchAngleDeg', s.etchAngleDeg, 20, 90, 'a side-wall angle from 20° to 90° (90° = vertical walls)');
    const top = s.width - (2 * s.t) / Math.tan((s.etchAngleDeg * Math.PI) / 180);
    if (!(top > 0.05 * s.width)) {
      throw new InputError('out-of-range', 'etchAngleDeg', `a wall angle that leaves the strip a top (steeper than ${Number((Math.atan((2 * s.t) / (0.95 * s.width)) * 180 / Math.PI).toPrecision(3))}° for this width and thickness)`, `${s.etchAngleDeg}°`);
    }
  }
  if (s.spacing !== undefined) need('spacing', s.spacing, 1e-3 * s.h, 100 * s.h, `an edge-to-edge spacing from 0.001·h to 100·h (${mm(1e-3 * s.h)} to ${mm(100 * s.h)})`);
  if (s.side !== undefined) {
    need('side.gap', s.side.gap, 1e-3 * s.h, 100 * s.h, `a gap to the side copper from 0.001·h to 100·h (${mm(1e-3 * s.h)} to ${mm(100 * s.h)})`);
    if (!(s.side.width === Infinity)) need('side.width', s.side.width, 1e-3 * s.h, 1e4 * s.h, 'a side-copper width above 0.001·h, or Infinity for wide copper');
    if (s.side.connection !== 'stitched' && s.side.connection !== 'floating') throw new InputError('bad-choice', 'side.connection', "'stitched' or 'floating'", describe(s.side.connection));
    if (s.side.sides !== undefined && !['both', 'left', 'right'].includes(s.side.sides)) throw new InputError('bad-choice', 'side.sides', "'both', 'left' or 'right'", describe(s.side.sides));
  }
  if (s.trench !== undefined) {
    need('trench.depth', s.trench.depth, 0, 0.9 * s.h, `a trench depth from 0 to 0.9·h (${mm(0.9 * s.h)})`, 'a cut through most of the substrate is no longer a line on it');
    if (s.trench.angleDeg !== undefined) need('trench.angleDeg', s.trench.angleDeg, 10, 170, 'a V-bit angle from 10° to 170°');
  }
  if (s.cover !== undefined) {
    need('cover.er', s.cover.er, 1, 128, 'a cover permittivity from 1 to 128');
    need('cover.thickness', s.cover.thickness, 0, 10 * s.h, `a cover thickness from 0 to 10·h (${mm(10 * s.h)})`);
  }
  if (s.lid !== undefined) {
    const above = s.h + s.t + (s.cover?.thickness ?? 0);
    need('lid', s.lid, above * 1.05, 1000 * s.h, `a lid height above the copper and its cover (more than ${mm(above * 1.05)}) and below 1000·h`);
  }
}
