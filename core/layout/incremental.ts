/**
 * The live layout of a design being edited a little at a time (a bend dragged): sizing and each piece's copper,
 * redoing only what the edit changed.
 *
 * - Sizing: every step runs as in sizeDesign except the ends (the costly one: tee planes, open ends, vias, miters),
 *   which are memoised per node by the node's own inputs (sizing/end-memo.ts). The sized design is bit for bit the
 *   one sizeDesign gives for the same document (test/unit/layout-incremental.test.ts, random drags of every example).
 * - Copper: a piece or node whose sizing inputs are unchanged and whose placed nodes all moved by one vector (the
 *   copper below a moved bend) keeps its outline, translated; one whose nodes did not move keeps the very same
 *   outline object; the rest are drawn afresh (geometry.ts pieceOutline, nodeOutline). Translated outlines agree with
 *   freshly drawn ones to rounding (about 1e-15 m), not to the bit: the live view uses them; outputs and the shop
 *   check size and draw the settled design afresh (core/pipeline), so no file ever carries them.
 * - No union of the board's copper and no shop check: those belong to the settled design.
 */
import type { DesignDoc } from '../design/types.ts';
import type { DrillHit, Region, Vec2 } from '../geometry/types.ts';
import { sizeWithEnds, type SizeOptions } from './sizing.ts';
import { sizeEndsMemo, type EndMemo } from './sizing/end-memo.ts';
import { nodeOutline, outlineSite, pieceOutline, type PieceOutline } from './geometry.ts';
import type { SizedDesign, SizedNode, SizedPiece } from './types.ts';
import type { LineCache } from './lineCache.ts';

/** How far apart two nodes' moves may be and still count as one rigid move, m (rounding of the placement sums). */
const RIGID_TOL = 1e-12;

/**
 * An outline of the live layout. A translated one says what it was translated from: `shift.base` is the outline as
 * last drawn afresh (never itself translated) and `shift.by` the whole translation since, so a face can draw `base`
 * once and move it with one transform per move instead of new path text. `regions` hold the translated copper all
 * the same (to rounding: base + by, and regions translated move by move, agree to about 1e-15 m).
 */
export interface LiveOutline extends PieceOutline { shift?: { base: PieceOutline; by: Vec2 } }

/** A live layout, carrying what the next one reuses. */
export interface LiveLayout extends LiveSizing {
  /** Each piece's and node's own copper, in pieceOutlines' order. */
  outlines: LiveOutline[];
  drills: DrillHit[];
  /** What this layout redid: nodes whose ends were handled afresh, outlines drawn afresh, moved, kept. */
  redone: { ends: number; drawn: number; moved: number; kept: number };
}

interface LiveMemo {
  /** Board-wide inputs the memo is valid for (the options object, and the document's board-wide figures). */
  global: { opts: SizeOptions; key: string };
  /** The line cache sizing used (kept for the next layout when `opts` brings none). */
  cache: LineCache;
  ends: EndMemo;
  /** Nodes whose ends were replayed unchanged in this layout. */
  replayed: Set<string>;
}

/** The document's board-wide inputs to sizing: any change drops the whole memo. */
function globalKey(doc: DesignDoc): string {
  return JSON.stringify([doc.frequency, doc.substrate, doc.junctions ?? null, doc.asMade ?? null, doc.process ?? null]);
}

/** Sizing alone, memoised per node: what the live layout and a sweep of a dragged design share. */
export interface LiveSizing {
  /** Bit for bit sizeDesign(doc, opts). */
  sized: SizedDesign;
  /** Nodes whose ends were handled afresh (the rest were replayed). */
  ends: number;
  /** Whether the memo of the previous sizing was used (false after a board-wide change). */
  reused: boolean;
  /** The reuse state (not for display). */
  readonly memo: LiveMemo;
}

/**
 * `doc` sized as sizeDesign sizes it, reusing `prev` (an earlier sizing of the same design, or null). `opts` must be
 * the same object on every call for the memo to be kept (a face keeps one constant). Without a line cache in
 * `opts`, the one of `prev` is used again where it fits (sizing makes a new one where it does not).
 */
