/**
 * Memoised strip model for one substrate: a width per (Z0, f) and a line per (W, f), asked of one strip family of
 * the line-model interface (core/line/line-model.ts; the microstrip family unless a caller plants another). Sizing
 * asks for the same few impedances hundreds of times in a corporate feed, so the hot path is a Map lookup
 * (bench/layout.bench.ts). Sizing, paths and phase, and the shop checks all read a piece's copper through here.
 */
import { microstripFamily, stripAt } from '../line/index.ts';
import type { LineAt, LineOptions, ModeFigures, StripLineFamily } from '../line/index.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { NP_TO_DB } from '../units/constants.ts';
import type { LineFigures } from './types.ts';

export class LineCache {
  private widths = new Map<string, number>();
  private lines = new Map<string, LineAt>();
  /** Identity of the substrate and options the results belong to. */
  readonly key: string;
  constructor(readonly sub: SubstrateSpec, readonly opts?: LineOptions, readonly family: StripLineFamily = microstripFamily) {
    this.key = LineCache.keyOf(sub, opts);
  }

  static keyOf(sub: SubstrateSpec, opts?: LineOptions): string {
    return JSON.stringify([sub.er, sub.h, sub.t, sub.tanDelta, sub.sigma, sub.roughness, sub.dielectricModel ?? null, opts?.dispersion ?? null, opts?.conductorLoss ?? null, opts?.crossSection?.key ?? null]);
  }

  /** True when this cache's results hold for `sub` with `opts` through `family` (same numbers, not necessarily the same object). */
  fits(sub: SubstrateSpec, opts?: LineOptions, family: StripLineFamily = microstripFamily): boolean {
    return this.family === family && this.key === LineCache.keyOf(sub, opts);
  }

  /** The line whose Z0 at f is z0 (the family's width for it, then its line at f). */
  forZ0(z0: number, f: number): LineAt {
    const k = `${z0}@${f}`;
    let w = this.widths.get(k);
    if (w === undefined) { w = this.family.widthFor(this.sub, z0, f, this.opts); this.widths.set(k, w); }
    return this.forWidth(w, f);
  }

  /** The line of width W at f. */
  forWidth(width: number, f: number): LineAt {
    const k = `${width}@${f}`;
    let r = this.lines.get(k);
    if (!r) { r = stripAt(this.family, this.sub, width, f, this.opts); this.lines.set(k, r); }
    return r;
  }

  /** The single mode of width W at f. */
  modeAt(width: number, f: number): ModeFigures { return this.forWidth(width, f); }
}

/** Loss of a line in dB/m: conductor plus dielectric, each converted as core/line converts them. */
export function lossDbPerM(r: Pick<LineAt, 'alphaC' | 'alphaD'>): number { return r.alphaC * NP_TO_DB + r.alphaD * NP_TO_DB; }

export function figures(r: LineAt): LineFigures {
  return {
    z0: r.z0, z0Static: r.z0Static, epsEff: r.epsEff, epsEffStatic: r.epsEffStatic,
    beta: (2 * Math.PI) / r.lambdaG, lambdaG: r.lambdaG, lossDbPerM: lossDbPerM(r), delayPerM: r.delayPerM,
  };
}
