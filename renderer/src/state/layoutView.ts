/**
 * What the panels and the board show of the layout: the core's sized design and geometry, plus lookups by id.
 * Built from the compute worker's result (layoutJob in worker/jobs.ts); nothing here computes physics.
 */
import type { DrillHit, Vec2 } from '../../../core/index.ts';
import type { PieceOutline } from '../../../core/index.ts';
import type { SizedDesign } from '../../../core/index.ts';
import type { PathReport } from '../../../core/index.ts';
import type { PieceFigures } from './figures.ts';

/** The sized design without its document (the editor holds the document; the worker does not send it back). */
export type SizedView = Omit<SizedDesign, 'doc'>;

export interface LayoutView {
  revision: number;
  sized: SizedView;
  /** Each piece's and node's own copper (before union) with its centreline. */
  outlines: (PieceOutline & { d?: string; by?: Vec2 })[];
  drills: DrillHit[];
  /** Path and phase reports (phase groups, or the anchor port to every other port). */
  paths: PathReport[];
  /** Each node's drawn position the layout was made from, and where it placed the node, by node id. */
  placed: Map<string, { at: Vec2; pos: Vec2 }>;
  /** Each piece's figures by id (a Map, or made on the first look-up: a drag's layouts are mostly never asked). */
  figures: Lookup<PieceFigures>;
  /** A line about each node (bend, tee, end, via, port) for the hover readout. */
  notes?: Lookup<string>;
  ms: number;
}

/** What the panels read of a per-id table. */
export interface Lookup<T> { get(id: string): T | undefined }

/** A table made the first time it is read (`make` runs at most once). */
export function lazy<T>(make: () => Map<string, T>): Lookup<T> {
  let m: Map<string, T> | null = null;
  return { get: (id) => (m ??= make()).get(id) };
}

export function figuresFrom(sized: SizedView): Map<string, PieceFigures> {
  return new Map(sized.pieces.map((p) => [p.id, pieceFigures(p)]));
}

/**
 * figuresFrom for a stream of layouts: a piece object the worker did not send again (layout-post.ts keeps it) keeps
 * its figures, so a drag re-derives only the pieces it changed.
 */
export class FiguresCache {
  private readonly made = new WeakMap<SizedView['pieces'][number], PieceFigures>();
  of(sized: SizedView): Map<string, PieceFigures> {
    const m = new Map<string, PieceFigures>();
    for (const p of sized.pieces) {
      let f = this.made.get(p);
      if (!f) { f = pieceFigures(p); this.made.set(p, f); }
      m.set(p.id, f);
    }
    return m;
  }
}

function pieceFigures(p: SizedView['pieces'][number]): PieceFigures {
  return {
    id: p.id, width: p.width, widthEnd: p.widthB, z0: p.z0, eeff: p.line?.epsEff, length: p.length, electricalDeg: p.effectiveDeg,
    compensations: p.compensations.filter((c) => !c.junction).map((c) => ({ model: c.model, source: c.source, amount: c.amount_m, applied: c.applied, node: c.node, note: c.note })),
    junctions: p.compensations.filter((c) => c.junction).map((c) => ({
      node: c.node, kind: c.junction!.kind, role: c.junction!.role, source: c.source, modelled: c.junction!.modelled, inRange: c.junction!.inRange,
      validity: c.junction!.validity, shift: c.model === 'tee-planes' ? -c.amount_m : null, residual: c.junction!.residual,
    })),
    warnings: p.warnings,
  };
}

/** One line about a node for the hover readout: the bend, tee, end or via as the sizing made it. */
export function nodeNotes(sized: SizedView): Map<string, string> {
  const m = new Map<string, string>();
  const mm = (v: number) => `${(v * 1e3).toFixed(3)} mm`;
  for (const n of sized.nodes) {
    let t = '';
    if (n.bend) {
      const deg = (n.bend.turn * 180) / Math.PI;
      const style = n.bend.style.style;
      t = `bend ${deg.toFixed(1)}°, ${style === 'miter-optimal' || style === 'miter' ? `miter ${((n.bend.miter?.fraction ?? 0) * 100).toFixed(0)} %` : style === 'arc' ? `arc r ${mm(n.bend.arc?.radius ?? 0)}` : 'square corner'}, w ${mm(n.bend.width)}`;
    } else if (n.step) t = `width step, ${n.step.modelled ? 'in the sweep' : 'not modelled'}`;
    else if (n.tee) t = n.tee.modelled ? `tee, planes ${mm(n.tee.atF0.d1[0])} / ${mm(n.tee.atF0.d1[1])} / ${mm(n.tee.atF0.d2)}, n² ${n.tee.atF0.n2.toFixed(3)}` : 'tee, ideal junction';
    else if (n.cross) t = 'cross';
    else if (n.open) t = `open end, Δl ${mm(n.open.dl)}`;
    else if (n.via) t = `via ${mm(n.via.drill)} drill, L ${(n.via.L * 1e9).toFixed(3)} nH`;
    else if (n.port) t = `port, ${n.port.zRef} Ω`;
    if (t) m.set(n.id, t);
  }
  return m;
}

export function placedFrom(sized: SizedView): Map<string, { at: Vec2; pos: Vec2 }> {
  // The sized nodes themselves carry `at` and `pos`: no new object per node (a drag makes this every move).
  const m = new Map<string, { at: Vec2; pos: Vec2 }>();
  for (const n of sized.nodes) m.set(n.id, n);
  return m;
}
