/**
 * Fitting a block into an optional footprint (width × height): a block whose copper already fits is left alone; one
 * that fits turned a quarter turn is turned; a row of pieces (a chain from one port to the other, as the
 * transformer, the stepped low-pass and the launch are) is folded into a serpentine whose turns are pairs of
 * mitered bends, each bend inside one line, so sizing compensates it (core/layout's bend model, as the meanders of
 * equalize use) and every piece keeps its electrical length (its degrees, or its length, shared between its parts).
 * A block with branches folds its bridge lines (fold-branched.ts: tabs, ells and hooks of mitered bends, each folded
 * run's phase kept). What still does not fit is refused, naming the footprint it needs as laid out and as folded (or,
 * for a row of outputs set by a pitch, the largest pitch that fits).
 *
 * Runs of the serpentine keep an edge-to-edge gap of at least the shop check's proximity limit (3h by default,
 * core/layout/proximity.ts: the distance beyond which the single-line model is taken to hold, common practice), so
 * the fold adds no coupling the sweep does not model.
 */
import type { DesignDoc, DesignNode, DesignSegment } from '../design/types.ts';
import type { Vec2 } from '../geometry/types.ts';
import { pieceOutlines } from '../layout/geometry.ts';
import { DEFAULT_PROXIMITY_LIMIT_H } from '../layout/proximity.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { InputError } from '../util/errors.ts';
import type { ParamDef, ParamValue } from './params.ts';
import { placeAsSized } from './drawn.ts';
import { foldBranched } from './fold-branched.ts';

/** The optional footprint every block with long lines declares. */
export const FOOTPRINT_PARAM: ParamDef = {
  name: 'footprint', type: 'list', unit: 'length', max: 2, optional: true,
  meaning: 'Area the block must fit, width,height (long rows fold into mitered turns; empty = no limit)',
};

export interface Footprint { w: number; h: number }

/** The footprint of a checked spec, or null; refuses anything but two positive lengths. */
export function footprintOf(spec: Record<string, ParamValue>, kind: string): Footprint | null {
  const v = spec.footprint as number[] | undefined;
  if (v === undefined || v.length === 0) return null;
  if (v.length !== 2 || !v.every((x) => x > 0 && x <= 1)) {
    throw new InputError('out-of-range', `${kind}.footprint`, 'two lengths above 0 and at most 1 m: width,height (e.g. 40mm,25mm)', v.join(', '), 'give the width and the height of the area, separated by a comma');
  }
  return { w: v[0]!, h: v[1]! };
}

/** Width and height of the copper of `doc` as sized (pieces and node patches before their union), m. */
export function copperSize(doc: DesignDoc): { w: number; h: number } {
  const { outlines } = pieceOutlines(sizeDesign(doc));
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const o of outlines) for (const r of o.regions) for (const p of r.outer) {
    x0 = Math.min(x0, p.x); x1 = Math.max(x1, p.x); y0 = Math.min(y0, p.y); y1 = Math.max(y1, p.y);
  }
  return Number.isFinite(x0) ? { w: x1 - x0, h: y1 - y0 } : { w: 0, h: 0 };
}

const fits = (s: { w: number; h: number }, fp: Footprint) => s.w <= fp.w + 1e-9 && s.h <= fp.h + 1e-9;
// Rounded up to 0.1 mm (less a hair, so 72 mm is not read as 72.1 mm from 0.072·10⁴ = 720.0000000001).
const mm = (x: number) => `${(Math.ceil(x * 1e4 - 1e-6) / 10).toFixed(1)} mm`;

/**
 * Makes `doc` (a placed block) fit `fp`, in place. Returns a note saying what was done, or null when nothing was
 * needed. Refuses, naming the footprint the block needs, when neither turning nor folding makes it fit.
 */
