/**
 * Paths and phase: for a start port and a list of end ports, the route through the network (shortest physical
 * route; isolation parts such as a Wilkinson resistor are only crossed when no line route exists), with its
 * physical length along the centreline, electrical length at f0 and across the band, phase delay, loss at f0, the
 * bends and junctions it passes, and the phase difference to the group's first path against a tolerance
 * (common practice: default ±5°).
 *
 * Electrical length: Σ β(f)·l over the pieces' line lengths, where each piece's pad copper (launch or part pads at
 * its ends) is counted at the piece's own β; a modelled tee's arms count from its reference planes (the shifts at
 * f0, the copper beyond them belongs to the junction), ideal junctions to their centre; lumped parts
 * and S-parameter blocks add no line length and are listed. A line folded back beside itself (a meander's legs) adds
 * the share its coupling gives (folds.ts: coupled-pair modes; the sweep adds the same); the sensitivities leave it out.
 *
 * Sensitivities (the project's own definition): S_x^φ = (x/φ)(∂φ/∂x) for x ∈ {εr, h, W} by central differences of the full line
 * model (static + dispersion) with a relative step of 1e-3, physical lengths held (they are what is made); W scales
 * every width on the path together.
 */
import type { SubstrateSpec } from '../substrate/types.ts';
import { lineModels, type LineModels, type LineOptions } from '../line/index.ts';
import { InputError, describe } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';
import { LineCache } from './lineCache.ts';
import type { SizedDesign, SizedPiece } from './types.ts';
import { namer, nameOf, nodeByName, portNamesText } from '../design/names.ts';
import { foldsOnPathRad } from './folds.ts';

export const DEFAULT_PHASE_TOLERANCE_DEG = 5;

export interface PathEntry {
  to: string;
  /** The end port as people know it: its label, else its id (design/names.ts). */
  toName: string;
  /** Pieces from `from` to `to`, in order. */
  pieces: string[];
  nodes: string[];
  /** Centreline length through corner points and pads, m. */
  physicalLength: number;
  /** Electrical length at f0, degrees. */
  degAtF0: number;
  /** Electrical length at the band's start, f0 and stop, degrees. */
  band: { f: number; deg: number }[];
  /** Phase delay at f0, s. */
  delay: number;
  /** Line loss at f0, dB (conductor + dielectric; mismatch and radiation not included). */
  lossDb: number;
  bends: number;
  junctions: number;
  /** Lumped parts and S-parameter blocks on the path (their phase is not included). */
  parts: string[];
  /** Phase difference to the group's first path at f0, wrapped to ±180°, degrees (0 for the first path). */
  phaseDiffDeg: number;
  /** Same at band start and stop. */
  phaseDiffBandDeg: [number, number];
  /** The wanted phase difference to the first path (the group's offset), degrees; 0 for an in-phase group. */
  targetDeg: number;
  /** |phaseDiffDeg − targetDeg| within the tolerance (always true when the paths are only reported). */
  withinTolerance: boolean;
  /** Relative sensitivity of this path's phase at f0 to εr, h and W. */
  sensitivity: { er: number; h: number; W: number };
}

export interface PathReport {
  from: string;
  /** The start port as people know it: its label, else its id. */
  fromName: string;
  group: string | null;
  name: string;
  toleranceDeg: number;
  /** Whether the paths are meant to match (a phase group) or only reported. */
  matched: boolean;
  paths: PathEntry[];
  /** Largest minus smallest wrapped phase difference at f0, degrees. */
  spreadDeg: number;
  warnings: Warning[];
}

export interface PathOptions {
  toleranceDeg?: number;
  line?: LineOptions;
  /** The line models the pieces' phase is asked of; default those the design was sized with (the core's set unless
   * sizing was given others). */
  models?: LineModels;
  /** Skip the sensitivity analysis (4 extra line evaluations per width). */
  sensitivities?: boolean;
  group?: string | null;
  name?: string;
  /** The paths are meant to match in phase (default true); false reports differences without judging them. */
  matched?: boolean;
  /** Wanted phase difference of each `to` path to the first, degrees at f0 (a phase group's offsetsDeg). */
  offsetsDeg?: number[];
}

const wrap = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;

interface Edge { piece: SizedPiece; to: string; w: number }

