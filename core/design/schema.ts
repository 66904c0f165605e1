/**
 * The valibot schema of a current-version design file (DESIGN_VERSION). Every record is a loose object, so fields
 * this version does not know pass through untouched and are written back on save (the project's own rule). Each
 * check carries the words of what it expects; design/validate.ts turns valibot's issues into DesignIssues.
 *
 * Ranges are wide sanity bounds, not design rules: they catch unit mistakes (a height of 1.6 meaning mm, a
 * frequency in GHz) and nonsense, and leave physics limits to the line models' validity warnings.
 */
import * as v from 'valibot';
import { DESIGN_FORMAT } from './types.ts';
import { DESIGN_LIMITS as L, PROCESS_LIMITS } from './limits.ts';
import { targetsSchema, tolerancesSchema } from './targets-schema.ts';
import { sweepSpecSchema } from './sweep-settings.ts';
import { measuredListSchema } from './measured.ts';
import { proximityLimitSchema } from './proximity-limit.ts';

/** A finite number in [min, max] (either end exclusive on request), all failures described by `what`. */
function num(what: string, min: number, max: number, opts: { minExclusive?: boolean; maxExclusive?: boolean } = {}) {
  return v.pipe(
    v.number(what),
    v.finite(what),
    opts.minExclusive ? v.gtValue(min, what) : v.minValue(min, what),
    opts.maxExclusive ? v.ltValue(max, what) : v.maxValue(max, what),
  );
}

function int(what: string, min: number, max: number) {
  return v.pipe(v.number(what), v.integer(what), v.minValue(min, what), v.maxValue(max, what));
}

function text(what: string, max: number, min = 0) {
  return v.pipe(v.string(what), v.minLength(min, what), v.maxLength(max, what));
}

const ID_WHAT = `an id of 1 to ${L.id} letters, digits, '_', '-', '.' or ':'`;
export const idSchema = v.pipe(v.string(ID_WHAT), v.regex(/^[A-Za-z0-9_.:-]{1,64}$/, ID_WHAT));

const COORD = 'a coordinate in metres within ±10 m';
export const vec2Schema = v.looseObject({ x: num(COORD, -10, 10), y: num(COORD, -10, 10) }, 'a point {x, y} in metres');

const LEN = (what: string, max = 1) => num(`${what} in metres above 0 and at most ${max} m`, 0, max, { minExclusive: true });
const Z0 = v.pipe(
  v.number('an impedance in ohms above 0'), v.finite('an impedance in ohms above 0'),
  v.gtValue(0, 'an impedance in ohms above 0'), v.maxValue(10_000, 'an impedance in ohms of at most 10 kΩ'),
);

export const substrateSchema = v.looseObject({
  preset: v.optional(text('a preset name', L.name)),
  er: num('a relative permittivity εr from 1 to 100', 1, 100),
  h: num('a dielectric height in metres from 10 µm to 50 mm (1.6 mm is 0.0016)', 10e-6, 50e-3),
  t: num('a copper thickness in metres from 0 to 1 mm (35 µm is 0.000035)', 0, 1e-3),
  tanDelta: num('a loss tangent from 0 to 0.5', 0, 0.5),
  sigma: num('a conductivity in S/m above 0 and at most 1e9 (copper 5.8e7)', 0, 1e9, { minExclusive: true }),
  roughness: num('an RMS roughness in metres from 0 to 100 µm', 0, 100e-6),
  dielectricModel: v.optional(v.variant('kind', [
    v.looseObject({ kind: v.literal('constant') }),
    v.looseObject({ kind: v.literal('wideband-debye'), fMeasure: num('a measurement frequency in hertz from 1 kHz to 1 THz', 1e3, 1e12) }),
  ], 'a dielectric model: kind "constant" or "wideband-debye"')),
}, 'a substrate object');

const FREQ = 'a frequency in hertz from 1 MHz to 300 GHz (2.45 GHz is 2450000000)';
export const frequencySchema = v.looseObject({
  f0: num(FREQ, 1e6, 300e9),
  band: v.looseObject({ start: num(FREQ, 1e6, 300e9), stop: num(FREQ, 1e6, 300e9) }, 'a band {start, stop} in hertz'),
}, 'a frequency object {f0, band}');

