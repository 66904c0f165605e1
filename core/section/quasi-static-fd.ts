/**
 * Quasi-static (quasi-TEM) 2-D field solution of a line's cross-section by finite differences on a graded grid.
 *
 * Method (docs/cross-section-solver.md says why this one):
 * - The capacitance per length of the cross-section with its dielectrics (C) and in vacuum (Ca) from Laplace's
 *   equation ∇·(ε∇V) = 0, discretised by the five-point box scheme on a non-uniform grid graded towards every
 *   conductor edge (laplace.ts, grid.ts), solved by MIC(0)-preconditioned conjugate gradients.
 * - Then L = 1/(c0²·Ca), Z0 = 1/(c0·√(C·Ca)), εeff = C/Ca: the quasi-TEM relations (e.g. C. R. Paul, "Analysis of
 *   Multiconductor Transmission Lines", 2nd ed., Wiley 2008, ch. 5).
 * - Every result is solved on two nested grids (each cell halved) and extrapolated after L. F. Richardson, "The
 *   deferred approach to the limit", Phil. Trans. R. Soc. A 226 (1927), pp. 299–361, with the order ORDER observed
 *   in the convergence study; the change between the grids divided by 2^p − 1 is the error estimate each value
 *   carries.
 * - A cross-section symmetric about x = 0 is solved on its right half: a single strip and a pair's even mode with a
 *   magnetic wall there (zero normal field), a pair's odd mode with an electric wall (0 V).
 * - Floating side copper carries zero net charge: its potential is eliminated from the Maxwell capacitance matrix
 *   (one more solve per dielectric configuration; in a symmetric pair's odd mode it sits at 0 V by symmetry).
 * - Conductor loss by Wheeler's incremental-inductance rule: H. A. Wheeler, "Formulas for the skin effect",
 *   Proc. IRE 30 (1942), pp. 412–424: R = (Rs/μ0)·∂L/∂n with every conductor surface receding by dn; ∂L/∂n from a
 *   second vacuum solve of the receded cross-section on the same grid topology (grid.ts mapAxis).
 * Validity: quasi-TEM, i.e. cross-section small against the wavelength (the dispersion of the sized lines is a
 * separate model, see line-source.ts); lossless dielectrics and perfect conductors for C and L.
 */
import { C0 } from '../units/constants.ts';
import { warn, type Warning } from '../util/warnings.ts';
import { checkSection } from './check-spec.ts';
import { buildShapes, FLOATING, STRIP_1, STRIP_2, type Shapes } from './shapes.ts';
import { solveConfig, type Config, type ConfigSolve } from './config-solve.ts';
import { materialOf, type Material } from './materials.ts';
import { bisect, gradedAxis, mapAxis, type Key } from './grid.ts';
import { assemblyCache, prolong } from './laplace.ts';
import type { SectionMode, SectionModeName, SectionResult, SectionSpec, SolveOptions } from './types.ts';

/**
 * Order of convergence used for the extrapolation: observed 1.5–1.9 on the graded grids at the grid sizes used (the
 * convergence study in test/unit/section-convergence.test.ts measures it); the asymptotic orders (1 at a thin sheet's
 * edge, 4/3 at a right-angle corner) are reached only on far finer grids, where the edge cells dominate.
 */
export const ORDER = 1.6;

/**
 * Grid parameters at fineness 1 (tuned in test/unit/section-convergence.test.ts and bench/section.bench.ts): 1.15 times
 * finer than the first tuning (edge cells W/120 and W/40, interfaces h/4, growth 1.3, three cells across the copper),
 * so that every milled cross-section of the benchmark, cover included, carries an estimate of at most 0.2 % in Z0.
 */
export const GRID = { edgeDivisor: 138, edgeDivisorThick: 46, interfaceDivisor: 4.6, growth: 1.26, thicknessCells: 3.45 };

interface Level { x: Float64Array; y: Float64Array }

function isSymmetric(spec: SectionSpec): boolean {
  return !spec.side || (spec.side.sides ?? 'both') === 'both';
}

