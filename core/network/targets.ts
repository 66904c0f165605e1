/**
 * Targets evaluated on a response: the one function behind pass/fail in `build`, the response panel, tuning goals
 * and the yield masks (core/design/targets.ts has the schema and the meaning of each figure). For every target the
 * figure is computed at each sweep point inside its band, the point with the least margin to the limit is the worst,
 * and the target passes when that margin is not negative. Definitions of the figures are the usual ones of the trade
 * (D. M. Pozar, Microwave Engineering, 4th ed., §4.3: return loss, insertion loss; balance and isolation as in
 * figures.ts; group delay τg = −dφ/dω by central differences on the sweep's points, as figures.ts computes it).
 */
import { InputError } from '../util/errors.ts';
import { hypot } from '../util/hypot.ts';
import type { DesignDoc, Target, TargetFigure } from '../design/types.ts';
import { FIGURE_UNIT_SUFFIX, FIGURE_WORDS, type FigureUnit } from '../design/targets.ts';
import { entryAt, type NetworkResponse } from './response.ts';
import { sweepFrequencies, type SweepSettings } from './sweep.ts';
import { groupDelay, toDb, wrap180 } from './figures.ts';

export interface TargetResult {
  id: string;
  name: string;
  figure: TargetFigure;
  unit: FigureUnit;
  /** The limit in words, e.g. "≥ 15 dB" or "≤ 2°". */
  limitText: string;
  pass: boolean;
  /** The figure at the point with the least margin, and that point's frequency (Hz). */
  worst: { value: number; freq: number };
  /** Distance of the worst point from the limit, in the figure's unit; ≥ 0 passes. */
  margin: number;
  /** Sweep points inside the band. */
  points: number;
}

export interface TargetEvaluation { pass: boolean; results: TargetResult[] }

/** Relative slack on band edges, so a sweep point computed as start + k·step still counts as on the edge. */
const EDGE = 1e-12;

/**
 * Sweep frequencies that serve the targets: the given sweep plus every target band's edges (sorted, without
 * duplicates), so a one-frequency target is always evaluated exactly at its frequency.
 */
export function targetFrequencies(settings: SweepSettings, targets: readonly Target[]): Float64Array {
  const base = sweepFrequencies(settings);
  const all = [...base];
  for (const t of targets) all.push(t.band.start, t.band.stop);
  all.sort((a, b) => a - b);
  const out: number[] = [];
  for (const f of all) if (!out.length || f > out[out.length - 1]! * (1 + EDGE)) out.push(f);
  return Float64Array.from(out);
}

/** Index of a port by its node id in a response (ports are named by node id). */
function port(r: NetworkResponse, id: string, field: string): number {
  const k = r.ports.findIndex((p) => p.name === id);
  if (k < 0) throw new InputError('bad-choice', field, `a port of this network (${r.ports.map((p) => p.name).join(', ')})`, JSON.stringify(id));
  return k;
}

function sMag(r: NetworkResponse, k: number, i: number, j: number): number {
  const t = offset(r, k, i, j);
  return hypot(r.s[t]!, r.s[t + 1]!);
}

/** Offset of S_ij at point k in r.s (the dense layout, or a sweep of some entries: response.ts entryAt). */
function offset(r: NetworkResponse, k: number, i: number, j: number): number {
  if (!r.computed) { const P = r.ports.length; return 2 * ((k * P + i) * P + j); }
  const { base, stride } = entryAt(r, i, j);
  return base + k * stride;
}

function sDeg(r: NetworkResponse, k: number, i: number, j: number): number {
  const t = offset(r, k, i, j);
  return (Math.atan2(r.s[t + 1]!, r.s[t]!) * 180) / Math.PI;
}

/** The figure of one target at sweep point k. */
type PointFigure = (k: number) => number;