const P = PROCESS_LIMITS;
/** Process parameters are bounded by what tools are (limits.ts PROCESS_LIMITS), not only by sanity. */
/** Isolation clearance of milling, format 13: bare laminate the isolation passes open beside copper, m. */
const CLEARANCE = num('an isolation clearance in metres above 0 and at most 5 mm (bare laminate beside the copper; 0.5 mm is 0.0005)', 0, 5e-3, { minExclusive: true });

export const processSchema = v.variant('kind', [
  v.looseObject({
    kind: v.literal('end-mill'),
    toolDiameter: num(`a tool diameter in metres from ${P.endMillDiameterMin * 1e3} mm to ${P.endMillDiameterMax * 1e3} mm (what end mills are; 0.4 mm is 0.0004)`, P.endMillDiameterMin, P.endMillDiameterMax),
    depth: num(`a cut depth in metres above 0 and at most ${P.endMillDepthMax * 1e3} mm`, 0, P.endMillDepthMax, { minExclusive: true }),
    clearance: v.optional(CLEARANCE),
  }),
  v.looseObject({
    kind: v.literal('v-bit'),
    tipWidth: num(`a tip width in metres from 0 to ${P.vBitTipMax * 1e3} mm (what V-bits are; 0.1 mm is 0.0001)`, 0, P.vBitTipMax),
    angleDeg: num(`an included angle in degrees from ${P.vBitAngleDegMin} to ${P.vBitAngleDegMax} (what V-bits are; 30 is usual)`, P.vBitAngleDegMin, P.vBitAngleDegMax),
    depth: num(`a cut depth in metres above 0 and at most ${P.vBitDepthMax * 1e3} mm (an isolation cut goes just through the copper; 0.05 mm is 0.00005)`, 0, P.vBitDepthMax, { minExclusive: true }),
    clearance: v.optional(CLEARANCE),
  }),
  v.looseObject({
    kind: v.literal('etch'),
    edgeBias: num(`an edge bias in metres within ±${P.etchBiasMax * 1e3} mm (about the copper thickness; 35 µm is 0.000035)`, -P.etchBiasMax, P.etchBiasMax),
    minFeature: num(`a smallest feature in metres from ${P.etchMinFeatureMin * 1e6} µm to ${P.etchMinFeatureMax * 1e3} mm`, P.etchMinFeatureMin, P.etchMinFeatureMax),
  }),
], 'a process: kind "end-mill", "v-bit" or "etch"');

/** How lines are sized for what is made (format 3): as the cross-section the process leaves, or as plain microstrip. */
export const asMadeSchema = v.looseObject({
  sizing: v.picklist(['as-made', 'microstrip'], 'a sizing "as-made" (the cross-section the process leaves) or "microstrip"'),
  sideCopper: v.picklist(['stitched', 'floating'], 'side copper "stitched" (vias to the ground plane) or "floating"'),
  cover: v.optional(v.looseObject({
    er: num('a cover permittivity from 1 to 20', 1, 20),
    thickness: num('a cover thickness in metres from 0 to 1 mm', 0, 1e-3),
  }, 'a cover {er, thickness}')),
  fencePitch: v.optional(num('a via-fence pitch in metres above 0 and up to 100 mm', 0, 0.1, { minExclusive: true })),
}, 'an as-made setting {sizing, sideCopper, cover?, fencePitch?}');

export const bendSchema = v.variant('style', [
  v.looseObject({ style: v.literal('miter-optimal') }),
  v.looseObject({ style: v.literal('miter'), fraction: num('a miter fraction from 0 to 0.95', 0, 0.95) }),
  v.looseObject({ style: v.literal('arc'), radius: LEN('a bend radius', 1) }),
  v.looseObject({ style: v.literal('square') }),
], 'a bend: style "miter-optimal", "miter", "arc" or "square"');

export const viaSchema = v.looseObject({
  drill: LEN('a drill diameter', 0.01),
  pad: LEN('a pad diameter', 0.02),
  count: int('a via count, a whole number from 1 to 64', 1, 64),
  plating: v.optional(num('a plating thickness in metres from 0 to 100 µm', 0, 100e-6)),
}, 'a via {drill, pad, count}');

const common = { id: idSchema, at: vec2Schema, label: v.optional(text(`a label of at most ${L.label} characters`, L.label)) };

