/**
 * Graded non-uniform grid lines along one axis: fine at the key coordinates (conductor edges, where the field is
 * singular, and material interfaces), growing geometrically away from them by at most `growth` per cell. Every key
 * coordinate is a grid line, so copper walls and dielectric interfaces fall on the grid.
 */

export interface Key { at: number; size: number }

/** Grid lines from lo to hi through every key; the local cell size is min over keys of size + (growth − 1)·distance. */
export function gradedAxis(lo: number, hi: number, keys: Key[], growth: number): number[] {
  const pts: Key[] = [];
  for (const k of keys) if (k.at > lo && k.at < hi) pts.push(k);
  pts.sort((a, b) => a.at - b.at);
  const span = hi - lo;
  const merged: Key[] = [];
  for (const k of pts) {
    const last = merged[merged.length - 1];
    if (last && k.at - last.at < 1e-9 * span) { last.size = Math.min(last.size, k.size); continue; }
    merged.push({ ...k });
  }
  const g = growth - 1;
  const bounds: Key[] = [{ at: lo, size: keys.find((k) => k.at <= lo)?.size ?? span / 4 }, ...merged, { at: hi, size: keys.find((k) => k.at >= hi)?.size ?? span / 4 }];
  // A key's cell is no larger than the grading from any other key allows (size + g·distance): the cells below are
  // graded between neighbouring keys only, so a coarse key (an interface, a cover's edge) a little way from a copper
  // edge would otherwise cut off the fine grading towards that edge on its far side.
  for (let pass = 0; pass < 2; pass++) {
    for (let b = 1; b < bounds.length; b++) bounds[b]!.size = Math.min(bounds[b]!.size, bounds[b - 1]!.size + g * (bounds[b]!.at - bounds[b - 1]!.at));
    for (let b = bounds.length - 2; b >= 0; b--) bounds[b]!.size = Math.min(bounds[b]!.size, bounds[b + 1]!.size + g * (bounds[b + 1]!.at - bounds[b]!.at));
  }
  const out: number[] = [lo];
  for (let b = 0; b + 1 < bounds.length; b++) {
    const a = bounds[b]!.at, c = bounds[b + 1]!.at, sa = bounds[b]!.size, sc = bounds[b + 1]!.size;
    // Cell size s(x) = min(sa + g·(x − a), sc + g·(c − x)); n cells equally spaced in the stretched coordinate
    // F(x) = ∫ dx/s(x), which has a closed form on each of the two linear pieces.
    const xm = Math.min(c, Math.max(a, (sc - sa + g * (a + c)) / (2 * g)));
    const fm = Math.log(1 + (g * (xm - a)) / sa) / g;
    const sm = sc + g * (c - xm);
    const total = fm + Math.log(sm / sc) / g;
    const n = Math.max(1, Math.ceil(total - 1e-9));
    for (let j = 1; j < n; j++) {
      const tau = (total * j) / n;
      out.push(tau <= fm ? a + (sa * (Math.exp(g * tau) - 1)) / g : c - (sm * Math.exp(-g * (tau - fm)) - sc) / g);
    }
    out.push(c);
  }
  return out;
}

/** Every cell split in two: the nested finer grid of a Richardson pair. */
export function bisect(nodes: ArrayLike<number>): Float64Array {
  const n = nodes.length;
  const out = new Float64Array(2 * n - 1);
  for (let i = 0; i < n; i++) {
    out[2 * i] = nodes[i]!;
    if (i + 1 < n) out[2 * i + 1] = (nodes[i]! + nodes[i + 1]!) / 2;
  }
  return out;
}

/**
 * The same grid with its key coordinates moved (from[k] → to[k], both increasing): lines between two keys keep their
 * relative place. Used for the receded cross-section of Wheeler's rule, so both solves share one grid topology and
 * their difference is smooth in the recession.
 */
export function mapAxis(nodes: ArrayLike<number>, from: number[], to: number[]): Float64Array {
  const out = new Float64Array(nodes.length);
  let k = 0;
  for (let i = 0; i < nodes.length; i++) {
    const x = nodes[i]!;
    while (k + 2 < from.length && x > from[k + 1]!) k++;
    const a = from[k]!, b = from[k + 1]!;
    const f = b > a ? (x - a) / (b - a) : 0;
    out[i] = to[k]! + f * (to[k + 1]! - to[k]!);
  }
  return out;
}