function figureAt(r: NetworkResponse, t: Target, doc: Pick<DesignDoc, 'phaseGroups'>, at: string): PointFigure {
  const ports = t.ports ?? [];
  switch (t.figure) {
    case 'return-loss': { const p = port(r, ports[0] ?? '', `${at}.ports[0]`); return (k) => -toDb(sMag(r, k, p, p)); }
    case 'insertion-loss': case 'transmission': case 'transmission-phase': {
      const a = port(r, ports[0] ?? '', `${at}.ports[0]`), b = port(r, ports[1] ?? '', `${at}.ports[1]`);
      if (t.figure === 'insertion-loss') return (k) => -toDb(sMag(r, k, b, a));
      if (t.figure === 'transmission') return (k) => toDb(sMag(r, k, b, a));
      const mid = middle(t);
      return (k) => mid + wrap180(sDeg(r, k, b, a) - mid);
    }
    case 'isolation': {
      const a = port(r, ports[0] ?? '', `${at}.ports[0]`), b = port(r, ports[1] ?? '', `${at}.ports[1]`);
      return (k) => -toDb(sMag(r, k, a, b));
    }
    case 'group-delay-flatness': {
      // Each point's rise above the least group delay in the band, ns: the worst point reads the peak-to-peak.
      const a = port(r, ports[0] ?? '', `${at}.ports[0]`), b = port(r, ports[1] ?? '', `${at}.ports[1]`);
      const tau = groupDelay(r, b, a);
      const lo = t.band.start * (1 - EDGE), hi = t.band.stop * (1 + EDGE);
      let least = Infinity;
      for (let k = 0; k < r.freqs.length; k++) if (r.freqs[k]! >= lo && r.freqs[k]! <= hi && tau[k]! < least) least = tau[k]!;
      return (k) => (tau[k]! - least) * 1e9;
    }
    case 'amplitude-balance': case 'phase-balance': case 'phase-spread': {
      const g = doc.phaseGroups.find((x) => x.id === t.group);
      if (!g) throw new InputError('bad-choice', `${at}.group`, 'the id of a phase group of this design', JSON.stringify(t.group));
      const from = port(r, g.from, `${at}.group`);
      const outs = g.to.map((id) => port(r, id, `${at}.group`));
      const off = g.to.map((_, i) => g.offsetsDeg?.[i] ?? 0);
      if (t.figure === 'amplitude-balance') {
        return (k) => {
          let lo = Infinity, hi = -Infinity;
          for (const o of outs) { const d = toDb(sMag(r, k, o, from)); if (d < lo) lo = d; if (d > hi) hi = d; }
          return outs.length ? hi - lo : 0;
        };
      }
      // Phases relative to the first output, wrapped into (−180°, 180°]. A group's offset is extra electrical length
      // (core/design/types.ts PhaseGroup), so that output's ∠S is expected that much lower: it is added back.
      const rel = (k: number, i: number) => wrap180(sDeg(r, k, outs[i]!, from) - sDeg(r, k, outs[0]!, from) + (off[i]! - off[0]!));
      if (t.figure === 'phase-balance') {
        return (k) => { let m = 0; for (let i = 1; i < outs.length; i++) m = Math.max(m, Math.abs(rel(k, i))); return m; };
      }
      return (k) => {
        let lo = 0, hi = 0;
        for (let i = 1; i < outs.length; i++) { const x = rel(k, i); if (x < lo) lo = x; if (x > hi) hi = x; }
        return hi - lo;
      };
    }
  }
}

/** The middle of a phase limit: the value a phase is read around (±180°). */
function middle(t: Target): number {
  const { min, max } = t.limit;
  return min !== undefined && max !== undefined ? (min + max) / 2 : (min ?? max ?? 0);
}

function margin(t: Target, v: number): number {
  const { min, max } = t.limit;
  let m = Infinity;
  if (max !== undefined) m = Math.min(m, max - v);
  if (min !== undefined) m = Math.min(m, v - min);
  return m;
}

export function limitText(t: Target): string {
  const u = FIGURE_UNIT_SUFFIX[FIGURE_WORDS[t.figure].unit];
  const { min, max } = t.limit;
  if (min !== undefined && max !== undefined) return `${min} … ${max}${u}`;
  return min !== undefined ? `≥ ${min}${u}` : `≤ ${max}${u}`;
}