export const nodeSchema = v.variant('kind', [
  v.looseObject({
    ...common, kind: v.literal('port'), zRef: Z0,
    heading: num('a heading in radians within ±2π (0 = +x, π/2 = +y), or an angle with its unit such as "90 deg"', -2 * Math.PI, 2 * Math.PI),
    launch: v.optional(v.looseObject({
      padWidth: LEN('a pad width', 0.05), padLength: LEN('a pad length', 0.05),
      pinDrill: v.optional(LEN('a pin drill diameter', 0.01)),
    }, 'a launch {padWidth, padLength}')),
  }),
  v.looseObject({ ...common, kind: v.literal('vertex'), bend: bendSchema }),
  v.looseObject({ ...common, kind: v.literal('junction') }),
  v.looseObject({ ...common, kind: v.literal('open') }),
  v.looseObject({ ...common, kind: v.literal('short'), via: viaSchema }),
], 'a node: an object whose kind is "port", "vertex", "junction", "open" or "short"');

export const widthSchema = v.variant('by', [
  v.looseObject({ by: v.literal('z0'), z0: Z0 }),
  v.looseObject({ by: v.literal('width'), width: LEN('a strip width', 0.1) }),
], 'a width: by "z0" with z0 in ohms, or by "width" with width in metres');

export const lengthSchema = v.variant('by', [
  v.looseObject({ by: v.literal('degrees'), deg: num('an electrical length in degrees above 0 and at most 3600', 0, 3600, { minExclusive: true }) }),
  v.looseObject({ by: v.literal('length'), length: LEN('a length', 10) }),
  v.looseObject({ by: v.literal('drawn') }),
], 'a length: by "degrees", "length" or "drawn"');

const segCommon = { id: idSchema, a: idSchema, b: idSchema, label: v.optional(text(`a label of at most ${L.label} characters`, L.label)) };

export const segmentSchema = v.variant('kind', [
  v.looseObject({ ...segCommon, kind: v.literal('line'), width: widthSchema, length: lengthSchema }),
  v.looseObject({
    ...segCommon, kind: v.literal('taper'),
    profile: v.picklist(['linear', 'klopfenstein'], 'a taper profile "linear" or "klopfenstein"'),
    from: widthSchema, to: widthSchema, length: lengthSchema,
    rippleDb: v.optional(num('a ripple in dB above 0 and at most 10', 0, 10, { minExclusive: true })),
  }),
  v.looseObject({
    ...segCommon, kind: v.literal('lumped'),
    part: v.picklist(['resistor', 'capacitor', 'inductor'], 'a part "resistor", "capacitor" or "inductor"'),
    value: num('a part value in SI units (Ω, F or H) above 0', 0, 1e12, { minExclusive: true }),
    size: v.picklist(['0402', '0603', '0805', '1206'], 'an SMD size "0402", "0603", "0805" or "1206"'),
    width: widthSchema,
  }),
  v.looseObject({
    ...segCommon, kind: v.literal('sparams'),
    touchstone: text(`Touchstone text of at most ${L.touchstone} characters`, L.touchstone, 1),
    name: text(`a name of 1 to ${L.name} characters`, L.name, 1),
    width: widthSchema,
    length: v.looseObject({ by: v.literal('length', 'by "length" (a measured block has a fixed length)'), length: LEN('a length', 10) }, 'a length {by: "length", length}'),
  }),
  v.looseObject({
    ...segCommon, kind: v.literal('coupled'), c: idSchema, d: idSchema,
    pair: v.variant('by', [
      v.looseObject({ by: v.literal('geometry'), width: LEN('a strip width', 0.1), gap: LEN('a gap between the strips', 0.1) }),
      v.looseObject({ by: v.literal('modes'), z0Even: Z0, z0Odd: Z0 }),
    ], 'a pair: by "geometry" with width and gap in metres, or by "modes" with z0Even and z0Odd in ohms'),
    length: v.variant('by', [
      v.looseObject({ by: v.literal('degrees'), deg: num('an electrical length in degrees above 0 and at most 3600', 0, 3600, { minExclusive: true }) }),
      v.looseObject({ by: v.literal('length'), length: LEN('a length', 10) }),
    ], 'a length: by "degrees" or "length" (a coupled pair is not drawn to length)'),
  }),
], 'a segment: an object whose kind is "line", "taper", "lumped", "sparams" or "coupled"');

const polygon = (what: string) => v.pipe(
  v.array(vec2Schema, `${what}: a list of points`),
  v.minLength(3, `${what} of at least 3 points`),
  v.maxLength(L.polygonPoints, `${what} of at most ${L.polygonPoints} points`),
);