export function liveSizing(prev: LiveSizing | null, doc: DesignDoc, opts: SizeOptions = {}): LiveSizing {
  const key = globalKey(doc);
  const usable = prev && prev.memo.global.opts === opts && prev.memo.global.key === key ? prev : null;
  const ends: EndMemo = new Map();
  const replayed = new Set<string>();
  let handled = 0;
  let cache: LineCache | null = null;
  const sized = sizeWithEnds(doc, opts.cache || !prev ? opts : { ...opts, cache: prev.memo.cache }, (ctx, adj, byId) => {
    cache = ctx.cache;
    const r = sizeEndsMemo(ctx, adj, byId, usable?.memo.ends ?? new Map(), ends);
    handled = r.handled;
    for (const [id, e] of ends) if (usable?.memo.ends.get(id)?.effect === e.effect) replayed.add(id);
    return r.nodes;
  });
  return { sized, ends: handled, reused: usable !== null, memo: { global: { opts, key }, cache: cache!, ends, replayed } };
}

/** The live layout of `doc`, reusing `prev` (see liveSizing for `opts`). */
export function liveLayout(prev: LiveLayout | null, doc: DesignDoc, opts: SizeOptions = {}): LiveLayout {
  const s = liveSizing(prev, doc, opts);
  const copper = liveOutlines(s.reused ? prev : null, s.sized, s.memo.replayed);
  return { ...s, ...copper, redone: { ends: s.ends, ...copper.redone } };
}

/** Each outline reused, translated or drawn afresh (see the file comment). */
function liveOutlines(prev: LiveLayout | null, sized: SizedDesign, replayed: Set<string>): Pick<LiveLayout, 'outlines' | 'drills'> & { redone: { drawn: number; moved: number; kept: number } } {
  const site = outlineSite(sized);
  const before = prev ? outlineSite(prev.sized) : null;
  const old = new Map((prev?.outlines ?? []).map((o) => [o.id, o]));
  const oldDrills = new Map<string, DrillHit[]>();
  for (const d of prev?.drills ?? []) { const l = oldDrills.get(d.owner) ?? []; l.push(d); oldDrills.set(d.owner, l); }
  const outlines: LiveOutline[] = [], drills: DrillHit[] = [];
  const redone = { drawn: 0, moved: 0, kept: 0 };
  // Everything a move translates (the copper below a dragged bend) takes one and the same vector, the first one
  // found: the vectors differ only by the rounding of the placement sums (RIGID_TOL), and one vector lets a face move
  // all of it as one group, its shifts staying equal to the bit over the whole drag.
  let common: Vec2 | null = null;
  const reuse = (id: string, deps: string[], same: boolean): { o: LiveOutline | undefined; by: Vec2 } | null => {
    if (!before || !same) return null;
    let by = rigidMove(deps, site.nodes, before.nodes);
    if (!by) return null;
    if (!isZero(by)) {
      if (common && Math.abs(by.x - common.x) <= RIGID_TOL && Math.abs(by.y - common.y) <= RIGID_TOL) by = common;
      else common ??= by;
    }
    return { o: old.get(id), by };
  };
  for (const p of sized.pieces) {
    const was = before?.pieces.get(p.id);
    const r = reuse(p.id, pieceDeps(site, p), !!was && replayed.has(p.a) && replayed.has(p.b) && samePiece(was, p));
    // A piece without copper before (not placed) stays without copper under a rigid move: draw it afresh anyway.
    const o = r?.o ? moved(r.o, r.by, [site.nodes.get(p.a)!.pos, site.nodes.get(p.b)!.pos]) : pieceOutline(site, p);
    count(redone, r?.o, r?.by);
    if (o) outlines.push(o);
  }
  for (const n of sized.nodes) {
    const r = reuse(n.id, [n.id, ...n.segments.map((s) => far(site, n.id, s)).filter((x): x is string => !!x)], replayed.has(n.id) && !!before?.nodes.get(n.id));
    if (r && (r.o || !oldDrills.has(n.id)) && Number.isFinite(n.pos.x)) {
      count(redone, r.o, r.by);
      for (const d of oldDrills.get(n.id) ?? []) drills.push(isZero(r.by) ? d : { ...d, at: shift(d.at, r.by) });
      if (r.o) outlines.push(moved(r.o, r.by, [n.pos]));
      continue;
    }
    redone.drawn++;
    const o = nodeOutline(site, n, drills);
    if (o) outlines.push(o);
  }
  return { outlines, drills, redone };
}

