/**
 * Block: edge-coupled (parallel-coupled half-wave resonator) band-pass filter.
 *
 * Design equations: S. B. Cohn, "Parallel-coupled transmission-line-resonator filters", IRE Trans. MTT, vol. 6,
 * no. 2, pp. 223–231, April 1958, in the admittance-inverter form of G. L. Matthaei, L. Young and E. M. T. Jones,
 * "Microwave Filters, Impedance-Matching Networks, and Coupling Structures", McGraw-Hill, 1964, §10.02 (also Pozar,
 * Microwave Engineering, 4th ed., §8.8). Fractional bandwidth Δ, prototype g0 … g(N+1) (lowpassPrototype.ts):
 *   Z0·J1 = √(πΔ/(2 g0 g1)),  Z0·Jk = πΔ/(2√(g(k−1) g_k)) (k = 2 … N),  Z0·J(N+1) = √(πΔ/(2 g_N g(N+1))),
 *   Z0e = Z0·(1 + Z0J + (Z0J)²),  Z0o = Z0·(1 − Z0J + (Z0J)²).
 * N + 1 coupled sections, each 90° at f0 on the mean of its modes' phase constants; each resonator (the second strip
 * of one section and the first strip of the next) ends in open ends, which sizing shortens by their Kirschning–
 * Jansen–Koster 1981 extension (the open-end effect compensated); the strips' ends are set back each by its own
 * extension, so a section's strips overlap over 90° − 2βΔl, and its inverter is scaled by 1/sin of that (our
 * first-order make-up for the shorter coupled run). Sections step down in a staircase; the port lines
 * leave the first and last strips with a 90° optimal-miter bend, away from the strip beside them. A gap narrower than the process can cut is refused with the
 * tightest coupling it can make.
 */
import type { DesignDoc, DesignNode, DesignSegment, SubstrateSpec } from '../design/types.ts';
import { newDesign } from '../design/defaults.ts';
import { lineModels, pairAt, stripAt, type PairAt, type PairModes } from '../line/index.ts';
import { openEndExtension } from '../discontinuity/kirschningJansenKoster1981OpenEnd.ts';
import { InputError, describe } from '../util/errors.ts';
import { prototypeValues, type PrototypeKind } from './lowpassPrototype.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { netlistFromSized } from '../network/fromSized.ts';
import { solveNetwork } from '../network/sweep.ts';
import { magnitudeDb } from '../network/figures.ts';
import { portIndex } from '../network/response.ts';
import { drawAsPlaced, requireCuttableGap, type BlockBase } from './common.ts';

export interface BandpassOptions extends BlockBase {
  /** Filter order N (number of resonators), 1–9. */
  order: number;
  /** Fractional bandwidth Δ (0.1 = 10 %): the −3 dB band for maximally flat, the ripple band for equal ripple. */
  bw: number;
  /** Pass-band ripple, dB: gives an equal-ripple (Chebyshev) response; omit (or 0) for maximally flat. */
  rippleDb?: number;
}

/** The design table of the filter: per coupled section, Z0·J and the mode impedances. */
export function bandpassSections(order: number, bw: number, rippleDb: number | undefined, z0: number): { g: number[]; kind: PrototypeKind; sections: { j: number; z0Even: number; z0Odd: number }[] } {
  if (typeof bw !== 'number' || !(bw > 0.005 && bw <= 0.4)) throw new InputError(typeof bw === 'number' && Number.isFinite(bw) ? 'out-of-range' : 'invalid-number', 'bw', 'a fractional bandwidth from 0.005 to 0.4 (0.1 = 10 %)', describe(bw), 'edge-coupled filters are practical up to about 20 % bandwidth');
  if (!Number.isInteger(order) || order < 1 || order > 9) throw new InputError('out-of-range', 'order', 'a whole filter order from 1 to 9', describe(order));
  return inverterTable(order, bw, rippleDb, z0);
}