export function fitFootprint(doc: DesignDoc, kind: string, fp: Footprint, opts: { pitchRow?: boolean } = {}): string | null {
  const size = copperSize(doc);
  if (fits(size, fp)) return null;
  if (fits({ w: size.h, h: size.w }, fp)) { turnQuarter(doc); return `Turned a quarter turn to fit the ${mm(fp.w)} × ${mm(fp.h)} footprint.`; }
  const chain = chainOf(doc);
  const need = `a footprint of at least ${mm(size.w)} × ${mm(size.h)} (its copper as laid out)`;
  if (!chain) return fitBranched(doc, kind, fp, size, opts.pitchRow ?? false);
  // Fold along the footprint's longer side; the runs are shortened until the copper (pads, bends) fits.
  const wide = fp.w >= fp.h;
  const along = wide ? fp.w : fp.h, across = wide ? fp.h : fp.w;
  const original = clone({ nodes: doc.nodes, segments: doc.segments });
  let run = along - chain.wMax, best: { w: number; h: number } | null = null;
  for (let attempt = 0; attempt < 5 && run > 3 * chain.wMax; attempt++) {
    doc.nodes = clone(original.nodes); doc.segments = clone(original.segments);
    let rows: number;
    try { rows = serpentine(doc, chain, run, kind); } catch (e) { if (e instanceof InputError) break; throw e; }
    if (!wide) turnQuarter(doc);
    const got = copperSize(doc);
    const gotAlong = wide ? got.w : got.h, gotAcross = wide ? got.h : got.w;
    best = got;
    if (gotAlong <= along + 1e-9 && gotAcross <= across + 1e-9) {
      return `Folded into ${rows} rows of mitered turns (compensated bends; electrical lengths kept) to fit the ${mm(fp.w)} × ${mm(fp.h)} footprint; its copper is ${mm(got.w)} × ${mm(got.h)}.`;
    }
    if (gotAcross > across + 1e-9) break; // too many rows already: shorter runs only add rows
    run -= gotAlong - along + 1e-5;
  }
  doc.nodes = original.nodes; doc.segments = original.segments;
  throw new InputError('out-of-range', `${kind}.footprint`,
    `${need}${best ? `, or folded ${mm(wide ? fp.w : fp.h)} ${wide ? 'wide' : 'high'}, about ${mm(wide ? best.h : best.w)} ${wide ? 'high' : 'wide'}` : ''}`,
    `${mm(fp.w)} × ${mm(fp.h)}`, 'give a larger footprint (the folded rows keep a gap of 3 substrate heights apart), or leave it empty');
}

/**
 * A block with branches (tees, a ring, stubs): its bridge lines fold (fold-branched.ts), unturned or turned a quarter
 * turn, whichever fits. Refused when a row of outputs set by the spec's pitch is longer than the footprint (no fold
 * brings them closer: the refusal names the largest pitch that fits), or when the folds cannot reach the footprint:
 * the refusal then names the smallest footprint the block does fit, as laid out and as folded.
 */
