/**
 * The ends step (ends/index.ts) with a memo per node, for edits that change a few nodes of a large design (a drag).
 *
 * A node's end handler reads only the node itself, the pieces meeting it (their specs, widths and line figures,
 * which follow from the spec and the board-wide figures) and the drawn positions of those pieces' far ends (their
 * directions). That is the node's key. Its effects are: fields of its sized node, compensations appended to the
 * pieces, sums added to the pieces' end totals (`cut`, `pads`, `arcExtra`, `straightNeed`, `teeReserve`), and
 * problems and warnings appended to the context. A node whose key is unchanged (endKey) replays its recorded effects in the
 * same node order, with the same operands added in the same order, so the totals come out bit for bit as a full run
 * gives them (test/unit/layout-incremental.test.ts checks this on random drags).
 *
 * The handlers only ever add to the end totals (`w.cut += x`), never read them: the recording view of a piece
 * reads them as 0, so each recorded operand is exactly the x the handler added.
 */
import type { DesignSegment } from '../../design/types.ts';
import type { SizedNode } from '../types.ts';
import type { Compensation, LayoutProblem } from '../types.ts';
import type { Warning } from '../../util/warnings.ts';
import { other, type SizingContext, type Work } from './context.ts';
import type { Adjacency } from './topology.ts';
import { handleNode } from './ends/index.ts';

/** The end totals a handler adds to. */
const SUMS = ['cut', 'pads', 'arcExtra', 'straightNeed', 'teeReserve'] as const;
type Sum = (typeof SUMS)[number];
const isSum = (k: PropertyKey): k is Sum => (SUMS as readonly PropertyKey[]).includes(k);

/** What one node's handler did. */
export interface EndEffect {
  /** The sized node as the handler left it (position not yet placed). */
  node: Omit<SizedNode, 'pos'>;
  /** Additions to the pieces' end totals, in the order they were made. */
  sums: { piece: string; field: Sum; value: number }[];
  /** Compensations appended, per piece, in order. */
  comps: { piece: string; list: Compensation[] }[];
  problems: LayoutProblem[];
  warnings: Warning[];
}

/** The recorded effects of every node by id, with the key each was recorded under. */
export type EndMemo = Map<string, { key: unknown[]; effect: EndEffect }>;

/**
 * A node's key: the node record, and per piece meeting it (in order) the piece's record and the record of its far
 * node (whose drawn position gives the direction). Design documents are immutable values (every edit makes new
 * records for what it changes and keeps the others: core/design/commands.ts, History), so the very same records
 * mean the very same inputs; comparing them by identity costs nothing, where writing them out cost more than the
 * handlers it saves. A record made anew with equal contents is handled afresh (correct, only slower).
 */
export function endKey(ctx: SizingContext, nodeIndex: number, ids: string[], specs: Map<string, DesignSegment>): unknown[] {
  const n = ctx.doc.nodes[nodeIndex]!;
  const key: unknown[] = [n];
  for (const id of ids) {
    const s = specs.get(id);
    key.push(s, s ? ctx.nodeById.get(other(s, n.id)) : undefined);
  }
  return key;
}

function sameKey(a: unknown[], b: unknown[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * The sized nodes with every end handled, as sizeEnds makes them, reusing `memo`'s effects for nodes whose key is
 * unchanged and recording the others into `next`. Returns the sized nodes and how many nodes were handled afresh.
 */
export function sizeEndsMemo(ctx: SizingContext, adj: Adjacency, byId: Map<string, Work>, memo: EndMemo, next: EndMemo): { nodes: SizedNode[]; handled: number } {
  const specs = new Map<string, DesignSegment>(ctx.segments.map((s) => [s.id, s]));
  let handled = 0;
  const nodes = ctx.doc.nodes.map((n, i) => {
    const ids = adj.get(n.id)!;
    const key = endKey(ctx, i, ids, specs);
    const was = memo.get(n.id);
    const effect = was && sameKey(was.key, key) ? was.effect : (handled++, record(ctx, i, ids, byId));
    next.set(n.id, { key, effect });
    return replay(ctx, effect, byId);
  });
  return { nodes, handled };
}

/** Runs one node's handler against recording views of its pieces and returns what it did (nothing applied). */
function record(ctx: SizingContext, i: number, ids: string[], byId: Map<string, Work>): EndEffect {
  const n = ctx.doc.nodes[i]!;
  const sized: SizedNode = { id: n.id, kind: n.kind, at: n.at, pos: { x: NaN, y: NaN }, segments: ids.slice(), warnings: [] };
  const sums: EndEffect['sums'] = [];
  const views = new Map<string, Work>();
  const compsFrom = new Map<string, number>();
  for (const id of ids) {
    const w = byId.get(id);
    if (!w || views.has(id)) continue;
    compsFrom.set(id, w.piece.compensations.length);
    views.set(id, new Proxy(w, {
      get: (t, k, r) => (isSum(k) ? 0 : Reflect.get(t, k, r)),
      set: (t, k, v, r) => { if (isSum(k)) { sums.push({ piece: id, field: k, value: v as number }); return true; } return Reflect.set(t, k, v, r); },
    }));
  }
  const p0 = ctx.problems.length, w0 = ctx.warnings.length;
  handleNode(ctx, n, sized, ids, views);
  // Take back what the handler appended: replay applies it (so a recorded and a replayed node act alike).
  const comps: EndEffect['comps'] = [];
  for (const [id, from] of compsFrom) {
    const list = byId.get(id)!.piece.compensations.splice(from);
    if (list.length) comps.push({ piece: id, list });
  }
  const problems = ctx.problems.splice(p0), warnings = ctx.warnings.splice(w0);
  const { pos: _pos, ...node } = sized;
  return { node, sums, comps, problems, warnings };
}

/** Applies a node's recorded effects and returns its fresh sized node. */
function replay(ctx: SizingContext, e: EndEffect, byId: Map<string, Work>): SizedNode {
  for (const s of e.sums) byId.get(s.piece)![s.field] += s.value;
  for (const c of e.comps) byId.get(c.piece)!.piece.compensations.push(...c.list);
  if (e.problems.length) ctx.problems.push(...e.problems);
  if (e.warnings.length) ctx.warnings.push(...e.warnings);
  // Keys in sizeEnds' order (id, kind, at, pos, segments, warnings, then what the handler added).
  const { id, kind, at, segments, warnings, ...added } = e.node;
  return { id, kind, at, pos: { x: NaN, y: NaN }, segments: segments.slice(), warnings: warnings.slice(), ...added };
}