/** The table without the range checks: the correction loop asks it for design bandwidths a little off the user's. */
function inverterTable(order: number, bw: number, rippleDb: number | undefined, z0: number): { g: number[]; kind: PrototypeKind; sections: { j: number; z0Even: number; z0Odd: number }[] } {
  const kind: PrototypeKind = rippleDb === undefined || rippleDb === 0 ? 'maximally-flat' : 'equal-ripple';
  const g = prototypeValues(kind, order, rippleDb ?? 0.5);
  const sections = [];
  for (let k = 1; k <= order + 1; k++) {
    const j = k === 1 ? Math.sqrt((Math.PI * bw) / (2 * g[0]! * g[1]!))
      : k === order + 1 ? Math.sqrt((Math.PI * bw) / (2 * g[order]! * g[order + 1]!))
        : (Math.PI * bw) / (2 * Math.sqrt(g[k - 1]! * g[k]!));
    sections.push({ j, z0Even: z0 * (1 + j + j * j), z0Odd: z0 * (1 - j + j * j) });
  }
  return { g, kind, sections };
}

/**
 * The filter as designed: Cohn's initial values, then a correction loop against the core's own sweep of the block
 * (sizing and the network solver, the same path the user's response takes). The closed-form design is only
 * first-order accurate: the inverters are frequency-dependent, the two modes run at different speeds and the end
 * effects are approximate, so the swept band comes out off centre and narrow by a few per cent (more for narrow,
 * high-order filters). The loop corrects the design knobs by their measured ratios:
 *   1. lossless copy: the design centre f0d ← f0d·f0/fc and the design bandwidth Δd ← Δd·Δ/Δmeasured, where the band is
 *      the ripple band for equal ripple and the −3 dB band for maximally flat (three passes settle it to < 0.5 %);
 *   2. losses round the pass band and narrow its −3 dB band relative to peak transmission (most on lossy
 *      glass-epoxy). For equal ripple the design may ripple less than asked (flatterFor): a flatter response keeps
 *      its band at the asked ripple and has a wider −3 dB band; the design ripple is chosen from the measured
 *      narrowing, then refined once by a secant on the measured lossy band, the lossless band settled again each time;
 *   3. what is still short is made up by widening Δd, but never so far that the lossless band exceeds the spec by
 *      more than 4 % (the lossless band stays the design's promise; what is left is reported in the notes).
 * The design centre is carried as each section's length in degrees at the user's f0 (90°·f0/f0d).
 */
