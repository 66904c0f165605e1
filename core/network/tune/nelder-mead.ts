/**
 * Gradient-free minimisation in a box: the downhill simplex of J. A. Nelder and R. Mead, "A simplex method for
 * function minimization", The Computer Journal 7(4), 308–313, 1965, with the usual coefficients (reflection 1,
 * expansion 2, contraction ½, shrink ½; as in J. C. Lagarias et al., "Convergence properties of the Nelder–Mead
 * simplex method in low dimensions", SIAM J. Optim. 9(1), 112–147, 1998). Points are in the unit box [0, 1]^n and
 * every trial point is clamped into it (the variables' ranges). Deterministic: the first simplex is the start plus
 * steps along each axis whose sizes and signs come from a seeded generator.
 */
export interface SimplexOptions {
  /** Largest number of cost evaluations. */
  maxEvaluations: number;
  /** Stop when the spread of cost over the simplex and its size both fall below these. */
  costTolerance: number;
  sizeTolerance: number;
  /** First step along each axis, as a fraction of the box (default 0.1). */
  step?: number;
  seed: number;
  /** Called after each iteration; returning false stops the search (cancel). Awaited, so a host can yield. */
  onIteration?: (best: number, evaluations: number) => Promise<boolean> | boolean;
}

export interface SimplexResult { x: number[]; cost: number; evaluations: number; stopped: 'converged' | 'evaluations' | 'cancelled' }

/**
 * A small seeded generator: the 32-bit linear congruential generator with the constants of W. H. Press et al.,
 * Numerical Recipes in C, 2nd ed., 1992, §7.1 ("quick and dirty", a = 1664525, c = 1013904223). Enough for the
 * first simplex's step sizes; nothing statistical depends on it.
 */
export function seededUniform(seed: number): () => number {
  let s = (seed >>> 0) ^ 0x9e3779b9;
  return () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296; };
}

const clamp = (x: number) => (x < 0 ? 0 : x > 1 ? 1 : x);

export async function minimiseInBox(cost: (x: number[]) => number, start: readonly number[], opts: SimplexOptions): Promise<SimplexResult> {
  const n = start.length;
  const rnd = seededUniform(opts.seed);
  const step = opts.step ?? 0.1;
  let evaluations = 0;
  const f = (x: number[]) => { evaluations++; return cost(x); };
  const pts: number[][] = [start.map(clamp)];
  for (let i = 0; i < n; i++) {
    const p = [...pts[0]!];
    const size = step * (0.75 + 0.5 * rnd());
    // Step inward when the start sits at the upper edge of the box, else in a seeded direction.
    const sign = p[i]! + size > 1 ? -1 : p[i]! - size < 0 ? 1 : rnd() < 0.5 ? -1 : 1;
    p[i] = clamp(p[i]! + sign * size);
    pts.push(p);
  }
  let vals = pts.map(f);
  const order = () => {
    const idx = vals.map((_, i) => i).sort((a, b) => vals[a]! - vals[b]! || a - b);
    const p2 = idx.map((i) => pts[i]!), v2 = idx.map((i) => vals[i]!);
    pts.splice(0, pts.length, ...p2); vals = v2;
  };
  const along = (c: number[], d: number[], t: number) => c.map((ci, k) => clamp(ci + t * (d[k]! - ci)));
  let stopped: SimplexResult['stopped'] = 'evaluations';
  while (evaluations < opts.maxEvaluations) {
    order();
    const spread = vals[n]! - vals[0]!;
    let size = 0;
    for (let i = 1; i <= n; i++) for (let k = 0; k < n; k++) size = Math.max(size, Math.abs(pts[i]![k]! - pts[0]![k]!));
    if (opts.onIteration && !(await opts.onIteration(vals[0]!, evaluations))) { stopped = 'cancelled'; break; }
    if ((spread <= opts.costTolerance && size <= opts.sizeTolerance) || vals[0] === 0) { stopped = 'converged'; break; }
    const centroid = new Array<number>(n).fill(0);
    for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) centroid[k]! += pts[i]![k]! / n;
    const worst = pts[n]!;
    const xr = along(centroid, worst, -1), fr = f(xr);
    if (fr < vals[0]!) {
      const xe = along(centroid, worst, -2), fe = f(xe);
      if (fe < fr) { pts[n] = xe; vals[n] = fe; } else { pts[n] = xr; vals[n] = fr; }
    } else if (fr < vals[n - 1]!) {
      pts[n] = xr; vals[n] = fr;
    } else {
      const outside = fr < vals[n]!;
      const xc = along(centroid, worst, outside ? -0.5 : 0.5), fc = f(xc);
      if (fc < (outside ? fr : vals[n]!)) { pts[n] = xc; vals[n] = fc; } else {
        for (let i = 1; i <= n; i++) { pts[i] = along(pts[0]!, pts[i]!, 0.5); vals[i] = f(pts[i]!); }
      }
    }
  }
  order();
  return { x: pts[0]!, cost: vals[0]!, evaluations, stopped };
}
