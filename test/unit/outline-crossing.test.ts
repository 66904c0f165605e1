/**
 * The self-crossing test of board and area outlines (issue 22, item 9): a sweep line that always runs, at any size.
 * Before, outlines above 2 000 points skipped the test and a crossing 5 000-point outline loaded. Checked against
 * the definition itself — every pair of non-neighbouring edges tested with exact integer orientation (plain
 * geometry: two segments meet when each one's ends are not strictly on the same side of the other's line) — on random
 * small rings full of collinear, touching and vertical edges, and on large rings with one crossing put anywhere.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { findSelfCrossing, parseDesign, segmentsCross, type Vec2 } from '../../core/index.ts';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

const SEED = process.env.FC_SEED ? Number(process.env.FC_SEED) : 20261205;

/** Exact on small integers: sign of the cross product. */
const side = (a: Vec2, b: Vec2, c: Vec2) => Math.sign((b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x));
const within = (a: Vec2, b: Vec2, p: Vec2) => Math.min(a.x, b.x) <= p.x && p.x <= Math.max(a.x, b.x) && Math.min(a.y, b.y) <= p.y && p.y <= Math.max(a.y, b.y);
function meet(a: Vec2, b: Vec2, c: Vec2, d: Vec2): boolean {
  const s1 = side(a, b, c), s2 = side(a, b, d), s3 = side(c, d, a), s4 = side(c, d, b);
  if (s1 * s2 < 0 && s3 * s4 < 0) return true;
  return (s1 === 0 && within(a, b, c)) || (s2 === 0 && within(a, b, d)) || (s3 === 0 && within(c, d, a)) || (s4 === 0 && within(c, d, b));
}
/** Every pair of edges that share no ring point. */
function bruteCrosses(r: Vec2[]): boolean {
  const n = r.length;
  for (let i = 0; i < n; i++) for (let j = i + 2; j < n; j++) {
    if (i === 0 && j === n - 1) continue;
    if (meet(r[i]!, r[(i + 1) % n]!, r[j]!, r[(j + 1) % n]!)) return true;
  }
  return false;
}
const noRepeats = (r: Vec2[]) => r.every((p, i) => { const q = r[(i + 1) % r.length]!; return p.x !== q.x || p.y !== q.y; });

/** A simple star-shaped ring of n points (radius varies with the angle, angles strictly increasing). */
function star(n: number, scale = 0.05): Vec2[] {
  return Array.from({ length: n }, (_, k) => {
    const a = (2 * Math.PI * k) / n;
    const r = scale * (1 + 0.3 * Math.sin(7 * a) + 0.05 * Math.cos(31 * a));
    return { x: r * Math.cos(a), y: r * Math.sin(a) };
  });
}

describe('outline crossing test (sweep line)', () => {
  it('agrees with the pairwise definition on random small rings on an integer grid (degenerate cases included)', () => {
    const pt = fc.record({ x: fc.integer({ min: 0, max: 4 }), y: fc.integer({ min: 0, max: 4 }) });
    fc.assert(fc.property(fc.array(pt, { minLength: 4, maxLength: 12 }), (ring) => {
      fc.pre(noRepeats(ring));
      const hit = findSelfCrossing(ring);
      expect(hit !== null).toBe(bruteCrosses(ring));
      if (hit) {
        const n = ring.length;
        expect(meet(ring[hit.i]!, ring[(hit.i + 1) % n]!, ring[hit.j]!, ring[(hit.j + 1) % n]!)).toBe(true);
      }
    }), { seed: SEED, numRuns: 4000 });
  });
  it('agrees on random rings with real coordinates (same edge test, every pair) and on axis-aligned ones', () => {
    // Real coordinates: the sweep against every pair tested with the same edge test, so only the sweep's bookkeeping
    // is compared (exactness of the edge test itself is the integer-grid case above).
    const pairwise = (r: Vec2[]) => {
      const n = r.length;
      for (let i = 0; i < n; i++) for (let j = i + 2; j < n; j++) {
        if (!(i === 0 && j === n - 1) && segmentsCross(r[i]!, r[(i + 1) % n]!, r[j]!, r[(j + 1) % n]!)) return true;
      }
      return false;
    };
    // On a 0.1 µm grid over ±0.1 m: real-valued, but no meaningless subnormal coordinates.
    const c = fc.integer({ min: -1_000_000, max: 1_000_000 }).map((k) => k * 1e-7);
    const real = fc.record({ x: c, y: c });
    fc.assert(fc.property(fc.array(real, { minLength: 4, maxLength: 30 }), (ring) => {
      fc.pre(noRepeats(ring));
      expect(findSelfCrossing(ring) !== null).toBe(pairwise(ring));
    }), { seed: SEED, numRuns: 1000 });
    // Staircases: many vertical and horizontal edges, touching at corners when folded back.
    const step = fc.constantFrom([1, 0], [0, 1], [-1, 0], [0, -1], [2, 0], [0, 2]);
    fc.assert(fc.property(fc.array(step, { minLength: 3, maxLength: 16 }), (steps) => {
      const ring: Vec2[] = [{ x: 0, y: 0 }];
      for (const [dx, dy] of steps) ring.push({ x: ring.at(-1)!.x + dx!, y: ring.at(-1)!.y + dy! });
      fc.pre(ring.length >= 4 && noRepeats(ring));
      expect(findSelfCrossing(ring) !== null).toBe(bruteCrosses(ring));
    }), { seed: SEED, numRuns: 2000 });
  });
  it('large rings: a simple 10 000-point outline passes; one swapped pair of points anywhere is found', () => {
    const r = star(10_000);
    expect(findSelfCrossing(r)).toBeNull();
    for (const k of [3, 2_500, 7_777, 9_997]) {
      const bad = r.slice();
      [bad[k], bad[k + 1]] = [bad[k + 1]!, bad[k]!];
      const hit = findSelfCrossing(bad);
      expect(hit).not.toBeNull();
      expect(Math.abs(hit!.i - k)).toBeLessThanOrEqual(2);
    }
  });
  it('the loader refuses a crossing board outline of 5 000 points (the old test skipped it above 2 000)', () => {
    const doc = JSON.parse(readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', 'open-stub-match.json'), 'utf8'));
    const ring = star(5_000).map((p) => ({ x: p.x + 0.018, y: p.y }));
    [ring[4_000], ring[4_001]] = [ring[4_001]!, ring[4_000]!];
    doc.board = { outline: ring };
    const r = parseDesign(JSON.stringify(doc));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toMatch(/^board\.outline: expected an outline that does not cross itself, found edges 399\d–\d+ and 40\d\d–\d+ crossing/);
    doc.board = { outline: star(5_000).map((p) => ({ x: p.x + 0.018, y: p.y })) };
    expect(parseDesign(JSON.stringify(doc)).ok).toBe(true);
  });
});