export function bandpassBlock(opts: BandpassOptions): DesignDoc {
  const z0 = opts.z0 ?? 50;
  bandpassSections(opts.order, opts.bw, opts.rippleDb, z0); // range checks in the user's words
  const f0 = opts.f0, bw = opts.bw, n = opts.order;
  const ripple = opts.rippleDb || undefined;
  const lossyTarget = ripple ? bw * chebyshevWidth(ripple, 3, n) : bw;
  const log: string[] = [];
  const level = ripple ? ripple + 1e-3 : 3;
  const note = (ideal: SweptBand, lossy?: SweptBand) => log.push(`lossless centre ${fmtPct(ideal.centre / f0 - 1)}, band ${fmtPct(ideal.bw / bw - 1)}${lossy ? `; with losses −3 dB band ${fmtPct(lossy.bw / lossyTarget - 1)} of ${(lossyTarget * 100).toFixed(2)} %` : ''}`);

  /** Lossless passes: centre and band back on the spec. */
  const settle = (start: DesignKnobs, passes: number): Draft => {
    let knobs = start, doc = bandpassDraft(opts, knobs);
    for (let pass = 0; pass < passes; pass++) {
      const ideal = sweptBand(doc, f0, bw, true, level);
      if (!ideal) break;
      note(ideal);
      const next = { ...knobs, f0: knobs.f0 * (f0 / ideal.centre), bw: knobs.bw * (bw / ideal.bw) };
      if (!(next.bw > 0.002 && next.bw < 0.6 && Math.abs(next.f0 / f0 - 1) < 0.2)) break; // far off: keep the last draft
      knobs = next;
      doc = bandpassDraft(opts, knobs);
    }
    const ideal = sweptBand(doc, f0, bw, true, level);
    return { knobs, doc, ...(ideal ? { ideal, lossy: sweptBand(doc, f0, bw, false, 3) } : {}) };
  };
  // A draft whose lossless band is off its promise is never preferred, however its lossy band reads.
  const kept = (d: Draft) => !!d.ideal && Math.abs(d.ideal.bw / bw - 1) < 0.045 && Math.abs(d.ideal.centre / f0 - 1) < 0.008;
  const miss = (d: Draft) => (d.lossy && kept(d) ? Math.abs(d.lossy.bw / lossyTarget - 1) : Infinity);

  let best = settle({ f0, bw, ripple }, 3);
  if (ripple && best.ideal && best.lossy && best.lossy.bw < 0.99 * lossyTarget) {
    // The design ripple: a first guess from the measured narrowing, then one secant step in log ripple.
    const first = best;
    const guess = flatterFor(best.knobs, ripple, best.ideal, best.lossy, { bw, ripple, lossyTarget, n });
    const tried = settle(guess, 3);
    if (miss(tried) < miss(best)) best = tried;
    if (tried.lossy && first.lossy && guess.ripple! < ripple - 1e-4 && miss(tried) > 0.02) {
      const x0 = Math.log(ripple), x1 = Math.log(guess.ripple!);
      const y0 = first.lossy.bw / lossyTarget - 1, y1 = tried.lossy.bw / lossyTarget - 1;
      if (y1 !== y0) {
        const rd = Math.min(ripple, Math.max(0.01, Math.exp(x1 - (y1 * (x1 - x0)) / (y1 - y0))));
        const again = settle(rescaleRipple(tried.knobs, rd, ripple, n), 3);
        if (miss(again) < miss(best)) best = again;
      }
    }
  }
  // Widen towards the lossy target, the lossless band kept between the spec and 4 % over it.
  for (let pass = 0; pass < 3 && best.ideal && best.lossy; pass++) {
    note(best.ideal, best.lossy);
    if (best.lossy.bw >= 0.995 * lossyTarget && Math.abs(best.ideal.bw / bw - 1) < 0.01) break;
    const widen = Math.min(Math.max(lossyTarget / (best.lossy.bw * (bw / best.ideal.bw)), 1), 1.04);
    const knobs = { ...best.knobs, f0: best.knobs.f0 * (f0 / best.ideal.centre), bw: best.knobs.bw * (bw / best.ideal.bw) * widen };
    const doc = bandpassDraft(opts, knobs);
    const ideal = sweptBand(doc, f0, bw, true, level);
    if (!ideal) break;
    const next: Draft = { knobs, doc, ideal, lossy: sweptBand(doc, f0, bw, false, 3) };
    if (!kept(next) && kept(best)) break;
    best = next;
  }
  const { doc, knobs: design } = best;
  const flatter = ripple && design.ripple && design.ripple < ripple - 1e-3
    ? `, design ripple ${design.ripple.toFixed(3)} dB (a flatter prototype than the asked ${ripple} dB, so that losses leave the −3 dB band; the band at the asked ripple is kept, but the lossless copy's ripple inside it is the made filter's, not the prototype's)` : '';
  doc.notes += `\nCorrected against the core's own sweep (design centre ${(design.f0 / 1e9).toPrecision(5)} GHz, design bandwidth ${(design.bw * 100).toFixed(2)} %${flatter}): ${log.map((l, i) => `pass ${i + 1}: ${l}`).join('; ')}.`;
  return doc;
}

interface Draft { knobs: DesignKnobs; doc: DesignDoc; ideal?: SweptBand; lossy?: SweptBand | undefined }

