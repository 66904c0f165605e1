/**
 * Proximity: how much two runs of copper that are not joined couple when they lie side by side closer than a limit
 * (default 3h, the distance beyond which the single-line model is taken to hold, common practice).
 *
 * Each pair of straight runs that are parallel within 10°, overlap along their length and keep an edge-to-edge gap
 * below the limit is treated as a coupled pair over the overlap: even and odd modes from the Kirschning–Jansen 1984
 * static model with Getsinger 1973 dispersion at f0 (core/line coupled.ts), mean of the two widths, and the backward
 * (near-end) coupling of a matched coupled section of electrical length θ (D. M. Pozar, Microwave Engineering, 4th
 * ed., 2012, §7.6):  |V3/V1| = C·sin θ / √((1 − C²)·cos² θ + sin² θ).  An estimate: the runs' real terminations,
 * unequal widths and bends at their ends are not in it. Strips of one coupled pair (meant to couple) and runs that
 * share a node are left out.
 */
import type { Vec2 } from '../geometry/types.ts';
import { COUPLED_G_MIN, lineModels, pairAt } from '../line/index.ts';
import { InputError } from '../util/errors.ts';
import { DEFAULT_PROXIMITY_LIMIT, proximityLimitFor } from '../design/proximity-limit.ts';
import type { SizedDesign, SizedPiece } from './types.ts';

export interface ProximityHit {
  a: string;
  b: string;
  /** Edge-to-edge gap, m, and side-by-side length, m. */
  gap: number;
  length: number;
  /** Estimated backward coupling at f0, dB (negative). */
  couplingDb: number;
  /** Middle of the side-by-side stretch, m (where a face marks it). */
  at: Vec2;
}

const COS_PARALLEL = Math.cos((10 * Math.PI) / 180);

/** Runs closer than `limit` (m) and their estimated coupling at f0, strongest first. */
export function proximityHits(sized: SizedDesign, limit: number): ProximityHit[] {
  const sub = sized.doc.substrate;
  // Side-by-side runs estimated as coupled pairs of the models the design was sized with (line-model interface).
  const pairs = (sized.lineModels ?? lineModels).coupled();
  const runs = sized.pieces.filter((p) => (p.kind === 'line' || p.kind === 'taper' || p.kind === 'coupled') && Number.isFinite(p.width) && sized.centrelines[p.id]);
  const ends = (p: SizedPiece) => (p.kind === 'coupled' ? [p.a, p.b] : [p.a, p.b]);
  const wMax = Math.max(0, ...runs.map((p) => Math.max(p.width, p.widthB ?? 0)));
  const reach = limit + wMax;
  // Sort by the lower x of each run's box, then sweep: a near-linear neighbour search.
  const items = runs.map((p) => {
    const [p0, p1] = sized.centrelines[p.id] as [Vec2, Vec2];
    return { p, p0, p1, minX: Math.min(p0.x, p1.x), maxX: Math.max(p0.x, p1.x), minY: Math.min(p0.y, p1.y), maxY: Math.max(p0.y, p1.y) };
  }).sort((x, y) => x.minX - y.minX);
  const out: ProximityHit[] = [];
  for (let i = 0; i < items.length; i++) {
    const A = items[i]!;
    for (let j = i + 1; j < items.length && items[j]!.minX <= A.maxX + reach; j++) {
      const B = items[j]!;
      if (B.minY > A.maxY + reach || A.minY > B.maxY + reach) continue;
      const pa = A.p, pb = B.p;
      if (ends(pa).some((n) => ends(pb).includes(n))) continue;
      if (pa.pair && pb.pair && pa.pair.segment === pb.pair.segment) continue;
      const hit = sideBySide(A.p0, A.p1, B.p0, B.p1);
      if (!hit) continue;
      const wA = Math.min(pa.width, pa.widthB ?? pa.width), wB = Math.min(pb.width, pb.widthB ?? pb.width);
      const gap = hit.distance - (wA + wB) / 2;
      // A stretch shorter than the narrower strip is two corners passing, not runs side by side.
      if (!(gap > 0) || gap >= limit || !(hit.overlap >= Math.min(wA, wB))) continue;
      const w = (wA + wB) / 2;
      if (gap < COUPLED_G_MIN * sub.h) continue; // so close the copper check reports it as a gap the tool cannot cut
      let c: number, beta: number;
      try {
        const r = pairAt(pairs, sub, w, gap, sized.f0);
        c = r.couplingFactor; beta = (r.even.beta + r.odd.beta) / 2;
      } catch (e) {
        if (e instanceof InputError) continue; // outside what the coupled model accepts: nothing to estimate
        throw e;
      }
      const th = beta * hit.overlap, s = Math.sin(th), co = Math.cos(th);
      const k = (c * Math.abs(s)) / Math.sqrt((1 - c * c) * co * co + s * s);
      out.push({ a: pa.id, b: pb.id, gap, length: hit.overlap, couplingDb: k > 1e-20 ? 20 * Math.log10(k) : -400, at: hit.mid });
    }
  }
  return out.sort((x, y) => y.couplingDb - x.couplingDb);
}

/** Centreline distance, overlap length and overlap middle of two nearly parallel segments, or null. */
function sideBySide(p0: Vec2, p1: Vec2, q0: Vec2, q1: Vec2): { distance: number; overlap: number; mid: Vec2 } | null {
  const dx = p1.x - p0.x, dy = p1.y - p0.y, L = Math.hypot(dx, dy);
  const ex = q1.x - q0.x, ey = q1.y - q0.y, M = Math.hypot(ex, ey);
  if (!(L > 0) || !(M > 0)) return null;
  const ux = dx / L, uy = dy / L;
  if (Math.abs((ux * ex + uy * ey) / M) < COS_PARALLEL) return null;
  const t0 = (q0.x - p0.x) * ux + (q0.y - p0.y) * uy, t1 = (q1.x - p0.x) * ux + (q1.y - p0.y) * uy;
  const lo = Math.max(0, Math.min(t0, t1)), hi = Math.min(L, Math.max(t0, t1));
  if (!(hi > lo)) return null;
  const qm = { x: (q0.x + q1.x) / 2, y: (q0.y + q1.y) / 2 };
  const distance = Math.abs((qm.x - p0.x) * -uy + (qm.y - p0.y) * ux);
  const tm = (lo + hi) / 2;
  const side = (qm.x - p0.x) * -uy + (qm.y - p0.y) * ux;
  return { distance, overlap: hi - lo, mid: { x: p0.x + ux * tm - uy * side / 2, y: p0.y + uy * tm + ux * side / 2 } };
}

/** The default proximity limit in substrate heights (core/design/proximity-limit.ts keeps the setting). */
export const DEFAULT_PROXIMITY_LIMIT_H = DEFAULT_PROXIMITY_LIMIT.by === 'heights' ? DEFAULT_PROXIMITY_LIMIT.heights : 3;

/**
 * The user's proximity limit, as typed in any face, to metres: a multiple of the substrate height ("2.5h") or a
 * length with its unit ("1mm", "40mil"); "0" switches the check off. The design setting's own parser
 * (proximityLimitFor), so the app's field and the CLI read text alike.
 */
export function proximityLimitFrom(text: string, h: number, field = 'proximityLimit'): number {
  return proximityLimitFor({ substrate: { h } }, text, field);
}
