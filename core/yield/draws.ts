/**
 * Draws of the tolerances, sample after sample. Each tolerance has its own generator stream (prng.ts); within it the
 * draws come in sample order, and within a sample in piece order (the design's segment order) for a per-piece
 * tolerance, one draw for a board-wide one. A normal tolerance gives δ = σ·Φ⁻¹(u), a uniform one δ = a·(2u − 1).
 */
import type { Tolerance } from '../design/types.ts';
import { Xoshiro128ss, streamId } from './prng.ts';
import { normalQuantile } from './normal.ts';

export class ToleranceDraws {
  private readonly gens: Xoshiro128ss[];
  /** The current sample's draws: values[k] has 1 (board) or `pieces` (per piece) numbers for tolerance k. */
  readonly values: Float64Array[];

  constructor(readonly tolerances: readonly Tolerance[], readonly pieces: number, readonly seed: number) {
    this.gens = tolerances.map((t) => Xoshiro128ss.fromSeed(seed, streamId(t.quantity)));
    this.values = tolerances.map((t) => new Float64Array(t.scope === 'piece' ? Math.max(1, pieces) : 1));
  }

  /** Draws the next sample into `values`. */
  next(): void {
    this.tolerances.forEach((t, k) => {
      const g = this.gens[k]!, out = this.values[k]!;
      for (let i = 0; i < out.length; i++) {
        const u = g.uniform();
        out[i] = t.distribution === 'normal' ? t.spread * normalQuantile(u) : t.spread * (2 * u - 1);
      }
    });
  }

  /** δ of tolerance k for piece i this sample. */
  at(k: number, piece: number): number {
    const v = this.values[k]!;
    return v.length === 1 ? v[0]! : v[piece]!;
  }
}
