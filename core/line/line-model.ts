/**
 * The line-model interface: a cross-section description in; for each propagation mode of that cross-section
 * (one for a single strip, even and odd for a symmetric coupled pair) Z0(f), εeff(f), β(f) and α(f) out, with the
 * validity of the result as warnings. Everything that turns copper into a line (the network, paths and phase, the
 * yield estimate, sizing) asks through here, so another cross-section (a field solution, a stripline, a coplanar
 * line) plugs in by adding one `LineModelFamily` and nothing else.
 *
 * The two families here wrap the existing models without changing a bit of their numbers:
 *  - 'microstrip': Hammerstad & Jensen 1980 statics with thickness, Kirschning & Jansen 1982 εeff(f) and Jansen &
 *    Kirschning 1983 Z0(f) (or the options' alternatives), Wheeler incremental-inductance conductor loss and the
 *    filling-factor dielectric loss (analyze.ts); a CrossSectionSource in the options replaces the statics
 *    (made-line.ts, e.g. the 2-D solver's tables);
 *  - 'coupled-microstrip': Kirschning & Jansen 1984 even/odd statics with Getsinger 1973 dispersion per mode and the
 *    mode losses of coupled-losses.ts (coupled.ts).
 * The 2-D solver's adapter lives above this layer (core/section/line-model.ts).
 */
import type { SubstrateSpec } from '../substrate/types.ts';
import { InputError, describe } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { analyzeLine, analyzeLines } from './analyze.ts';
import { analyzeCoupled, couplingFromModes } from './coupled.ts';
import { synthesizeCoupled } from './coupled-synthesis.ts';
import { synthesizeLine } from './synthesize.ts';
import type { CoupledOptions, GuidedWave } from './coupled-types.ts';
import type { LineColumns, LineOptions, LineResult } from './types.ts';

/** One mode's figures at one frequency. SI units. */
export interface ModeFigures extends GuidedWave {
  /** Phase delay, s/m. */
  delayPerM: number;
  /** Conductor and dielectric attenuation, Np/m. */
  alphaC: number;
  alphaD: number;
}

/** The figures of every mode of a cross-section at f, with the validity of the result. */
export interface ModalFigures<M extends string = string> {
  f: number;
  modes: Readonly<Record<M, ModeFigures>>;
  /** Validity-range, higher-order-mode and thin-metal warnings, as data. */
  warnings: Warning[];
  /** False when a warning has severity 'error' (the quasi-TEM result does not hold there). */
  valid: boolean;
}

/** What every cross-section description carries: the name of its family. */
export interface CrossSectionDescription { readonly kind: string }

/** A single microstrip line of `width` m on `substrate`. */
export interface MicrostripSection extends CrossSectionDescription {
  readonly kind: 'microstrip';
  readonly substrate: SubstrateSpec;
  readonly width: number;
  readonly options?: LineOptions;
}

/** A symmetric pair of microstrip lines, each `width` m wide, `gap` m apart edge to edge. */
export interface CoupledMicrostripSection extends CrossSectionDescription {
  readonly kind: 'coupled-microstrip';
  readonly substrate: SubstrateSpec;
  readonly width: number;
  readonly gap: number;
  readonly options?: CoupledOptions;
}

/** A model family: which cross-sections it takes, which modes it gives, and the evaluation. */
export interface LineModelFamily<S extends CrossSectionDescription = CrossSectionDescription, M extends string = string> {
  readonly kind: S['kind'];
  readonly modes: readonly M[];
  /** The published source(s) of the model, in words (for docs and the piece sheet). */
  readonly source: string;
  /** The modes at f (Hz, 0 = static). Throws InputError for bad input; leaving a model's range is a warning. */
  evaluate(section: S, f: number): ModalFigures<M>;
}

/** A single line's one mode at f as sizing, paths and the network read it, with its width and the warnings. */
export interface LineAt extends ModeFigures {
  /** Strip width, m. */
  width: number;
  /** Frequency, Hz. */
  f: number;
  warnings: Warning[];
}