function adjacency(sized: SizedDesign): Map<string, Edge[]> {
  const adj = new Map<string, Edge[]>();
  for (const n of sized.nodes) adj.set(n.id, []);
  for (const p of sized.pieces) {
    if (!Number.isFinite(p.width)) continue;
    // Isolation parts are a last resort: a large weight keeps routes on the lines.
    const w = p.kind === 'lumped' ? 1e3 : Math.max(p.span, 1e-9);
    adj.get(p.a)?.push({ piece: p, to: p.b, w });
    adj.get(p.b)?.push({ piece: p, to: p.a, w });
    // A coupled pair also joins its strips by coupling (not by copper): a hop from each end of its first strip to the
    // end beside it, with no line phase of its own (listed among the path's parts, like a lumped part).
    const partner = p.pair && p.pair.strip === 1 ? sized.pieces.find((x) => x.id === p.pair!.partner) : undefined;
    if (partner) {
      const hop: SizedPiece = { ...p, id: `${p.id}~coupling`, kind: 'lumped', span: 0, length: 0, compensations: [] };
      for (const [x, y] of [[p.a, partner.a], [p.b, partner.b]] as const) {
        adj.get(x)?.push({ piece: hop, to: y, w: 1e3 });
        adj.get(y)?.push({ piece: hop, to: x, w: 1e3 });
      }
    }
  }
  return adj;
}

/** Dijkstra from `from`; returns predecessor edges. */
function shortest(adj: Map<string, Edge[]>, from: string): Map<string, { prev: string; piece: SizedPiece } | null> {
  const dist = new Map<string, number>([[from, 0]]);
  const prev = new Map<string, { prev: string; piece: SizedPiece } | null>([[from, null]]);
  const done = new Set<string>();
  // Binary heap of [dist, node].
  const heap: [number, string][] = [[0, from]];
  const push = (x: [number, string]) => {
    heap.push(x);
    let i = heap.length - 1;
    while (i > 0) { const p = (i - 1) >> 1; if (heap[p]![0] <= heap[i]![0]) break; [heap[p], heap[i]] = [heap[i]!, heap[p]!]; i = p; }
  };
  const pop = (): [number, string] => {
    const top = heap[0]!; const last = heap.pop()!;
    if (heap.length) {
      heap[0] = last; let i = 0;
      for (;;) {
        const l = 2 * i + 1, r = l + 1; let m = i;
        if (l < heap.length && heap[l]![0] < heap[m]![0]) m = l;
        if (r < heap.length && heap[r]![0] < heap[m]![0]) m = r;
        if (m === i) break; [heap[m], heap[i]] = [heap[i]!, heap[m]!]; i = m;
      }
    }
    return top;
  };
  while (heap.length) {
    const [d, n] = pop();
    if (done.has(n)) continue;
    done.add(n);
    for (const e of adj.get(n) ?? []) {
      const nd = d + e.w;
      if (nd < (dist.get(e.to) ?? Infinity)) { dist.set(e.to, nd); prev.set(e.to, { prev: n, piece: e.piece }); push([nd, e.to]); }
    }
  }
  return prev;
}

/** Copper length of a piece that lies on a through path: its line length plus the pad copper at its ends. */
export function pathLength(p: SizedPiece): number {
  if (p.kind === 'lumped' || p.kind === 'sparams') return p.span;
  let pads = 0;
  for (const c of p.compensations) if (c.applied && (c.model === 'lumped-pad' || c.model === 'launch-pad')) pads += c.amount_m;
  return p.length + pads;
}

type PhaseFn = (p: SizedPiece, f: number, cache: LineCache, widthScale: number) => number;

/** Copper a modelled tee takes into the junction at the piece's ends (its applied plane shifts), m. */
function teeShifts(p: SizedPiece): number {
  let d = 0;
  for (const c of p.compensations) if (c.applied && c.model === 'tee-planes') d -= c.amount_m;
  return d;
}

/**
 * Copper length of a piece that counts toward a path's phase: its path copper less what modelled tees take into the
 * junction. Every phase on a path (the ledger here, the yield estimate's made boards) counts it this one way.
 */
export function phaseLength(p: SizedPiece): number {
  return pathLength(p) - teeShifts(p);
}

/** Electrical length of a piece's path copper, radians. */
const piecePhase: PhaseFn = (p, f, cache, k) => {
  if (p.kind === 'lumped' || p.kind === 'sparams') return 0;
  const L = phaseLength(p);
  if (p.sections && p.sections.length) {
    const scale = L / p.sections.reduce((s, x) => s + x.length, 0);
    let ph = 0;
    for (const s of p.sections) ph += cache.modeAt(s.width * k, f).beta * s.length * scale;
    return ph;
  }
  return cache.modeAt(p.width * k, f).beta * L;
};

