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