/**
 * A family of single strips over the laminate that can also choose a width for an impedance: what sizing (a width
 * from Z0), paths and phase, and the network ask of a piece's copper. The design's strips are asked for as kind
 * 'microstrip'; a plug-in of that kind (`LineModels.with`) changes every one of them at once.
 */
export interface StripLineFamily extends LineModelFamily<MicrostripSection, SingleMode> {
  /** The width, m, whose Z0 at f (Hz) is `z0` Ω on `substrate`; InputError('unreachable-target') when no width gives it. */
  widthFor(substrate: SubstrateSpec, z0: number, f: number, options?: LineOptions): number;
  /** Optional batch form of `evaluate` (same numbers), for callers that analyse many strips at once (`stripColumns`). */
  columns?(substrate: SubstrateSpec, widths: ArrayLike<number>, freqs: ArrayLike<number> | number, options?: LineOptions, into?: LineColumns): LineColumns;
}

/** Even- and odd-mode impedances a coupled pair is asked to have, Ω. */
export interface PairModes { z0Even: number; z0Odd: number }

/**
 * A family of symmetric coupled pairs over the laminate that can also choose a geometry for a pair of mode
 * impedances: what the coupled-line sizing (a pair by modes) and the network's coupled sections ask of a pair's
 * copper. Asked for as kind 'coupled-microstrip'; a plug-in of that kind (`LineModels.with`) changes every pair.
 */
export interface CoupledPairFamily extends LineModelFamily<CoupledMicrostripSection, CoupledModeName> {
  /**
   * Width and edge-to-edge gap, m, of the pair whose even and odd Z0 at f (Hz) are `modes` on `substrate`;
   * InputError('unreachable-target') when no geometry gives them.
   */
  geometryFor(substrate: SubstrateSpec, modes: PairModes, f: number, options?: CoupledOptions): { width: number; gap: number };
}

export const SINGLE_MODE = 'single' as const;
export type SingleMode = typeof SINGLE_MODE;
export type CoupledModeName = 'even' | 'odd';

function isValid(warnings: Warning[]): boolean {
  for (const w of warnings) if (w.severity === 'error') return false;
  return true;
}

/** A single-line analysis as one mode (β = 2π/λg, the same division every consumer made before). */
export function modeOfLine(r: LineResult): ModeFigures {
  return {
    z0: r.z0, z0Static: r.z0Static, epsEff: r.epsEff, epsEffStatic: r.epsEffStatic,
    beta: r.lambdaG > 0 ? (2 * Math.PI) / r.lambdaG : 0, lambdaG: r.lambdaG, delayPerM: r.delayPerM,
    alphaC: r.alphaC, alphaD: r.alphaD,
  };
}

export const microstripFamily: StripLineFamily = {
  kind: 'microstrip',
  modes: [SINGLE_MODE],
  source: 'Hammerstad & Jensen 1980 (static, thickness); Kirschning & Jansen 1982 εeff(f); Jansen & Kirschning 1983 Z0(f); Wheeler 1942 conductor loss',
  evaluate(s, f) {
    const r = analyzeLine(s.substrate, s.width, f, s.options);
    return { f, modes: { single: modeOfLine(r) }, warnings: r.warnings, valid: isValid(r.warnings) };
  },
  // Exact synthesis of the same analysis (synthesize.ts), so the width's own evaluation gives back z0.
  widthFor(substrate, z0, f, options) { return synthesizeLine(substrate, z0, f, options).width; },
  columns: analyzeLines,
};

export const coupledMicrostripFamily: CoupledPairFamily = {
  kind: 'coupled-microstrip',
  modes: ['even', 'odd'],
  source: 'Kirschning & Jansen 1984 (even/odd statics); Getsinger 1973 dispersion per mode',
  evaluate(s, f) {
    const r = analyzeCoupled(s.substrate, s.width, s.gap, f, s.options);
    const m = (x: typeof r.even): ModeFigures => ({
      z0: x.z0, z0Static: x.z0Static, epsEff: x.epsEff, epsEffStatic: x.epsEffStatic, beta: x.beta, lambdaG: x.lambdaG,
      delayPerM: 1 / x.vp, alphaC: x.alphaC, alphaD: x.alphaD,
    });
    return { f, modes: { even: m(r.even), odd: m(r.odd) }, warnings: r.warnings, valid: isValid(r.warnings) };
  },
  // Newton inversion of the same statics (coupled-synthesis.ts); its geometry evaluated here gives back the modes.
  geometryFor(substrate, modes, f, options) {
    const r = synthesizeCoupled(substrate, { z0Even: modes.z0Even, z0Odd: modes.z0Odd }, f, options);
    return { width: r.width, gap: r.spacing };
  },
};