function configsOf(spec: SectionSpec, sym: boolean): Config[] {
  const floating = spec.side?.connection === 'floating';
  const pair = spec.spacing !== undefined;
  if (sym) {
    if (!pair) return [{ mode: 'single', ids: floating ? [STRIP_1, FLOATING] : [STRIP_1], wall: false, scale: 2 }];
    return [
      { mode: 'even', ids: floating ? [STRIP_2, FLOATING] : [STRIP_2], wall: false, scale: 1 },
      { mode: 'odd', ids: [STRIP_2], wall: true, scale: 1 },
    ];
  }
  return [{ mode: 'single', ids: [STRIP_1, ...(pair ? [STRIP_2] : []), ...(floating ? [FLOATING] : [])], wall: false, scale: 1 }];
}

/** Domain half-width and height, m: far enough that the truncation changes C by well under 0.05 %. */
function domain(spec: SectionSpec, s: Shapes): { X: number; Y: number } {
  const X = Math.max(30 * spec.h, 12 * s.halfExtent);
  const Y = spec.lid !== undefined ? spec.lid : X;
  return { X, Y };
}

/** The coarse grid of the cross-section (x from 0 when solved on its symmetric half). */
function coarseGrid(spec: SectionSpec, s: Shapes, fineness: number, X: number, Y: number, sym: boolean): Level {
  // A thin sheet's edge is the stronger singularity (field ∝ r^−1/2): finer cells there than at thick copper's
  // corners (r^−1/3), which also need a few cells across the thickness.
  let edge = s.feature / ((spec.t > 0 ? GRID.edgeDivisorThick : GRID.edgeDivisor) * fineness);
  if (spec.t > 0) edge = Math.min(edge, spec.t / (GRID.thicknessCells * fineness));
  const iface = Math.min(spec.h, s.feature) / (GRID.interfaceDivisor * fineness);
  const growth = 1 + (GRID.growth - 1) / fineness;
  const keysX: Key[] = s.keysX.map((k) => ({ at: k.at, size: k.edge ? edge : iface }));
  keysX.push({ at: X, size: X / 4 });
  if (sym) keysX.push({ at: 0, size: iface }); else keysX.push({ at: -X, size: X / 4 });
  const keysY: Key[] = s.keysY.map((k) => ({ at: k.at, size: k.edge ? edge : iface }));
  keysY.push({ at: Y, size: Number.isFinite(s.lid) ? iface : Y / 4 });
  return { x: Float64Array.from(gradedAxis(sym ? 0 : -X, X, keysX, growth)), y: Float64Array.from(gradedAxis(0, Y, keysY, growth)) };
}

/** Richardson extrapolation of a coarse/fine pair, and the estimated error of the result (relative). */
function richardson(coarse: number, fine: number, order: number): { value: number; rel: number } {
  const d = (fine - coarse) / (2 ** order - 1);
  const value = fine + d;
  return { value, rel: Math.abs(d / value) };
}

interface ModeValues { mode: SectionModeName; c: number[]; ca: number[] }

/**
 * Solves the cross-section `spec` (SI units). Throws InputError for a cross-section it cannot solve; warnings (e.g. an
 * error estimate above 0.5 %) travel in the result.
 * Example: solveSection({ er: 4.3, h: 1.6e-3, width: 3e-3, t: 35e-6 }).modes[0].z0 ≈ 50.
 */
