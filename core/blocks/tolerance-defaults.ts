/**
 * The tolerances a design made from a block starts with, so its yield shows a spread from the first run instead
 * of σ = 0. They are defaults, not data about any one board: every value below is common practice for home-made
 * boards and, where it says so, a figure from memory of laminate and shop practice. The user edits them in the
 * yield panel (or the file's "tolerances" list); a design that already has tolerances keeps its own.
 *
 * Spreads are σ of a normal draw unless said; 'board' draws once per board (the laminate sheet, the etch bath, the
 * tool), 'piece' draws per piece (the local width error of each strip).
 */
import type { DesignDoc, FabProcess, SubstrateSpec, Tolerance } from '../design/types.ts';

export interface DefaultTolerances {
  tolerances: Tolerance[];
  /** One line per tolerance: what it is and why this spread (for the design's notes and the faces' messages). */
  reasons: string[];
}

const um = (x: number) => `${+(x * 1e6).toFixed(1)} µm`;
const r4 = (x: number) => Math.round(x * 1e4) / 1e4;
const r9 = (x: number) => Math.round(x * 1e9) / 1e9;

/** The process's width tolerance: the etch bath's undercut, or the cutter's width and depth. */
function processTolerances(p: FabProcess, t: number): DefaultTolerances {
  if (p.kind === 'etch') {
    // From memory: hand etching undercuts each edge by about the copper's thickness, and the amount varies from one
    // bath to the next by about half that; at least 10 µm.
    const s = r9(Math.max(10e-6, t / 2));
    return { tolerances: [{ quantity: 'etch-bias', distribution: 'normal', spread: s, scope: 'board' }], reasons: [`etch bias per edge σ ${um(s)} per board (from memory: hand-etched undercut varies by about half the copper thickness)`] };
  }
  // Common practice: a cutter's width is good to about ±20 µm (a V-bit's tip wears and is ground unevenly; an end
  // mill's diameter is ground to about ±10 µm and runs out in the collet by as much again). Uniform: a tool is
  // within its tolerance, not usually at its middle.
  const out: DefaultTolerances = { tolerances: [{ quantity: 'tool-width', distribution: 'uniform', spread: 20e-6, scope: 'board' }], reasons: [`tool width ±${um(20e-6)} uniform per board (common practice: tip wear, grinding and run-out)`] };
  if (p.kind === 'v-bit') {
    // From memory: a hand-levelled board on a small mill varies in cut depth by about ±20–30 µm across its face
    // (warp, spoil-board flatness), which a V-bit turns into width (2·tan(angle/2) per unit depth).
    out.tolerances.push({ quantity: 'mill-depth', distribution: 'normal', spread: 15e-6, scope: 'board' });
    out.reasons.push(`V-bit depth σ ${um(15e-6)} per board (from memory: board warp and levelling on small mills)`);
  }
  return out;
}

/** The default tolerances for a design on `substrate` made with `process`; the resistor line only when it has one. */
export function defaultTolerances(substrate: SubstrateSpec, process: FabProcess, opts: { resistors: boolean }): DefaultTolerances {
  const tolerances: Tolerance[] = [], reasons: string[] = [];
  const add = (t: Tolerance, why: string) => { if (t.spread > 0) { tolerances.push(t); reasons.push(why); } };
  // From memory: laminate makers state εr to about ±2 % (controlled-εr microwave laminates) to ±5 % or more (glass-
  // epoxy, which is not made for a given εr); σ = 2 % of εr sits between them.
  add({ quantity: 'er', distribution: 'normal', spread: r4(0.02 * substrate.er), scope: 'board' }, `laminate εr σ 2 % (${r4(0.02 * substrate.er)}) per board (from memory: stated εr tolerances of ±2 % to ±5 %)`);
  // From memory: thickness is stated to about ±5–10 % for boards this thin; σ = 3 % puts ±10 % near 3σ.
  add({ quantity: 'h', distribution: 'normal', spread: r9(0.03 * substrate.h), scope: 'board' }, `laminate height σ 3 % (${um(r9(0.03 * substrate.h))}) per board (from memory: stated thickness tolerances of ±5 % to ±10 %)`);
  // From memory: rolled or electro-deposited foil is made to about ±10 % of its weight; σ = 5 %.
  add({ quantity: 't', distribution: 'normal', spread: r9(0.05 * substrate.t), scope: 'board' }, `copper thickness σ 5 % (${um(r9(0.05 * substrate.t))}) per board (from memory: foil weight tolerance about ±10 %)`);
  const proc = processTolerances(process, substrate.t);
  tolerances.push(...proc.tolerances); reasons.push(...proc.reasons);
  // Common practice: edges of a hand-made strip wander by about a hundredth of a millimetre (film or tool path
  // resolution, ragged edges), independently from strip to strip.
  add({ quantity: 'width', distribution: 'normal', spread: 10e-6, scope: 'piece' }, `strip width error σ ${um(10e-6)} per piece (common practice: ragged edges and mask or path resolution)`);
  // Common practice: thick-film chip resistors are sold at ±1 %; uniform, as sorted parts are.
  if (opts.resistors) add({ quantity: 'resistor', distribution: 'uniform', spread: 0.01, scope: 'piece' }, 'resistor value ±1 % uniform per part (common practice: 1 % thick-film chips)');
  return { tolerances, reasons };
}

/** The defaults for a design, judged by its own laminate, process and parts. */
export function defaultTolerancesFor(doc: DesignDoc): DefaultTolerances {
  return defaultTolerances(doc.substrate, doc.process, { resistors: doc.segments.some((s) => s.kind === 'lumped' && s.part === 'resistor') });
}

/** The heading under which the reasons are written into the design's notes. */
export const DEFAULT_TOLERANCES_NOTE = 'Default tolerances (common practice for home-made boards, values from memory; edit them in the yield panel):';