/**
 * A set of families, looked up by the description's `kind`. Immutable: `with` gives a new set, so a plug-in (a
 * test's fake, the 2-D solver's adapter) never changes what other callers see.
 */
export class LineModels {
  private readonly byKind: ReadonlyMap<string, LineModelFamily>;
  constructor(families: readonly LineModelFamily[]) {
    this.byKind = new Map(families.map((f) => [f.kind, f]));
  }

  /** This set plus `family` (replacing one of the same kind). */
  with<S extends CrossSectionDescription, M extends string>(family: LineModelFamily<S, M>): LineModels {
    const next = new Map(this.byKind);
    next.set(family.kind, family as unknown as LineModelFamily);
    return new LineModels([...next.values()]);
  }

  kinds(): string[] { return [...this.byKind.keys()]; }

  familyOf(section: CrossSectionDescription): LineModelFamily {
    const fam = this.byKind.get(section?.kind);
    if (!fam) throw new InputError('bad-choice', 'crossSection.kind', `one of ${this.kinds().join(', ')}`, describe(section?.kind));
    return fam;
  }

  /**
   * The family the design's strips are sized and solved with (kind 'microstrip'). Refuses a plug-in of that kind
   * that cannot choose a width for an impedance, since sizing needs it.
   */
  strip(): StripLineFamily {
    const fam = this.familyOf({ kind: 'microstrip' }) as Partial<StripLineFamily> & LineModelFamily;
    if (typeof fam.widthFor !== 'function') throw new InputError('bad-choice', 'lineModels.microstrip', 'a strip family with widthFor (sizing chooses widths for impedances)', 'a family without it');
    return fam as StripLineFamily;
  }

  /** The family the design's coupled pairs are analysed with (kind 'coupled-microstrip'), for callers that only evaluate. */
  coupled(): LineModelFamily<CoupledMicrostripSection, CoupledModeName> {
    return this.familyOf({ kind: 'coupled-microstrip' }) as unknown as LineModelFamily<CoupledMicrostripSection, CoupledModeName>;
  }

  /**
   * The family the design's coupled pairs are sized and solved with (kind 'coupled-microstrip'). Refuses a plug-in
   * of that kind that cannot choose a geometry for mode impedances, since sizing a pair by modes needs it.
   */
  pair(): CoupledPairFamily {
    const fam = this.familyOf({ kind: 'coupled-microstrip' }) as Partial<CoupledPairFamily> & LineModelFamily;
    if (typeof fam.geometryFor !== 'function') throw new InputError('bad-choice', 'lineModels.coupled-microstrip', 'a coupled-pair family with geometryFor (sizing chooses a pair\'s width and gap for mode impedances)', 'a family without it');
    return fam as CoupledPairFamily;
  }

  /** The modes of `section` at f. */
  evaluate<S extends CrossSectionDescription>(section: S, f: number): ModalFigures {
    return this.familyOf(section).evaluate(section, f);
  }
}

/** The families the core knows: microstrip and coupled microstrip. */
export const lineModels = new LineModels([microstripFamily, coupledMicrostripFamily]);

/** The one mode of a single microstrip line at f (what sizing, paths and the network ask of a piece's copper). */
export function microstripMode(substrate: SubstrateSpec, width: number, f: number, options?: LineOptions): ModeFigures {
  return microstripFamily.evaluate({ kind: 'microstrip', substrate, width, options }, f).modes.single;
}

/** A strip of `width` on `substrate` at f through `family`: its one mode with the width, f and the warnings. */
export function stripAt(family: StripLineFamily, substrate: SubstrateSpec, width: number, f: number, options?: LineOptions): LineAt {
  const r = family.evaluate({ kind: 'microstrip', substrate, width, options }, f);
  const m = r.modes.single;
  return {
    z0: m.z0, z0Static: m.z0Static, epsEff: m.epsEff, epsEffStatic: m.epsEffStatic, beta: m.beta, lambdaG: m.lambdaG,
    delayPerM: m.delayPerM, alphaC: m.alphaC, alphaD: m.alphaD, width, f, warnings: r.warnings,
  };
}