export function solveSection(spec: SectionSpec, opts: SolveOptions = {}): SectionResult {
  checkSection(spec);
  const fineness = opts.fineness ?? 1;
  const levels = opts.levels ?? 2;
  const sym = isSymmetric(spec);
  const { X, Y } = domain(spec, buildShapes(spec));
  const shapes = buildShapes(spec, 0, X);
  const material = materialOf(spec, shapes, 1e-9 * spec.h);
  const grids: Level[] = [coarseGrid(spec, shapes, fineness, X, Y, sym)];
  for (let l = 1; l < levels; l++) grids.push({ x: bisect(grids[l - 1]!.x), y: bisect(grids[l - 1]!.y) });
  const configs = configsOf(spec, sym);
  const pairNoSym = !sym && spec.spacing !== undefined;

  let iterations = 0;
  const values: ModeValues[] = pairNoSym
    ? [{ mode: 'even', c: [], ca: [] }, { mode: 'odd', c: [], ca: [] }]
    : configs.map((c) => ({ mode: c.mode, c: [], ca: [] }));
  let potential: Float64Array | null = null;
  const vacuum: ConfigSolve[] = [];
  const caches = grids.map(() => assemblyCache());
  configs.forEach((cfg, ci) => {
    let prevD: ConfigSolve | null = null, prevA: ConfigSolve | null = null;
    grids.forEach((lv, l) => {
      const up = (prev: ConfigSolve | null) => (prev && l ? prev.sols.map((v) => prolong(v, grids[l - 1]!.x.length, grids[l - 1]!.y.length)) : []);
      // Floating copper: per conductor on the coarse grid, then in one solve at the potential found there.
      const d = solveConfig(lv.x, lv.y, shapes, material, cfg, up(prevD), prevD?.weights ?? [], pairNoSym, l ? prevD?.hint : undefined, caches[l]);
      // The vacuum solve starts from the dielectric one on the coarse grid (same conductors and potentials: a closer
      // start than zero), from its own coarse solution on the finer grid.
      const a = l
        ? solveConfig(lv.x, lv.y, shapes, null, cfg, up(prevA), prevA?.weights ?? [], pairNoSym, prevA?.hint, caches[l])
        : solveConfig(lv.x, lv.y, shapes, null, cfg, d.sols, d.weights, pairNoSym, undefined, caches[l]);
      iterations += d.iterations + a.iterations;
      prevD = d; prevA = a;
      if (pairNoSym) {
        values[0]!.c.push(d.pair!.even); values[0]!.ca.push(a.pair!.even); values[1]!.c.push(d.pair!.odd); values[1]!.ca.push(a.pair!.odd);
      } else {
        values[ci]!.c.push(d.c); values[ci]!.ca.push(a.c);
      }
      if (l === levels - 1) {
        vacuum.push(a);
        if (ci === 0 && opts.potential) {
          const v = new Float64Array(lv.x.length * lv.y.length);
          d.sols.forEach((sol, k) => { const wk = d.weights[k]!; if (wk) for (let i = 0; i < v.length; i++) v[i] += wk * sol[i]!; });
          potential = v;
        }
      }
    });
  });

  const warnings: Warning[] = [];
  const order = ORDER;
  const wantLoss = opts.loss ?? spec.t > 0;
  let dLdn = values.map(() => 0);
  if (wantLoss && spec.t > 0) dLdn = wheelerDerivative(spec, shapes, grids[grids.length - 1]!, configs, vacuum, X, pairNoSym);
  if (wantLoss && spec.t === 0) warnings.push(warn('validity', "Wheeler's incremental-inductance rule needs copper thickness above 0 (a thin sheet's edges have unbounded loss in it); no conductor loss is given.", { source: 'wheeler-1942', severity: 'info' }));

  const modes: SectionMode[] = values.map((mv, k) => {
    const n = mv.c.length;
    const c = richardson(mv.c[n - 2]!, mv.c[n - 1]!, order);
    const ca = richardson(mv.ca[n - 2]!, mv.ca[n - 1]!, order);
    const z0 = 1 / (C0 * Math.sqrt(c.value * ca.value));
    const epsEff = c.value / ca.value;
    // Z0 and εeff carry the Richardson estimate of their own level-to-level change (the errors of C and Ca come
    // from the same grid and partly cancel in the ratio).
    const z = (cc: number, aa: number) => 1 / (C0 * Math.sqrt(cc * aa));
    const ez = richardson(z(mv.c[n - 2]!, mv.ca[n - 2]!), z(mv.c[n - 1]!, mv.ca[n - 1]!), order);
    const ee = richardson(mv.c[n - 2]! / mv.ca[n - 2]!, mv.c[n - 1]! / mv.ca[n - 1]!, order);
    const error = { c: c.rel, cAir: ca.rel, z0: ez.rel, epsEff: ee.rel };
    if (error.z0 > 0.005) warnings.push(warn('validity', `the ${mv.mode} mode's Z0 is uncertain by about ${(error.z0 * 100).toFixed(2)} % on this grid; ask for a finer grid`, { source: 'section-solver' }));
    return { mode: mv.mode, c: c.value, cAir: ca.value, l: 1 / (C0 * C0 * ca.value), z0, epsEff, error, dLdn: dLdn[k]!, levels: { c: mv.c, cAir: mv.ca } };
  });
  if (pairNoSym) {
    warnings.push(warn('validity', 'side copper on one side only makes the pair unsymmetric: the even and odd values are those of the first strip, not exact modes', { source: 'section-solver', severity: 'info' }));
  }
  const fine = grids[grids.length - 1]!;
  const result: SectionResult = {
    spec, modes,
    stats: { nodesFine: fine.x.length * fine.y.length, iterations, order },
    warnings,
  };
  if (potential) result.potential = { x: fine.x, y: fine.y, v: potential };
  return result;
}