export const areaSchema = v.looseObject({
  id: idSchema,
  kind: v.picklist(['keep-out', 'ground-copper'], 'an area kind "keep-out" or "ground-copper"'),
  polygon: polygon('a polygon'),
  clearance: v.optional(num('a clearance in metres from 0 to 50 mm', 0, 0.05)),
}, 'an area {id, kind, polygon}');

export const phaseGroupSchema = v.looseObject({
  id: idSchema,
  name: text(`a name of at most ${L.name} characters`, L.name),
  from: idSchema,
  to: v.pipe(v.array(idSchema, 'a list of port ids'), v.minLength(1, 'at least one port id'), v.maxLength(L.phaseGroupPorts, `at most ${L.phaseGroupPorts} port ids`)),
  toleranceDeg: num('a tolerance in degrees above 0 and at most 180', 0, 180, { minExclusive: true }),
  offsetsDeg: v.optional(v.pipe(v.array(num('a phase offset in degrees from −360 to 360', -360, 360), 'a list of phase offsets in degrees'), v.maxLength(L.phaseGroupPorts, `at most ${L.phaseGroupPorts} offsets`))),
}, 'a phase group {id, name, from, to, toleranceDeg, offsetsDeg?}');

const list = <T extends v.GenericSchema>(item: T, what: string, max: number) =>
  v.pipe(v.array(item, `a list of ${what}`), v.maxLength(max, `at most ${max} ${what}`));

/** How junctions are treated (format 4): published models, or ideal for comparison. */
export const junctionChoiceSchema = v.picklist(['modelled', 'ideal'], 'junctions "modelled" (published tee and step models) or "ideal" (arms joined at the centre)');

/** A placed block (format 8): kind, spec as checked by its block, placement, members and their fingerprints. */
export const placedBlockSchema = v.looseObject({
  id: idSchema,
  kind: v.pipe(v.string('a block kind'), v.regex(/^[a-z][a-z-]{0,31}$/, 'a block kind such as "corporate"')),
  spec: v.record(v.pipe(v.string(), v.maxLength(64)), v.union([
    v.number('a number'), v.string('text'), v.boolean('true or false'),
    v.pipe(v.array(v.number('a number')), v.maxLength(4096)),
    v.looseObject({ re: v.number('a number'), im: v.number('a number') }, 'a complex value {re, im}'),
  ], 'a block parameter value'), 'the block\'s parameters by name'),
  at: vec2Schema,
  members: v.pipe(v.array(idSchema, 'a list of record ids'), v.maxLength(L.nodes + L.segments, 'at most as many ids as the design holds')),
  made: v.record(idSchema, v.pipe(v.string('a fingerprint'), v.maxLength(16)), 'a fingerprint per member'),
}, 'a placed block {id, kind, spec, at, members, made}');

export function designSchema(version: number) {
  return v.looseObject({
    format: v.literal(DESIGN_FORMAT, `"${DESIGN_FORMAT}"`),
    version: v.literal(version, `format version ${version}`),
    app: v.optional(text(`an app name of at most ${L.name} characters`, L.name)),
    name: text(`a design name of at most ${L.name} characters`, L.name),
    notes: v.optional(text(`notes of at most ${L.notes} characters`, L.notes)),
    substrate: substrateSchema,
    frequency: frequencySchema,
    process: processSchema,
    asMade: v.optional(asMadeSchema),
    nodes: list(nodeSchema, 'nodes', L.nodes),
    segments: list(segmentSchema, 'segments', L.segments),
    board: v.nullable(v.looseObject({ outline: polygon('an outline') }, 'a board {outline} or null')),
    areas: list(areaSchema, 'areas', L.areas),
    phaseGroups: list(phaseGroupSchema, 'phase groups', L.phaseGroups),
    targets: targetsSchema,
    tolerances: tolerancesSchema,
    junctions: v.optional(junctionChoiceSchema),
    blocks: v.optional(list(placedBlockSchema, 'placed blocks', L.phaseGroups)),
    sweep: v.optional(sweepSpecSchema),
    measured: v.optional(measuredListSchema),
    proximityLimit: v.optional(proximityLimitSchema),
    view: v.optional(v.looseObject({
      grid: v.optional(LEN('a grid step', 0.1)),
    }, 'a view {grid}')),
  }, 'a design object');
}