/** The knobs with the design ripple moved to rd, the design band rescaled so the band at the asked ripple stays. */
function rescaleRipple(k: DesignKnobs, rd: number, ripple: number, n: number): DesignKnobs {
  return { ...k, ripple: rd, bw: k.bw * (chebyshevWidth(k.ripple ?? ripple, ripple, n) / chebyshevWidth(rd, ripple, n)) };
}

/** What the correction loop moves: the design centre, the design bandwidth and (equal ripple) the design ripple. */
interface DesignKnobs { f0: number; bw: number; ripple: number | undefined }

/**
 * Width of an equal-ripple (Chebyshev) response of ripple `rippleDb`, order n, at `levelDb` of loss, relative to its
 * ripple band: |S21|² = 1/(1 + ε²T_n²(x)) (Matthaei, Young and Jones 1964, §4.03), so the level is met where
 * T_n(x) = ε_L/ε, x = cosh(arccosh(ε_L/ε)/n) beyond the ripple band (cos(arccos(·)/n) inside it).
 */
function chebyshevWidth(rippleDb: number, levelDb: number, n: number): number {
  const e = Math.sqrt(10 ** (rippleDb / 10) - 1), eL = Math.sqrt(10 ** (levelDb / 10) - 1);
  const t = eL / e;
  return t >= 1 ? Math.cosh(Math.acosh(t) / n) : Math.cos(Math.acos(t) / n);
}

/** The −3 dB band of an equal-ripple response of ripple rd over its band at the asked ripple. */
function widthRatio(rd: number, ripple: number, n: number): number {
  return chebyshevWidth(rd, 3, n) / chebyshevWidth(rd, ripple, n);
}

/**
 * Losses narrow the −3 dB band of a filter relative to its peak (the band edges lose more than the centre). For
 * equal ripple the design may ripple less than asked: a flatter response has a wider −3 dB band for the same band at
 * the asked ripple (chebyshevWidth), which makes up the narrowing without widening the lossless ripple band. Our own
 * way of using the prototype family: the ripple that, with the narrowing measured on this pass, brings the lossy band
 * to its target, between 0.01 dB (the prototype table's floor) and the asked ripple; the design bandwidth is rescaled
 * so the band at the asked ripple stays where it was.
 */
function flatterFor(next: DesignKnobs, rippleNow: number, ideal: SweptBand, lossy: SweptBand, spec: { bw: number; ripple: number; lossyTarget: number; n: number }): DesignKnobs {
  const { ripple, n } = spec;
  const ratio = (rd: number) => widthRatio(rd, ripple, n);
  const shrink = lossy.bw / (ideal.bw * ratio(rippleNow)); // lossy −3 dB band over the lossless one
  const want = spec.lossyTarget / (spec.bw * shrink);
  let lo = 0.01, hi = ripple;
  if (ratio(lo) <= want) hi = lo; // as flat as the table goes
  else if (ratio(hi) >= want) lo = hi; // the asked ripple is already enough
  for (let i = 0; i < 40 && hi - lo > 1e-5; i++) { const m = (lo + hi) / 2; if (ratio(m) > want) lo = m; else hi = m; }
  return rescaleRipple({ ...next, ripple: rippleNow }, (lo + hi) / 2, ripple, n);
}

interface SweptBand { centre: number; bw: number }