/** A pair's even and odd modes at f through `family`, with its geometry, the coupling they give and the warnings. */
export interface PairAt {
  width: number;
  gap: number;
  f: number;
  even: ModeFigures;
  odd: ModeFigures;
  /** C = (Z0e − Z0o)/(Z0e + Z0o) and −20·log10 C, dB (capped at 400): a quarter-wave section's coupling at its centre. */
  couplingFactor: number;
  couplingDb: number;
  warnings: Warning[];
  valid: boolean;
}

export function pairAt(family: LineModelFamily<CoupledMicrostripSection, CoupledModeName>, substrate: SubstrateSpec, width: number, gap: number, f: number, options?: CoupledOptions): PairAt {
  const r = family.evaluate({ kind: 'coupled-microstrip', substrate, width, gap, options }, f);
  const { even, odd } = r.modes;
  const c = couplingFromModes(even.z0, odd.z0);
  return { width, gap, f, even, odd, couplingFactor: c.factor, couplingDb: c.db, warnings: r.warnings, valid: r.valid };
}

/**
 * Many single strips on one substrate at once through `family` (the yield's tables, the coupon's fit): the family's
 * own batch form when it has one (the microstrip family's is `analyzeLines`, the same numbers as `evaluate` to the
 * last bit), else `evaluate` entry by entry. A family without a batch form gives no skin depth (0 in that column).
 * `into`: columns of the same length from an earlier call, refilled instead of new ones.
 */
export function stripColumns(family: StripLineFamily, substrate: SubstrateSpec, widths: ArrayLike<number>, freqs: ArrayLike<number> | number, options?: LineOptions, into?: LineColumns): LineColumns {
  if (family.columns) return family.columns(substrate, widths, freqs, options, into);
  const n = widths.length;
  const cols: LineColumns = into !== undefined && into.width.length === n ? into : {
    width: new Float64Array(n), f: new Float64Array(n), z0: new Float64Array(n), z0Static: new Float64Array(n),
    epsEff: new Float64Array(n), epsEffStatic: new Float64Array(n), lambdaG: new Float64Array(n), vp: new Float64Array(n),
    delayPerM: new Float64Array(n), alphaC: new Float64Array(n), alphaD: new Float64Array(n), skinDepth: new Float64Array(n),
    warnings: [],
  };
  cols.warnings.length = 0;
  for (let i = 0; i < n; i++) {
    const f = typeof freqs === 'number' ? freqs : freqs[i]!;
    const r = family.evaluate({ kind: 'microstrip', substrate, width: widths[i]!, options }, f);
    const m = r.modes.single;
    cols.width[i] = widths[i]!; cols.f[i] = f; cols.z0[i] = m.z0; cols.z0Static[i] = m.z0Static; cols.epsEff[i] = m.epsEff;
    cols.epsEffStatic[i] = m.epsEffStatic; cols.lambdaG[i] = m.lambdaG; cols.delayPerM[i] = m.delayPerM;
    cols.vp[i] = m.delayPerM > 0 ? 1 / m.delayPerM : 0; cols.alphaC[i] = m.alphaC; cols.alphaD[i] = m.alphaD; cols.skinDepth[i] = 0;
    for (const warning of r.warnings) cols.warnings.push({ index: i, warning });
  }
  return cols;
}

/**
 * Many single lines on one substrate at once (the yield estimate's tables): the batch form of the microstrip
 * family, the same numbers as `evaluate` to the last bit (analyze.ts shares one analysis between both). `into`:
 * columns of the same length from an earlier call, refilled instead of new ones.
 */
export function microstripColumns(substrate: SubstrateSpec, widths: ArrayLike<number>, freqs: ArrayLike<number> | number, options?: LineOptions, into?: LineColumns): LineColumns {
  return analyzeLines(substrate, widths, freqs, options, into);
}