function fitBranched(doc: DesignDoc, kind: string, fp: Footprint, size: { w: number; h: number }, pitchRow: boolean): string {
  const got = `${mm(fp.w)} × ${mm(fp.h)}`;
  const need = `a footprint of at least ${mm(size.w)} × ${mm(size.h)} (its copper as laid out)`;
  const pitch = pitchRow ? pitchBound(doc, size, fp) : null;
  if (pitch) throw new InputError('out-of-range', `${kind}.footprint`, need, got, pitch);
  const tries: { turned: boolean; size: { w: number; h: number } }[] = [];
  for (const turned of [false, true]) {
    const work = { ...doc, nodes: clone(doc.nodes), segments: clone(doc.segments) };
    if (turned) { turnQuarter(work); placeAsSized(work, kind); }
    const r = foldBranched(work, kind, fp);
    if (r.fits) {
      doc.nodes = work.nodes; doc.segments = work.segments;
      headPorts(doc);
      return `Folded ${r.folded} line${r.folded === 1 ? '' : 's'} (mitered bends, compensated; electrical lengths kept${turned ? '; turned a quarter turn' : ''}) to fit the ${got} footprint; its copper is ${mm(r.size.w)} × ${mm(r.size.h)}.`;
    }
    tries.push({ turned, size: r.size });
  }
  // The smallest the folds reached (by area), checked to fold into itself again, is named with the size as laid out.
  const best = tries.sort((a, b) => a.size.w * a.size.h - b.size.w * b.size.h)[0]!;
  // The folds aim at the footprint asked, so a slightly different one may fold differently: the footprint named is
  // the first of a few, from the size reached up, that folds again (checked here, so what is named does fit).
  let named: { w: number; h: number } | null = null;
  for (const extra of [0, 1e-3]) {
    const fp2 = { w: Math.ceil((best.size.w + extra) * 1e4) / 1e4, h: Math.ceil((best.size.h + extra) * 1e4) / 1e4 };
    if (fp2.w * fp2.h >= size.w * size.h - 1e-9) break;
    const check = { ...doc, nodes: clone(doc.nodes), segments: clone(doc.segments) };
    if (best.turned) { turnQuarter(check); placeAsSized(check, kind); }
    if (foldBranched(check, kind, fp2).fits) { named = fp2; break; }
  }
  const folded = named !== null;
  throw new InputError('out-of-range', `${kind}.footprint`,
    `${need}${named ? `, or folded, at least ${mm(named.w)} × ${mm(named.h)}` : ''}`, got,
    `its lines that lead to ports, stubs and junctions fold into U-turns of mitered bends, keeping 3 substrate heights between runs, but not enough for this footprint${folded ? '' : ' (folding does not make it smaller)'}; lines inside a loop (a ring, a divider's arms) keep their shape; give a larger footprint or leave it empty`);
}

/**
 * Outputs spread along one row (a feed's; `pitchRow` for blocks with a pitch parameter) are set apart by the spec's pitch: when the row is longer than the
 * footprint's longer side, no fold helps. Says so in numbers, naming the largest pitch that fits; else null.
 */
function pitchBound(doc: DesignDoc, size: { w: number; h: number }, fp: Footprint): string | null {
  const long = Math.max(fp.w, fp.h), short = Math.min(fp.w, fp.h);
  const outs = doc.nodes.filter((n) => n.kind === 'port').slice(1);
  if (outs.length < 2) return null;
  const sized = sizeDesign(doc);
  const wMax = Math.max(0, ...sized.pieces.map((p) => (Number.isFinite(p.width) ? p.width : 0)));
  const xs = outs.map((n) => n.at.x), ys = outs.map((n) => n.at.y);
  const alongX = Math.max(...xs) - Math.min(...xs) >= Math.max(...ys) - Math.min(...ys);
  const spread = alongX ? Math.max(...xs) - Math.min(...xs) : Math.max(...ys) - Math.min(...ys);
  const rowLen = alongX ? size.w : size.h, depth = alongX ? size.h : size.w;
  if (!(spread + wMax > long + 1e-9)) return null;
  const fit = Math.floor(((long - (rowLen - spread)) / (outs.length - 1)) * 1e4) / 10;
  const deep = depth > short + 1e-9 ? `; its depth, ${mm(depth)}, does not fit ${mm(short)} either` : '';
  return `its ${outs.length} outputs are ${mm(spread)} apart end to end on their row, set by the pitch; folding lines cannot bring them closer${deep}` +
    (fit > 0 ? `: a pitch of at most ${fit.toFixed(1)} mm fits ${mm(long)}` : '') + '; give a larger footprint or leave it empty';
}

interface Chain {
  /** Node ids from one port to the other, and the segment between each pair. */
  nodes: string[];
  segs: string[];
  /** Widest copper along it (pieces and pads), m. */
  wMax: number;
  /** Copper width of each segment, m. */
  widths: Map<string, number>;
  /** Launch pad width of a port, m. */
  pads: Map<string, number>;
}