/**
 * ∂L/∂n per mode, H/m per m, on the finest grid: the vacuum solve of the cross-section with every conductor surface
 * receded by δ, on the same grid with its conductor key lines moved along (so the difference is smooth in δ).
 */
function wheelerDerivative(spec: SectionSpec, base: Shapes, lv: Level, configs: Config[], vacuum: ConfigSolve[], X: number, pairNoSym: boolean): number[] {
  const delta = Math.min(spec.t / 20, base.feature / 200);
  const rec = buildShapes(spec, delta, X);
  const lo = lv.x[0]!;
  const fromX: number[] = [lo, X], toX: number[] = [lo, X];
  base.bodies.forEach((b, k) => {
    const r = rec.bodies[k]!;
    for (const [p, q] of [[b.xl, r.xl], [b.xr, r.xr], [b.xl + b.t * b.sl, r.xl + r.t * r.sl], [b.xr - b.t * b.sr, r.xr - r.t * r.sr]] as const) {
      if (p > lo && p < X) { fromX.push(p); toX.push(q); }
    }
  });
  const y0 = base.bodies[0]!.y0;
  const top = lv.y[lv.y.length - 1]!;
  const fromY = [0, y0, y0 + spec.t, top], toY = [0, y0 + 2 * delta, y0 + spec.t, Number.isFinite(base.lid) ? top + 2 * delta : top];
  const x = mapAxis(lv.x, ...sortPairs(fromX, toX));
  const y = mapAxis(lv.y, ...sortPairs(fromY, toY));
  const L = (c: number) => 1 / (C0 * C0 * c);
  const out: number[] = [];
  configs.forEach((cfg, ci) => {
    const base0 = vacuum[ci]!;
    // The unreceded solution is a close start; floating copper in one solve at its unreceded potential.
    const m = solveConfig(x, y, rec, null, cfg, base0.sols, base0.weights, pairNoSym, base0.hint);
    if (pairNoSym) {
      out.push((L(m.pair!.even) - L(base0.pair!.even)) / delta, (L(m.pair!.odd) - L(base0.pair!.odd)) / delta);
    } else {
      out.push((L(m.c) - L(base0.c)) / delta);
    }
  });
  return out;
}

function sortPairs(from: number[], to: number[]): [number[], number[]] {
  const idx = from.map((_, i) => i).sort((a, b) => from[a]! - from[b]!);
  const f: number[] = [], t: number[] = [];
  for (const i of idx) {
    if (f.length && Math.abs(from[i]! - f[f.length - 1]!) < 1e-15) continue;
    f.push(from[i]!); t.push(to[i]!);
  }
  return [f, t];
}
