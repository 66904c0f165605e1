/**
 * The elimination order and symbolic factorisation. Known results of sparse elimination (e.g. A. George and
 * J. W. H. Liu, Computer Solution of Large Sparse Positive Definite Systems, Prentice-Hall 1981, ch. 5 — from
 * memory): eliminating a tree from its leaves makes no fill; a cycle of n nodes fills n − 3 entries in each triangle.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { symbolicFactor } from '../../core/network/ordering.ts';

describe('minimum-degree symbolic factorisation', () => {
  it('a random tree factors with no fill: nnz = n + 2·(n − 1)', () => {
    fc.assert(fc.property(fc.array(fc.nat(), { minLength: 1, maxLength: 300 }), (parents) => {
      const n = parents.length + 1;
      const adj: number[][] = Array.from({ length: n }, () => []);
      parents.forEach((p, i) => { const a = i + 1, b = p % (i + 1); adj[a].push(b); adj[b].push(a); });
      expect(symbolicFactor(n, adj).nnz).toBe(n + 2 * (n - 1));
    }), { seed: 11, numRuns: 200 });
  });
  it('a ring of n nodes fills n − 3 entries on each side of the diagonal', () => {
    for (const n of [4, 5, 9, 40]) {
      const adj = Array.from({ length: n }, (_, i) => [(i + 1) % n, (i + n - 1) % n]);
      expect(symbolicFactor(n, adj).nnz).toBe(n + 2 * n + 2 * (n - 3));
    }
  });
  it('the order is a permutation and position is its inverse', () => {
    const adj = [[1, 2], [0, 2, 3], [0, 1], [1]];
    const s = symbolicFactor(4, adj);
    expect([...s.order].sort()).toEqual([0, 1, 2, 3]);
    for (let k = 0; k < 4; k++) expect(s.position[s.order[k]]).toBe(k);
  });
});

describe('forward substitution limited to the columns a row can hold', () => {
  // Subtracting exact zeros changes nothing (IEEE 754: x − 0 = x, and +0 − (±0) = +0), so skipping them must give
  // the same bits: solve each network twice, once with every column in every row, and compare bit for bit.
  const everyColumn = (n: number, m: number) => { const r = new Int32Array(2 * n); for (let k = 0; k < n; k++) r[2 * k + 1] = m; return r; };
  it('gives bit-identical S on every example design and a 64-output feed, and touches fewer columns', async () => {
    const { readdirSync, readFileSync } = await import('node:fs');
    const { join } = await import('node:path');
    const { parseDesign } = await import('../../core/design/index.ts');
    const { sizeDesign, corporateFeed } = await import('../../core/layout/index.ts');
    const { netlistFromSized, compileNetwork, solveAt, designSweepSettings, sweepFrequencies } = await import('../../core/network/index.ts');
    const dir = join(import.meta.dirname, '..', '..', 'assets', 'examples');
    const docs = readdirSync(dir).filter((f) => f.endsWith('.json')).map((f) => {
      const p = parseDesign(readFileSync(join(dir, f), 'utf8'));
      if (!p.ok) throw new Error(f);
      return p.doc;
    });
    docs.push(corporateFeed({ outputs: 64, pitch: 12e-3 }));
    let limited = 0, all = 0;
    for (const doc of docs) {
      const cn = compileNetwork(netlistFromSized(sizeDesign(doc)));
      const P = cn.ports.length, n = cn.symbolic.n;
      const plain = { ...cn, portColumns: everyColumn(n, P), scratch: new Float64Array(cn.scratch.length) };
      for (let k = 0; k < n; k++) { limited += Math.max(0, cn.portColumns[2 * k + 1]! - cn.portColumns[2 * k]!); all += P; }
      for (const f of sweepFrequencies({ ...designSweepSettings(doc), points: 9 })) {
        const a = solveAt(cn, f).s, b = solveAt(plain, f).s;
        expect(new Uint8Array(a.buffer)).toEqual(new Uint8Array(b.buffer));
      }
    }
    expect(limited).toBeLessThan(all);
  }, 60_000);
  it('a column never reaches a row outside its range (random trees, one right-hand side per leaf)', async () => {
    const { forwardColumns } = await import('../../core/network/ordering.ts');
    fc.assert(fc.property(fc.array(fc.nat(), { minLength: 1, maxLength: 120 }), (parents) => {
      const n = parents.length + 1;
      const adj: number[][] = Array.from({ length: n }, () => []);
      parents.forEach((p, i) => { const a = i + 1, b = p % (i + 1); adj[a].push(b); adj[b].push(a); });
      const s = symbolicFactor(n, adj);
      const rows = adj.map((a, i) => (a.length === 1 ? s.position[i]! : -1)).filter((k) => k >= 0);
      const cols = forwardColumns(s, rows);
      // Which columns reach each row, by following the later-neighbour lists exactly.
      const reach = Array.from({ length: n }, () => new Set<number>());
      rows.forEach((k, j) => reach[k]!.add(j));
      for (let k = 0; k < n; k++) for (let t = s.upStart[k]!; t < s.upStart[k + 1]!; t++) for (const j of reach[k]!) reach[s.upper[t]!]!.add(j);
      reach.forEach((set, k) => { for (const j of set) { expect(j).toBeGreaterThanOrEqual(cols[2 * k]!); expect(j).toBeLessThan(cols[2 * k + 1]!); } });
    }), { seed: 5, numRuns: 100 });
  });
});