/** Centre and fractional width of the band `drop` dB below the peak of |S21|, from a sweep of the block. */
function sweptBand(doc: DesignDoc, f0: number, bw: number, lossless: boolean, drop: number): SweptBand | undefined {
  const sized = sizeDesign(doc);
  if (sized.problems.length) return undefined;
  const m = 401, lo = f0 * (1 - 2.5 * bw), hi = f0 * (1 + 2.5 * bw);
  const freqs = Array.from({ length: m }, (_, i) => lo + ((hi - lo) * i) / (m - 1));
  const r = solveNetwork(netlistFromSized(sized, { lossless }), freqs);
  const s21 = magnitudeDb(r, portIndex(r, 'out'), portIndex(r, 'in'));
  let pk = -Infinity, ipk = 0;
  s21.forEach((v, i) => { if (v > pk) { pk = v; ipk = i; } });
  const level = pk - drop;
  let a = 0, b = m - 1;
  while (a < ipk && s21[a]! < level) a++;
  while (b > ipk && s21[b]! < level) b--;
  if (a === 0 || b === m - 1) return undefined; // the band runs off the sweep: leave the draft alone
  const cross = (i: number, j: number) => freqs[i]! + ((level - s21[i]!) * (freqs[j]! - freqs[i]!)) / (s21[j]! - s21[i]!);
  const fl = cross(a - 1, a), fh = cross(b, b + 1);
  return { centre: (fl + fh) / 2, bw: (fh - fl) / f0 };
}

const fmtPct = (x: number) => `${x >= 0 ? '+' : '−'}${Math.abs(x * 100).toFixed(2)} %`;

