/**
 * One solve family (a mode's excited conductors, its symmetry wall and scale) on one grid: the Maxwell capacitance
 * matrix among its conductors from one solution per conductor, or — where the floating side copper's potential is
 * already known closely from a coarser grid — one solution with the floating copper held at that potential.
 *
 * Why one solve suffices for floating copper: with the strip at 1 V and the floating copper at w, the energy form is
 * E(w) = K_ss + 2·w·K_sf + w²·K_ff, and the zero-net-charge potential minimises it, giving the mode's capacitance
 * C = K_ss − K_sf²/K_ff = E(w) − Q_f²/K_ff, where Q_f = K_sf + w·K_ff is the floating copper's net charge in that
 * one solution. The identity is exact for any w; only K_ff is taken from the coarser grid, and it enters through
 * Q_f², which is small when w is close (the Schur complement of the Maxwell matrix; e.g. C. R. Paul, "Analysis of
 * Multiconductor Transmission Lines", 2nd ed., Wiley 2008, ch. 5, for eliminating a floating conductor).
 */
import { EPS0 } from '../units/constants.ts';
import { FLOATING } from './shapes.ts';
import type { Material } from './materials.ts';
import type { Shapes } from './shapes.ts';
import { assemble, charges, energy, factor, solve, type AssemblyCache } from './laplace.ts';
import type { SectionModeName } from './types.ts';

/** One solve family: which conductors are excited, where the symmetry plane is, and the factor to the mode's C. */
export interface Config { mode: SectionModeName; ids: number[]; wall: boolean; scale: number }

/** The floating copper's potential (V, strip at 1 V) and its self capacitance K_ff (F/m), from a coarser grid. */
export interface FloatHint { volts: number; kff: number }

export interface ConfigSolve {
  /** The mode's capacitance, F/m (with the config's scale); for an unsymmetric pair, strip 1's even and odd values. */
  c: number;
  pair?: { even: number; odd: number };
  /** The solutions, and their weights in the mode's potential (strip at 1 V, floating copper at zero net charge). */
  sols: Float64Array[];
  weights: number[];
  /** The Maxwell matrix (F/m) among cfg.ids, when solved per conductor. */
  K?: number[][];
  /** The floating copper's potential and self capacitance for the next grid, when the config has floating copper. */
  hint?: FloatHint;
  iterations: number;
}

/** The mode's capacitance from its Maxwell matrix (floating copper eliminated), and the weights of the solutions
 * that make up its potential. */
export function modal(K: number[][], cfg: Config): { c: number; weights: number[] } {
  const ids = cfg.ids;
  const fi = ids.indexOf(FLOATING);
  const strips = ids.map((id, k) => (id === FLOATING ? -1 : k)).filter((k) => k >= 0);
  const weights = ids.map(() => 0);
  let u: number[];
  if (cfg.mode !== 'single' || strips.length === 1) u = [1];
  else u = [1, 0]; // unsymmetric pair: strip 1 at 1 V, strip 2 at 0 (see pairFromMatrix)
  strips.forEach((k, n) => { weights[k] = u[n] ?? 0; });
  if (fi >= 0) weights[fi] = -strips.reduce((acc, k) => acc + K[fi]![k]! * weights[k]!, 0) / K[fi]![fi]!;
  let q = 0;
  for (let b = 0; b < ids.length; b++) q += K[strips[0]!]![b]! * weights[b]!;
  return { c: cfg.scale * q, weights };
}

/** Unsymmetric cross-sections with two strips: even and odd capacitances of strip 1 from the reduced matrix. */
export function pairFromMatrix(K: number[][], ids: number[]): { even: number; odd: number } {
  const fi = ids.indexOf(FLOATING);
  const red = (a: number, b: number) => K[a]![b]! - (fi >= 0 ? (K[a]![fi]! * K[fi]![b]!) / K[fi]![fi]! : 0);
  const c11 = red(0, 0), c12 = red(0, 1);
  return { even: c11 + c12, odd: c11 - c12 };
}

/** Whether the config can take the one-solve form for floating copper (one strip excited, plus the floating copper). */
export function floatsAlone(cfg: Config): boolean {
  return cfg.ids.length === 2 && cfg.ids[1] === FLOATING;
}

/**
 * Solves `cfg` on the grid x × y. `guess` is the starting potential per solution of the previous grid's kind (already
 * on this grid); with `hint` (only for floatsAlone configs) one solution with the floating copper at hint.volts.
 */
export function solveConfig(x: Float64Array, y: Float64Array, shapes: Shapes, material: Material | null, cfg: Config, guess: Float64Array[], weights: number[], pairNoSym: boolean, hint?: FloatHint, cache?: AssemblyCache): ConfigSolve {
  const g = assemble(x, y, shapes, material, cfg.wall, cache);
  const f = factor(g);
  if (hint && floatsAlone(cfg)) {
    const volts = new Float64Array(4);
    volts[cfg.ids[0]!] = 1;
    volts[FLOATING] = hint.volts;
    // The previous grid's mode potential is the closest start.
    let start: Float64Array | undefined;
    if (guess.length === 1) start = guess[0];
    else if (guess.length > 1) {
      start = new Float64Array(guess[0]!.length);
      guess.forEach((s, k) => { const wk = weights[k] ?? 0; if (wk) for (let i = 0; i < s.length; i++) start![i] += wk * s[i]!; });
    }
    const { v, iterations } = solve(f, volts, start);
    const e = energy(g, v, v) * EPS0;
    const q = charges(g, v, 4)[FLOATING]! * EPS0;
    return {
      c: cfg.scale * (e - (q * q) / hint.kff), sols: [v], weights: [1], iterations,
      // Newton's step on the quadratic E(w): the floating copper's potential for a still finer grid.
      hint: { volts: hint.volts - q / hint.kff, kff: hint.kff },
    };
  }
  const ids = cfg.ids;
  const K: number[][] = ids.map(() => ids.map(() => 0));
  const sols: Float64Array[] = [];
  let iterations = 0;
  ids.forEach((id, a) => {
    const volts = new Float64Array(4);
    volts[id] = 1;
    const { v, iterations: it } = solve(f, volts, guess.length === ids.length ? guess[a] : undefined);
    iterations += it;
    sols.push(v);
  });
  // The energy form, not the charge sum: second-order in the iteration error (laplace.ts energy), symmetric as is.
  for (let a = 0; a < ids.length; a++) for (let b = a; b < ids.length; b++) {
    const k = energy(g, sols[a]!, sols[b]!) * EPS0; K[a]![b] = k; K[b]![a] = k;
  }
  if (pairNoSym) {
    const pair = pairFromMatrix(K, ids);
    const fi = ids.indexOf(FLOATING);
    const w = [1, 1, ...(fi >= 0 ? [-(K[fi]![0]! + K[fi]![1]!) / K[fi]![fi]!] : [])];
    return { c: pair.even, pair, sols, weights: w, K, iterations };
  }
  const m = modal(K, cfg);
  const fi = ids.indexOf(FLOATING);
  const out: ConfigSolve = { c: m.c, sols, weights: m.weights, K, iterations };
  if (fi >= 0) out.hint = { volts: m.weights[fi]!, kff: K[fi]![fi]! };
  return out;
}