/** Paths from `from` to each of `to`; both name nodes by id or by label (a label shared by two nodes needs the id). */
export function tracePaths(sized: SizedDesign, fromRef: string, toRefs: string[], opts: PathOptions = {}): PathReport {
  const tol = opts.toleranceDeg ?? DEFAULT_PHASE_TOLERANCE_DEG;
  if (!(tol > 0) || !Number.isFinite(tol)) throw new InputError('out-of-range', 'toleranceDeg', 'a phase tolerance above 0°', describe(tol));
  const nodes = new Map(sized.nodes.map((n) => [n.id, n]));
  const known = (ref: string) => { const id = nodeByName(sized.doc, ref) ?? ref; return nodes.has(id) ? id : undefined; };
  const from = known(fromRef);
  if (from === undefined) throw new InputError('bad-choice', 'from', `a port of this design (${portNamesText(sized.doc)}; a label or an id)`, describe(fromRef));
  const to = toRefs.map((t) => {
    const id = known(t);
    if (id === undefined) throw new InputError('bad-choice', 'to', `ports of this design (${portNamesText(sized.doc)}; labels or ids)`, describe(t));
    return id;
  });
  const name = namer(sized.doc);
  const sub: SubstrateSpec = sized.doc.substrate;
  // The lines as sized (as made, when the design says so); the εr and h sensitivities below stay those of plain
  // microstrip (the as-made tables are built for the nominal laminate only).
  const family = (opts.models ?? sized.lineModels ?? lineModels).strip();
  const cache = new LineCache(sub, opts.line ?? sized.lineOptions, family);
  const prev = shortest(adjacency(sized), from);
  const f0 = sized.f0;
  const freqs = [sized.band.start, f0, sized.band.stop];
  const warnings: Warning[] = [];
  const entries: PathEntry[] = [];
  const sens = opts.sensitivities !== false;
  const dx = 1e-3;
  const perturbed = sens ? {
    erUp: new LineCache({ ...sub, er: sub.er * (1 + dx) }, opts.line, family), erDn: new LineCache({ ...sub, er: sub.er * (1 - dx) }, opts.line, family),
    hUp: new LineCache({ ...sub, h: sub.h * (1 + dx) }, opts.line, family), hDn: new LineCache({ ...sub, h: sub.h * (1 - dx) }, opts.line, family),
  } : null;
  for (const t of to) {
    if (!prev.has(t)) {
      warnings.push(warn('phase', `no route from ${name(from)} to ${name(t)}: they are not connected`, { subjects: [from, t], severity: 'error' }));
      continue;
    }
    const pieces: SizedPiece[] = [];
    const route = [t];
    for (let cur = t; ;) {
      const e = prev.get(cur);
      if (!e) break;
      pieces.push(e.piece); route.push(e.prev); cur = e.prev;
    }
    pieces.reverse(); route.reverse();
    let phys = 0, delay = 0, loss = 0;
    const band = freqs.map((f) => ({ f, deg: 0 }));
    const parts: string[] = [];
    for (const p of pieces) {
      phys += pathLength(p);
      if (p.kind === 'lumped' || p.kind === 'sparams') { parts.push(p.id); continue; }
      band.forEach((b) => { b.deg += (piecePhase(p, b.f, cache, 1) * 180) / Math.PI; });
      const L = pathLength(p);
      if (p.sections && p.sections.length) {
        const scale = L / p.sections.reduce((s, x) => s + x.length, 0);
        for (const s of p.sections) { loss += s.lossDbPerM * s.length * scale; delay += cache.modeAt(s.width, f0).delayPerM * s.length * scale; }
      } else if (p.line) { loss += p.line.lossDbPerM * L; delay += p.line.delayPerM * L; }
    }
    // A meander's legs couple: the folds lying on the path add their share (folds.ts, shared with the sweep and equalize).
    const onPath = new Set(pieces.map((p) => p.id));
    band.forEach((b) => { b.deg += (foldsOnPathRad(sized, onPath, b.f) * 180) / Math.PI; });
    let bends = 0, junctions = 0;
    for (const id of route.slice(1, -1)) {
      const n = nodes.get(id)!;
      if (n.bend && n.bend.turn > 1e-6) bends++;
      if (n.kind === 'junction') junctions++;
    }
    const phi0 = band[1]!.deg;
    const phase = (c: LineCache, k: number) => pieces.reduce((s, p) => s + piecePhase(p, f0, c, k), 0);
    const sensitivity = perturbed && phi0 > 0 ? {
      er: (phase(perturbed.erUp, 1) - phase(perturbed.erDn, 1)) / (2 * dx) / ((phi0 * Math.PI) / 180),
      h: (phase(perturbed.hUp, 1) - phase(perturbed.hDn, 1)) / (2 * dx) / ((phi0 * Math.PI) / 180),
      W: (phase(cache, 1 + dx) - phase(cache, 1 - dx)) / (2 * dx) / ((phi0 * Math.PI) / 180),
    } : { er: 0, h: 0, W: 0 };
    entries.push({
      to: t, toName: name(t), pieces: pieces.map((p) => p.id), nodes: route, physicalLength: phys, degAtF0: phi0, band, delay, lossDb: loss,
      bends, junctions, parts, phaseDiffDeg: 0, phaseDiffBandDeg: [0, 0], targetDeg: opts.offsetsDeg?.[to.indexOf(t)] ?? 0, withinTolerance: true, sensitivity,
    });
  }
  const ref = entries[0];
  const matched = opts.matched !== false;
  let lo = 0, hi = 0;
  for (const e of entries) {
    if (!ref) break;
    e.phaseDiffDeg = wrap(e.degAtF0 - ref.degAtF0);
    e.phaseDiffBandDeg = [wrap(e.band[0]!.deg - ref.band[0]!.deg), wrap(e.band[2]!.deg - ref.band[2]!.deg)];
    // Against the wanted offset (0 for an in-phase group), measured from the first path's own offset.
    const miss = wrap(e.phaseDiffDeg - (e.targetDeg - ref.targetDeg));
    e.withinTolerance = !matched || Math.abs(miss) <= tol;
    lo = Math.min(lo, e.phaseDiffDeg); hi = Math.max(hi, e.phaseDiffDeg);
    if (e === ref || !matched) continue;
    if (!e.withinTolerance) {
      const wanted = e.targetDeg - ref.targetDeg;
      const aim = wanted === 0 ? '' : ` (wanted ${wanted.toFixed(1)}°)`;
      warnings.push(warn('phase', `path ${name(from)} → ${e.toName} is ${e.phaseDiffDeg.toFixed(1)}° from ${name(from)} → ${ref.toName} at f0${aim}, outside ±${tol}°; ${miss > 0 ? 'shorten' : 'lengthen'} it by ${Math.abs(miss).toFixed(1)}° or balance the two`, { subjects: [e.to, ref.to, ...e.pieces], severity: 'warning' }));
    }
    const physDiff = Math.abs(e.physicalLength - ref.physicalLength);
    const lg = pieceLambda(sized, e.pieces);
    if (lg > 0 && physDiff > lg / 8) {
      warnings.push(warn('phase', `paths to ${e.toName} and ${ref.toName} differ by ${(physDiff * 1e3).toFixed(2)} mm (more than λg/8): they match at f0 only, by ${e.phaseDiffBandDeg[0].toFixed(1)}° / ${e.phaseDiffBandDeg[1].toFixed(1)}° at the band edges, and their difference follows εr`, { subjects: [e.to, ref.to], severity: 'info' }));
    }
    if (e.bends !== ref.bends) {
      warnings.push(warn('phase', `paths to ${e.toName} and ${ref.toName} pass ${e.bends} and ${ref.bends} bends; equal bend counts let the bends' residual errors cancel`, { subjects: [e.to, ref.to], severity: 'info' }));
    }
  }
  return { from, fromName: name(from), group: opts.group ?? null, name: opts.name ?? `${name(from)} → ${to.map(name).join(', ')}`, toleranceDeg: tol, matched, paths: entries, spreadDeg: hi - lo, warnings };
}

