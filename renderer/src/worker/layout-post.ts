/**
 * The live layout as it crosses from the worker to the page: the first result whole, each later one as changes
 * against the result the page says it holds (layout-diff.ts). The worker keeps its last few results by token; the
 * page keeps the one it drew. A drag of a bend in the 64-output feed changes two pieces' sizes and moves the nodes
 * and copper below the bend: about a tenth of the full result crosses, and the correction and warning text of
 * unchanged pieces never crosses again.
 */
import type { DrillHit, PathReport, PieceOutline, SizedDesign, Vec2 } from '../../../core/index.ts';
import { decodeList, encodeList, type ListEntry } from './layout-diff.ts';
import type { LayoutOutput, SizedView } from './jobs.ts';

type Piece = SizedDesign['pieces'][number];
type Node = SizedDesign['nodes'][number];
type Outline = PieceOutline & { d: string };
interface Centreline { id: string; pts: Vec2[] }

export interface LayoutPost {
  /** This result's token (ask with it as `base` next time), and the token it is written against (null: whole). */
  token: number;
  base: number | null;
  head: Omit<SizedView, 'pieces' | 'nodes' | 'centrelines'>;
  pieces: ListEntry<Piece>[];
  nodes: ListEntry<Node>[];
  centrelines: ListEntry<Centreline>[];
  outlines: ListEntry<Outline>[];
  drills: DrillHit[];
  paths: ListEntry<PathReport>[];
  geometryError: string | null;
}

const byId = (t: { id: string }) => t.id;
const byName = (t: PathReport, i: number) => `${t.from}|${t.group ?? ''}|${t.name}|${i}`;
const listOf = (c: Record<string, Vec2[]>): Centreline[] => Object.entries(c).map(([id, pts]) => ({ id, pts }));

/** The worker's side: the results it sent lately, by token (a few, in case the page is a step behind). */
export class LayoutSender {
  private next = 1;
  private readonly sent = new Map<number, LayoutOutput>();
  constructor(private readonly keep = 4) {}

  /** A result the page may hold as `base` (undefined or unknown: none), or null. */
  held(base: number | undefined): LayoutOutput | null { return base === undefined ? null : this.sent.get(base) ?? null; }

  encode(out: LayoutOutput, base: number | undefined): LayoutPost {
    const prior = this.held(base);
    const token = this.next++;
    this.sent.set(token, out);
    while (this.sent.size > this.keep) this.sent.delete(this.sent.keys().next().value as number);
    const { pieces, nodes, centrelines, ...head } = out.sized;
    return {
      token, base: prior ? base! : null, head,
      pieces: encodeList(prior?.sized.pieces ?? null, pieces, byId),
      nodes: encodeList(prior?.sized.nodes ?? null, nodes, byId),
      centrelines: encodeList(prior ? listOf(prior.sized.centrelines) : null, listOf(centrelines), byId),
      outlines: encodeList(prior?.outlines ?? null, out.outlines, byId),
      drills: out.drills,
      paths: encodeList(prior?.paths ?? null, out.paths, byName),
      geometryError: out.geometryError,
    };
  }
}

/** The page's side: the result it holds, and each post decoded against it. */
export class LayoutReceiver {
  private held: { token: number; out: LayoutOutput } | null = null;

  /** The token to send as `base` with the next request. */
  get token(): number | undefined { return this.held?.token; }

  /** Forget the held result (the next post must come whole). */
  reset(): void { this.held = null; }

  /** The whole result a post stands for. Throws when the post is written against a result this side does not hold. */
  decode(p: LayoutPost): LayoutOutput {
    const base = p.base === null ? null : this.held?.token === p.base ? this.held.out : undefined;
    if (base === undefined) throw new Error(`layout transport: a result written against ${p.base}, but the page holds ${this.held?.token ?? 'none'}`);
    const centrelines: Record<string, Vec2[]> = {};
    for (const c of decodeList(base ? listOf(base.sized.centrelines) : null, p.centrelines)) centrelines[c.id] = c.pts;
    const out: LayoutOutput = {
      sized: { ...p.head, pieces: decodeList(base?.sized.pieces ?? null, p.pieces), nodes: decodeList(base?.sized.nodes ?? null, p.nodes), centrelines },
      outlines: decodeList(base?.outlines ?? null, p.outlines),
      drills: p.drills,
      paths: decodeList(base?.paths ?? null, p.paths),
      geometryError: p.geometryError,
    };
    this.held = { token: p.token, out };
    return out;
  }
}