/** One draft of the filter for a design centre f0d and design bandwidth bwd (the user's f0 and bw name it). */
function bandpassDraft(opts: BandpassOptions, knobs: DesignKnobs): DesignDoc {
  const z0 = opts.z0 ?? 50;
  const f0d = knobs.f0;
  const { g, kind, sections } = inverterTable(opts.order, knobs.bw, knobs.ripple, z0);
  const n = opts.order, f0 = opts.f0;
  const doc = newDesign({
    name: opts.name ?? `Order ${n} edge-coupled band-pass, ${(f0 / 1e9).toPrecision(4)} GHz, ${(opts.bw * 100).toPrecision(3)} %`,
    f0, band: { start: f0 * (1 - 2 * opts.bw), stop: f0 * (1 + 2 * opts.bw) },
    ...(opts.substrate ? { substrate: opts.substrate } : {}), ...(opts.process ? { process: opts.process } : {}),
  });
  const sub = doc.substrate;
  // Sizing sets each strip's open end back by its end extension Δl, so a section's strips overlap over 90° − 2βΔl,
  // not 90°. A shorter coupled run couples less (about as sin θ of its electrical length θ), so the inverters are
  // scaled by 1/sin θ and the sections synthesised again (our first-order compensation; two passes settle it).
  let geo = sections.map((s) => pairFor(sub, { z0Even: s.z0Even, z0Odd: s.z0Odd }, f0d));
  for (let pass = 0; pass < 2; pass++) {
    geo = sections.map((s, i) => {
      const r = geo[i]!;
      const beta = (r.even.beta + r.odd.beta) / 2;
      const single = stripAt(lineModels.strip(), sub, r.width, 0);
      const dl = openEndExtension({ u: r.width / sub.h, er: sub.er, eeStatic: single.epsEffStatic, h: sub.h }).dl;
      const theta = Math.PI / 2 - 2 * beta * dl;
      if (!(theta > Math.PI / 4)) throw new InputError('out-of-range', 'f0', 'a frequency at which the open ends take less than a quarter of a coupled section', `${(dl * 1e3).toFixed(3)} mm of end extension on a ${(((Math.PI / 2) / beta) * 1e3).toFixed(3)} mm section`, 'use a thinner substrate');
      const j = s.j / Math.sin(theta);
      return pairFor(sub, { z0Even: z0 * (1 + j + j * j), z0Odd: z0 * (1 - j + j * j) }, f0d);
    });
  }
  geo.forEach((r, i) => {
    requireCuttableGap(r.gap, sub, doc.process, Math.sqrt(r.even.z0 * r.odd.z0), r.couplingDb, 'bw',
      `coupled section ${i + 1} of ${n + 1}`, 'ask for a narrower bandwidth or a lower order, use a finer tool, or a thinner substrate');
  });
  const feed = opts.feedLength ?? Math.max(2e-3, 3 * sub.h);
  const L = 10e-3; // drawn only for directions; sizing places the block
  const nodes: DesignNode[] = [{ id: 'in', kind: 'port', zRef: z0, heading: -Math.PI / 2, label: 'input', at: { x: 0, y: feed } }];
  const segments: DesignSegment[] = [];
  let y = 0;
  for (let k = 1; k <= n + 1; k++) {
    const r = geo[k - 1]!;
    const x0 = (k - 1) * L, pitch = r.width + r.gap;
    const a = k === 1 ? 'p1' : `r${k - 1}`, d = k === n + 1 ? `p2` : `r${k}`;
    if (k === 1) nodes.push({ id: a, kind: 'vertex', bend: { style: 'miter-optimal' }, at: { x: x0, y } });
    nodes.push({ id: `o${k}b`, kind: 'open', label: `open end, section ${k}`, at: { x: x0 + L, y } });
    nodes.push({ id: `o${k}c`, kind: 'open', label: `open end, section ${k}`, at: { x: x0, y: y - pitch } });
    nodes.push({ id: d, kind: 'vertex', bend: k <= n ? { style: 'square' } : { style: 'miter-optimal' }, ...(k <= n ? { label: `resonator ${k}` } : {}), at: { x: x0 + L, y: y - pitch } });
    segments.push({
      id: `s${k}`, kind: 'coupled', a, b: `o${k}b`, c: `o${k}c`, d, label: `coupled section ${k}`,
      pair: { by: 'geometry', width: r.width, gap: r.gap }, length: { by: 'degrees', deg: (90 * f0) / f0d },
    });
    y -= pitch;
  }
  nodes.push({ id: 'out', kind: 'port', zRef: z0, heading: Math.PI / 2, label: 'output', at: { x: (n + 1) * L, y: y - feed } });
  segments.unshift({ id: 'feed-in', kind: 'line', a: 'in', b: 'p1', width: { by: 'z0', z0 }, length: { by: 'length', length: feed } });
  segments.push({ id: 'feed-out', kind: 'line', a: 'p2', b: 'out', width: { by: 'z0', z0 }, length: { by: 'length', length: feed } });
  doc.nodes = nodes;
  doc.segments = segments;
  const gs = g.map((x) => x.toFixed(4)).join(', ');
  doc.notes = [
    `Edge-coupled band-pass filter made by the band-pass block: order ${n}, centre ${(f0 / 1e9).toPrecision(5)} GHz, fractional bandwidth ${opts.bw}, ${kind === 'maximally-flat' ? 'maximally flat' : `equal ripple ${opts.rippleDb} dB`}, ${z0} Ω.`,
    `Prototype g0…g${n + 1} = ${gs} (Matthaei, Young and Jones 1964, §4.05); inverters and mode impedances by Cohn 1958 / Matthaei, Young and Jones §10.02.`,
    ...sections.map((s, i) => `Section ${i + 1}: Z0·J ${s.j.toFixed(4)} (Z0e ${s.z0Even.toFixed(2)} Ω, Z0o ${s.z0Odd.toFixed(2)} Ω); with the overlap lost to the open ends made up, Z0e ${geo[i]!.even.z0.toFixed(2)} Ω, Z0o ${geo[i]!.odd.z0.toFixed(2)} Ω → strips ${(geo[i]!.width * 1e3).toFixed(3)} mm, gap ${(geo[i]!.gap * 1e3).toFixed(3)} mm.`),
    'Each section is 90° at the design centre on its modes\' mean phase constant; the open ends are shortened by their end extension.',
  ].join('\n');
  drawAsPlaced(doc);
  return doc;
}

/** The pair of mode impedances `modes` on `sub` at f: its geometry and modes through the line-model interface. */
function pairFor(sub: SubstrateSpec, modes: PairModes, f: number): PairAt {
  const family = lineModels.pair();
  const g = family.geometryFor(sub, modes, f);
  return pairAt(family, sub, g.width, g.gap, f);
}