/** The design as one row from a port to a port with no branches (every inner node has two pieces), else null. */
function chainOf(doc: DesignDoc): Chain | null {
  const ports = doc.nodes.filter((n) => n.kind === 'port');
  if (ports.length !== 2 || doc.segments.length === 0) return null;
  const touching = (id: string) => doc.segments.filter((s) => s.a === id || s.b === id);
  if (doc.nodes.some((n) => touching(n.id).length !== (n.kind === 'port' ? 1 : 2))) return null;
  const nodes = [ports[0]!.id], segs: string[] = [];
  while (segs.length < doc.segments.length) {
    const here = nodes[nodes.length - 1]!;
    const s = touching(here).find((x) => !segs.includes(x.id));
    if (!s) return null;
    segs.push(s.id); nodes.push(s.a === here ? s.b : s.a);
  }
  const sized = sizeDesign(doc);
  const widths = new Map(sized.pieces.map((p) => [p.id, Math.max(p.width, p.widthB ?? 0)]));
  const pads = new Map(doc.nodes.flatMap((n) => (n.kind === 'port' && n.launch ? [[n.id, n.launch.padWidth] as const] : [])));
  return { nodes, segs, widths, pads, wMax: Math.max(...widths.values(), ...pads.values()) };
}

/**
 * Lays the chain out as rows `run` long at most, joined by U-turns (two mitered bends a row pitch apart), and places
 * it as sized. Bends keep clear of every node (see `clear`) (steps, pads and ports need their straight copper).
 * Returns the number of rows.
 */
function serpentine(doc: DesignDoc, chain: Chain, run: number, kind: string): number {
  const at = new Map(doc.nodes.map((n) => [n.id, n.at]));
  const s: number[] = [0];
  for (let i = 1; i < chain.nodes.length; i++) {
    const p = at.get(chain.nodes[i - 1]!)!, q = at.get(chain.nodes[i]!)!;
    s.push(s[i - 1]! + Math.hypot(q.x - p.x, q.y - p.y));
  }
  const total = s[s.length - 1]!;
  const pitch = chain.wMax + DEFAULT_PROXIMITY_LIMIT_H * doc.substrate.h * 1.05;
  // A bend keeps clear of each node by half its own line's width, half the node's widest copper and 0.5 mm of
  // straight line between them (steps, pads and ports keep their own straight copper; our choice).
  const segW = chain.segs.map((id) => chain.widths.get(id) ?? chain.wMax);
  const nodeW = chain.nodes.map((_, i) => Math.max(segW[i - 1] ?? 0, segW[i] ?? 0, chain.pads.get(chain.nodes[i]!) ?? 0));
  const widthAt = (x: number) => segW[Math.max(0, s.findIndex((si, i) => i > 0 && x <= si) - 1)] ?? chain.wMax;
  const clear = (x: number) => s.every((si, i) => Math.abs(si - x) >= (widthAt(x) + nodeW[i]!) / 2 + 0.5e-3);
  const keep = 0.5e-3;
  // Arc-length positions of the bends, in pairs.
  const bends: number[] = [];
  // Every row stays between x = 0 (the first port) and x = run: even rows run forward, odd rows back.
  let start = 0, rows = 1, x = 0;
  for (;;) {
    const room = rows % 2 === 1 ? run - x : x;
    if (total - start <= room) break;
    let b = start + room;
    while (b > start + keep && !(clear(b) && clear(b + pitch))) b -= 0.05e-3;
    if (b <= start + keep || b + pitch >= total - keep) {
      throw new InputError('out-of-range', `${kind}.footprint`, 'room for a turn between the pieces of the row', `runs of ${mm(run)}`, 'give a wider footprint');
    }
    x += (rows % 2 === 1 ? 1 : -1) * (b - start);
    bends.push(b, b + pitch);
    start = b + pitch; rows++;
  }
  // Split every segment at the bends inside it; parts share its degrees (or length) in proportion.
  const segById = new Map(doc.segments.map((x) => [x.id, x]));
  const newSegs: DesignSegment[] = [], newNodes: DesignNode[] = [];
  const arcOf = new Map<string, number>(chain.nodes.map((id, i) => [id, s[i]!]));
  chain.segs.forEach((id, i) => {
    const seg = segById.get(id)!;
    const s0 = s[i]!, s1 = s[i + 1]!;
    const inside = bends.filter((b) => b > s0 && b < s1);
    if (!inside.length) { newSegs.push(seg); return; }
    if (seg.kind !== 'line' || seg.length.by === 'drawn') throw new InputError('out-of-range', `${kind}.footprint`, 'turns only in lines of a given length', `a turn in ${id}`, 'give a wider footprint');
    const cuts = [s0, ...inside, s1];
    const from = seg.a === chain.nodes[i] ? seg.a : seg.b, to = from === seg.a ? seg.b : seg.a;
    let prev = from;
    for (let k = 0; k < cuts.length - 1; k++) {
      const frac = (cuts[k + 1]! - cuts[k]!) / (s1 - s0);
      const next = k === cuts.length - 2 ? to : `${id}.turn${k + 1}`;
      if (next !== to) { newNodes.push({ id: next, kind: 'vertex', bend: { style: 'miter-optimal' }, at: { x: 0, y: 0 } }); arcOf.set(next, cuts[k + 1]!); }
      const length = seg.length.by === 'degrees' ? { by: 'degrees' as const, deg: round9(seg.length.deg * frac) } : { by: 'length' as const, length: round9(seg.length.length * frac) };
      newSegs.push({ ...seg, id: k === 0 ? id : `${id}.part${k + 1}`, a: prev, b: next, length });
      prev = next;
    }
  });
  doc.segments = newSegs;
  doc.nodes = [...doc.nodes, ...newNodes];
  // Rough positions along the serpentine (sizing then places every node exactly).
  const origin = at.get(chain.nodes[0]!)!, second = at.get(chain.nodes[1]!)!;
  const d0 = unit({ x: second.x - origin.x, y: second.y - origin.y }), down = { x: d0.y, y: -d0.x };
  const pointAt = (x: number): Vec2 => {
    let p = origin, dir = d0, last = 0, k = 0;
    for (const b of bends) {
      if (x <= b) break;
      p = { x: p.x + dir.x * (b - last), y: p.y + dir.y * (b - last) };
      last = b;
      dir = k % 2 === 0 ? down : { x: (Math.floor(k / 2) % 2 === 0 ? -1 : 1) * d0.x, y: (Math.floor(k / 2) % 2 === 0 ? -1 : 1) * d0.y };
      k++;
    }
    return { x: p.x + dir.x * (x - last), y: p.y + dir.y * (x - last) };
  };
  doc.nodes = doc.nodes.map((n) => { const x = arcOf.get(n.id); return x === undefined ? n : { ...n, at: pointAt(x) }; });
  placeAsSized(doc, kind);
  headPorts(doc);
  return rows;
}

