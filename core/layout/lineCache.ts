/**
 * Memoised line model for one substrate: synthesis per (Z0, f) and analysis per (W, f). Sizing asks for the same
 * few impedances hundreds of times in a corporate feed, so the hot path is a Map lookup (bench/layout.bench.ts).
 * `modeAt` gives the line's one mode as the line-model interface states it (core/line/line-model.ts): what paths
 * and sizing read of a piece's copper.
 */
import { analyzeLine, modeOfLine, synthesizeLine } from '../line/index.ts';
import type { LineOptions, LineResult, ModeFigures } from '../line/index.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import type { LineFigures } from './types.ts';

export class LineCache {
  private synth = new Map<string, LineResult>();
  private anal = new Map<string, LineResult>();
  private modes = new Map<string, ModeFigures>();
  /** Identity of the substrate and options the results belong to. */
  readonly key: string;
  constructor(readonly sub: SubstrateSpec, readonly opts?: LineOptions) {
    this.key = LineCache.keyOf(sub, opts);
  }

  static keyOf(sub: SubstrateSpec, opts?: LineOptions): string {
    return JSON.stringify([sub.er, sub.h, sub.t, sub.tanDelta, sub.sigma, sub.roughness, sub.dielectricModel ?? null, opts?.dispersion ?? null, opts?.conductorLoss ?? null, opts?.crossSection?.key ?? null]);
  }

  /** True when this cache's results hold for `sub` with `opts` (same numbers, not necessarily the same object). */
  fits(sub: SubstrateSpec, opts?: LineOptions): boolean { return this.key === LineCache.keyOf(sub, opts); }

  /** Width for Z0 at f (exact synthesis with dispersion at f). */
  forZ0(z0: number, f: number): LineResult {
    const k = `${z0}@${f}`;
    let r = this.synth.get(k);
    if (!r) { r = synthesizeLine(this.sub, z0, f, this.opts); this.synth.set(k, r); this.anal.set(`${r.width}@${f}`, r); }
    return r;
  }

  /** Analysis of width W at f. */
  forWidth(width: number, f: number): LineResult {
    const k = `${width}@${f}`;
    let r = this.anal.get(k);
    if (!r) { r = analyzeLine(this.sub, width, f, this.opts); this.anal.set(k, r); }
    return r;
  }

  /** The single mode of width W at f (the microstrip family of the line-model interface, memoised). */
  modeAt(width: number, f: number): ModeFigures {
    const k = `${width}@${f}`;
    let m = this.modes.get(k);
    if (!m) { m = modeOfLine(this.forWidth(width, f)); this.modes.set(k, m); }
    return m;
  }

  /** The single mode of the width synthesised for Z0 at f (what sizing asks when a piece is given by impedance). */
  modeForZ0(z0: number, f: number): { width: number; mode: ModeFigures } {
    const r = this.forZ0(z0, f);
    return { width: r.width, mode: this.modeAt(r.width, f) };
  }
}

export function figures(r: LineResult): LineFigures {
  return {
    z0: r.z0, z0Static: r.z0Static, epsEff: r.epsEff, epsEffStatic: r.epsEffStatic,
    beta: (2 * Math.PI) / r.lambdaG, lambdaG: r.lambdaG, lossDbPerM: r.alphaCdBPerM + r.alphaDdBPerM, delayPerM: r.delayPerM,
  };
}