function pieceLambda(sized: SizedDesign, ids: string[]): number {
  for (const id of ids) {
    const p = sized.pieces.find((x) => x.id === id);
    if (p?.line) return p.line.lambdaG;
  }
  return 0;
}

function portsOf(sized: SizedDesign): string[] { return sized.nodes.filter((n) => n.kind === 'port').map((n) => n.id); }

/**
 * The design's phase groups, or — when it has none — one report from the anchor port to every other port.
 */
export function designPaths(sized: SizedDesign, opts: PathOptions = {}): PathReport[] {
  const groups = sized.doc.phaseGroups ?? [];
  if (groups.length) {
    return groups.map((g) => tracePaths(sized, g.from, g.to, { ...opts, toleranceDeg: opts.toleranceDeg ?? g.toleranceDeg, group: g.id, name: g.name, ...(g.offsetsDeg ? { offsetsDeg: g.offsetsDeg } : {}) }));
  }
  const ports = portsOf(sized);
  const from = sized.anchor && ports.includes(sized.anchor) ? sized.anchor : ports[0];
  if (!from || ports.length < 2) return [];
  return [tracePaths(sized, from, ports.filter((p) => p !== from), { matched: false, ...opts, name: `${nameOf(sized.doc, from)} → other ports (not a phase group)` })];
}