function count(r: { drawn: number; moved: number; kept: number }, o: PieceOutline | undefined, by: Vec2 | undefined): void {
  if (!by) r.drawn++;
  else if (isZero(by)) r.kept++;
  else r.moved++;
}

/** The nodes a piece's outline reads: its ends, and at a mitered end the far ends of the pieces meeting there. */
function pieceDeps(site: ReturnType<typeof outlineSite>, p: SizedPiece): string[] {
  const deps = [p.a, p.b];
  for (const id of [p.a, p.b]) {
    const n = site.nodes.get(id);
    if (!n?.bend?.miter) continue;
    for (const s of n.segments) { const f = far(site, id, s); if (f) deps.push(f); }
  }
  return deps;
}

function far(site: ReturnType<typeof outlineSite>, node: string, piece: string): string | null {
  const p = site.pieces.get(piece);
  return p ? (p.a === node ? p.b : p.a) : null;
}

/** The piece figures an outline is drawn from. */
function samePiece(a: SizedPiece, b: SizedPiece): boolean {
  if (a.kind !== b.kind || a.width !== b.width || a.widthB !== b.widthB || a.span !== b.span) return false;
  if ((a.part || b.part) && JSON.stringify(a.part?.footprint) !== JSON.stringify(b.part?.footprint)) return false;
  const ta = a.taperWidths, tb = b.taperWidths;
  return ta === tb || (!!ta && !!tb && ta.length === tb.length && ta.every((w, i) => w === tb[i]));
}

/** The one vector every node in `ids` moved by since `before`, or null (a node unplaced, new, or moved otherwise). */
function rigidMove(ids: string[], now: Map<string, SizedNode>, before: Map<string, SizedNode>): Vec2 | null {
  let by: Vec2 | null = null;
  for (const id of ids) {
    const a = before.get(id)?.pos, b = now.get(id)?.pos;
    if (!a || !b || !Number.isFinite(a.x) || !Number.isFinite(b.x)) return null;
    const d = { x: b.x - a.x, y: b.y - a.y };
    if (!by) by = d;
    else if (Math.abs(d.x - by.x) > RIGID_TOL || Math.abs(d.y - by.y) > RIGID_TOL) return null;
  }
  return by;
}

const isZero = (v: Vec2) => v.x === 0 && v.y === 0;
const shift = (p: Vec2, by: Vec2): Vec2 => ({ x: p.x + by.x, y: p.y + by.y });

/**
 * An outline moved by `by` (the very same object when it did not move), its centreline at the placed nodes, and its
 * shift from the outline last drawn afresh (LiveOutline).
 */
function moved(o: LiveOutline, by: Vec2, centreline: Vec2[]): LiveOutline {
  if (isZero(by)) return o;
  const regions: Region[] = o.regions.map((r) => ({ outer: r.outer.map((p) => shift(p, by)), holes: r.holes.map((h) => h.map((p) => shift(p, by))) }));
  const base = o.shift?.base ?? o;
  return { id: o.id, regions, centreline, shift: { base, by: o.shift ? sumShift(o.shift.by, by) : by } };
}

/**
 * The whole shift after one more move. Memoised on the pair of vectors, so outlines that shared their shift and their
 * move share the sum as well (one object: a face can group them by identity).
 */
const sums = new WeakMap<Vec2, WeakMap<Vec2, Vec2>>();
function sumShift(a: Vec2, b: Vec2): Vec2 {
  let m = sums.get(a);
  if (!m) { m = new WeakMap(); sums.set(a, m); }
  let s = m.get(b);
  if (!s) { s = shift(a, b); m.set(b, s); }
  return s;
}
