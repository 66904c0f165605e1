/**
 * Targets and tolerances of a design (format 3): what the response must meet, and how far the made board may stray
 * from the drawing. One target schema serves the response panel's pass/fail, `build`, tuning goals and the yield
 * masks, so a requirement is written once. SI units: Hz for bands, dB, degrees and ns for limits (the unit each figure
 * is read in), metres for lengths; εr and tanδ have no unit; part tolerances are fractions (0.01 = 1 %).
 * The figure and quantity lists live here (the schemas' picklists read them); the record types are inferred from
 * the schemas in targets-schema.ts.
 */
import type { Out } from './infer.ts';
import type { targetSchema, toleranceSchema } from './targets-schema.ts';

/**
 * What a target measures over its band (power-wave S-parameters, dB = 20·log10|S|):
 * - 'return-loss': −|S_pp| dB at `ports[0]` (15 dB of return loss means |S_pp| ≤ −15 dB);
 * - 'insertion-loss': −|S_to,from| dB, `ports` = [from, to];
 * - 'transmission': |S_to,from| dB, `ports` = [from, to] (a divider's −3 dB ± a little);
 * - 'transmission-phase': ∠S_to,from in degrees, `ports` = [from, to], read within ±180° of the limits' middle;
 * - 'isolation': −|S_ab| dB, `ports` = [a, b];
 * - 'amplitude-balance': largest minus smallest |S_out,from| dB among the outputs of phase group `group`;
 * - 'phase-balance': the largest |∠S_k − ∠S_first + (offset_k − offset_first)| among the group's outputs, degrees
 *   (a group's offset is extra electrical length, so it lowers ∠S by that much);
 * - 'phase-spread': largest minus smallest of (∠S_k + offset_k) among the group's outputs, degrees;
 * - 'group-delay-flatness': how far the group delay of S_to,from (τg = −dφ/dω) rises above its least value in the
 *   band, ns, `ports` = [from, to]; its worst value is the band's peak-to-peak variation (limit it with `max`).
 */
export type TargetFigure =
  | 'return-loss' | 'insertion-loss' | 'transmission' | 'transmission-phase' | 'isolation'
  | 'amplitude-balance' | 'phase-balance' | 'phase-spread' | 'group-delay-flatness';

export const TARGET_FIGURES: readonly TargetFigure[] = [
  'return-loss', 'insertion-loss', 'transmission', 'transmission-phase', 'isolation', 'amplitude-balance', 'phase-balance', 'phase-spread',
  'group-delay-flatness',
];

/** Figures that take `ports` (how many) and those that take a phase `group`. */
export const FIGURE_PORTS: Readonly<Record<TargetFigure, number>> = {
  'return-loss': 1, 'insertion-loss': 2, transmission: 2, 'transmission-phase': 2, isolation: 2,
  'amplitude-balance': 0, 'phase-balance': 0, 'phase-spread': 0, 'group-delay-flatness': 2,
};

/**
 * A requirement on the response: `id`, an optional short `name` for lists and plots, the `figure`, `ports` (port
 * node ids, as FIGURE_PORTS says; absent for group figures) or `group` (a phase group's id, group figures only),
 * `band` in Hz (start = stop asks for one frequency) and `limit`.
 */
export type Target = Out<typeof targetSchema>;

/** A limit: the figure must stay at or above `min` and at or below `max` (either or both) at every point of the band. */
export type TargetLimit = Target['limit'];

/**
 * What may vary between the drawing and a made board:
 * - laminate: 'er' (relative permittivity), 'h' (dielectric height, m), 'tanDelta', 't' (copper thickness, m);
 * - process: 'etch-bias' (extra undercut per edge, m; an etched board is ΔW = −2·δ narrower), 'tool-width' (V-bit tip
 *   or end-mill diameter, m; a wider cut leaves the copper ΔW = −δ narrower), 'mill-depth' (V-bit depth, m; the cut
 *   widens by 2·δ·tan(angle/2), so ΔW = −2·δ·tan(angle/2); an end mill's straight flutes make depth no matter to the
 *   width);
 * - 'width': any other error of a strip's width, m (ΔW = +δ);
 * - parts: 'resistor', 'capacitor', 'inductor' — the part's value is v·(1 + δ), δ a fraction.
 */
export type ToleranceQuantity =
  | 'er' | 'h' | 'tanDelta' | 't'
  | 'etch-bias' | 'tool-width' | 'mill-depth' | 'width'
  | 'resistor' | 'capacitor' | 'inductor';

export const TOLERANCE_QUANTITIES: readonly ToleranceQuantity[] = [
  'er', 'h', 'tanDelta', 't', 'etch-bias', 'tool-width', 'mill-depth', 'width', 'resistor', 'capacitor', 'inductor',
];

/**
 * One tolerance: its `quantity`; `distribution` 'normal' (δ ~ N(0, spread²)) or 'uniform' (δ uniform in
 * [−spread, +spread]); `spread`, σ or the half-width in the quantity's unit (m, none, or a fraction for parts);
 * `scope` 'board' (one draw shared by the whole board) or 'piece' (an independent draw for every piece or part).
 */
export type Tolerance = Out<typeof toleranceSchema>;

/** Words for each quantity, for tables and messages. */
export const TOLERANCE_WORDS: Readonly<Record<ToleranceQuantity, { name: string; unit: 'm' | '' | 'fraction' }>> = {
  er: { name: 'laminate εr', unit: '' },
  h: { name: 'laminate height h', unit: 'm' },
  tanDelta: { name: 'laminate tanδ', unit: '' },
  t: { name: 'copper thickness t', unit: 'm' },
  'etch-bias': { name: 'etch bias per edge', unit: 'm' },
  'tool-width': { name: 'tool / V-bit tip width', unit: 'm' },
  'mill-depth': { name: 'milling depth', unit: 'm' },
  width: { name: 'strip width error', unit: 'm' },
  resistor: { name: 'resistor value', unit: 'fraction' },
  capacitor: { name: 'capacitor value', unit: 'fraction' },
  inductor: { name: 'inductor value', unit: 'fraction' },
};

/** The unit a target's figure and limit are read in. */
export type FigureUnit = 'dB' | '°' | 'ns';

/** How a value in that unit is written after its number ("15 dB", "2°", "0.1 ns"). */
export const FIGURE_UNIT_SUFFIX: Readonly<Record<FigureUnit, string>> = { dB: ' dB', '°': '°', ns: ' ns' };

export const FIGURE_WORDS: Readonly<Record<TargetFigure, { name: string; unit: FigureUnit }>> = {
  'return-loss': { name: 'return loss', unit: 'dB' },
  'insertion-loss': { name: 'insertion loss', unit: 'dB' },
  transmission: { name: 'transmission', unit: 'dB' },
  'transmission-phase': { name: 'transmission phase', unit: '°' },
  isolation: { name: 'isolation', unit: 'dB' },
  'amplitude-balance': { name: 'amplitude balance', unit: 'dB' },
  'phase-balance': { name: 'phase balance', unit: '°' },
  'phase-spread': { name: 'phase spread', unit: '°' },
  'group-delay-flatness': { name: 'group-delay flatness', unit: 'ns' },
};