/** Each port faces along its line (from the port into the block), after a fold or a turn. */
function headPorts(doc: DesignDoc): void {
  const pos = new Map(doc.nodes.map((n) => [n.id, n.at]));
  for (const n of doc.nodes) {
    if (n.kind !== 'port') continue;
    const s = doc.segments.find((x) => x.a === n.id || x.b === n.id);
    const o = s && pos.get(s.a === n.id ? s.b : s.a);
    if (o) n.heading = Math.atan2(o.y - n.at.y, o.x - n.at.x);
  }
}

/** Turns the drawing a quarter turn about the origin (port headings too). */
function turnQuarter(doc: DesignDoc): void {
  for (const n of doc.nodes) {
    n.at = { x: round9(-n.at.y), y: round9(n.at.x) };
    if (n.kind === 'port') n.heading = Math.atan2(Math.sin(n.heading + Math.PI / 2), Math.cos(n.heading + Math.PI / 2));
  }
}

function unit(v: Vec2): Vec2 { const l = Math.hypot(v.x, v.y) || 1; return { x: v.x / l, y: v.y / l }; }
function round9(x: number): number { return Math.round(x * 1e9) / 1e9; }
/** Design records are plain JSON data. */
function clone<T>(x: T): T { return JSON.parse(JSON.stringify(x)) as T; }