/** The words of a target, e.g. "return loss at in ≥ 15 dB, 2.4–2.5 GHz". */
export function targetText(t: Target, name: (id: string) => string = (id) => id): string {
  const what = FIGURE_WORDS[t.figure].name;
  const who = t.group !== undefined ? ` of ${name(t.group)}` : t.ports?.length === 1 ? ` at ${name(t.ports[0]!)}` : t.ports?.length === 2 ? ` ${name(t.ports[0]!)}→${name(t.ports[1]!)}` : '';
  const ghz = (f: number) => `${+(f / 1e9).toPrecision(6)}`;
  const band = t.band.start === t.band.stop ? `at ${ghz(t.band.start)} GHz` : `${ghz(t.band.start)}–${ghz(t.band.stop)} GHz`;
  return `${what}${who} ${limitText(t)}, ${band}`;
}

/**
 * Evaluates the design's targets on a response whose ports are named by node id (netlistFromSized names them so).
 * Throws InputError naming `targets[i]` when a target's band holds no sweep point or it names a port or group the
 * response lacks. Nothing NaN or infinite is returned: |S| = 0 reads as the −400 dB floor of figures.ts.
 */
export function evaluateTargets(r: NetworkResponse, doc: Pick<DesignDoc, 'targets' | 'phaseGroups'>): TargetEvaluation {
  const results = doc.targets.map((t, i) => prepareTarget(r, t, doc, `targets[${i}]`)());
  return { pass: results.every((x) => x.pass), results };
}

/**
 * evaluateTargets in two steps, for many responses on one grid (the yield estimate solves every made board into one
 * buffer): the figures, bands and words are set up once for `r`'s ports and frequencies, and each call of the returned
 * function reads `r.s` as it is then. Same checks, same arithmetic and same results as evaluateTargets.
 */
export function prepareTargets(r: NetworkResponse, doc: Pick<DesignDoc, 'targets' | 'phaseGroups'>): () => TargetEvaluation {
  const each = doc.targets.map((t, i) => prepareTarget(r, t, doc, `targets[${i}]`));
  return () => {
    const results = each.map((run) => run());
    return { pass: results.every((x) => x.pass), results };
  };
}

export function evaluateTarget(r: NetworkResponse, t: Target, doc: Pick<DesignDoc, 'phaseGroups'>, at = 'target'): TargetResult {
  return prepareTarget(r, t, doc, at)();
}

function prepareTarget(r: NetworkResponse, t: Target, doc: Pick<DesignDoc, 'phaseGroups'>, at: string): () => TargetResult {
  const fig = figureAt(r, t, doc, at);
  const lo = t.band.start * (1 - EDGE), hi = t.band.stop * (1 + EDGE);
  const name = t.name ?? targetText(t), unit = FIGURE_WORDS[t.figure].unit, text = limitText(t);
  return () => {
    let worstM = Infinity, worstV = 0, worstF = 0, points = 0;
    for (let k = 0; k < r.freqs.length; k++) {
      const f = r.freqs[k]!;
      if (f < lo || f > hi) continue;
      points++;
      const v = fig(k), m = margin(t, v);
      if (m < worstM) { worstM = m; worstV = v; worstF = f; }
    }
    if (points === 0) {
      throw new InputError('out-of-range', `${at}.band`, `a band that holds at least one sweep point (${(r.freqs[0]! / 1e9).toPrecision(6)}–${(r.freqs[r.freqs.length - 1]! / 1e9).toPrecision(6)} GHz)`,
        `${t.band.start}–${t.band.stop} Hz`, 'sweep over the target band (targetFrequencies adds every band edge)');
    }
    return {
      id: t.id, name, figure: t.figure, unit, limitText: text,
      pass: worstM >= 0, worst: { value: worstV, freq: worstF }, margin: worstM, points,
    };
  };
}
