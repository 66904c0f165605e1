/**
 * What every sizing step shares: the design's board-wide figures, the lookups by id, the line cache and the
 * problem and warning lists. Built once by `sizingContext`; each step reads it and fills its own part.
 */
import type { DesignDoc, DesignNode, DesignSegment, JunctionChoice } from '../../design/types.ts';
import type { Vec2 } from '../../geometry/types.ts';
import { lineModels as coreLineModels, type LineModels, type LineOptions, type LineAt } from '../../line/index.ts';
import { InputError, describe } from '../../util/errors.ts';
import type { Warning } from '../../util/warnings.ts';
import { LineCache } from '../lineCache.ts';
import { asMadeLineOptions } from '../as-made.ts';
import { len, sub } from '../copper.ts';
import { splitPairs, SECOND_STRIP, type PairData } from '../coupledPair.ts';
import type { LayoutProblem, SizedPiece } from '../types.ts';

export interface SizeOptions {
  /** Line-model choices (dispersion, conductor loss); defaults as core/line. */
  line?: LineOptions;
  /** Throw InputError('impossible-layout') on the first problem instead of returning problems as data. */
  strict?: boolean;
  /** Reuse a line cache across calls on the same substrate (faces re-size on every edit). */
  cache?: LineCache;
  /** Junction choice, overriding the design's own (the CLI's --junctions). */
  junctions?: JunctionChoice;
  /**
   * The line models to size with (the line-model interface, core/line/line-model.ts); default the core's own set.
   * Its 'microstrip' family gives every strip's width and line; the sized design keeps it for paths and the network.
   */
  models?: LineModels;
}

export interface End { node: string; width: number; r: LineAt }

/** One piece while it is sized: the piece being filled in, its two ends and the sums its end handlers add. */
export interface Work {
  seg: DesignSegment;
  piece: SizedPiece;
  endA: End | null;
  endB: End | null;
  /** Σ of applied shortenings that remove copper at an end (open, via). */
  cut: number;
  /** Σ of pad extents (copper replaced by pads). */
  pads: number;
  /** Σ of arc span extras (R tan(θ/2) − Rθ/2). */
  arcExtra: number;
  /** Straight run the ends need (arc tangents, miter intrusions), m. */
  straightNeed: number;
  /** Σ of the static (f → 0, largest) tee plane shifts at its ends, which the network's line must keep, m. */
  teeReserve: number;
  ok: boolean;
}

export type PairFigures = Omit<PairData, 'strip' | 'partner' | 'segment'>;
export type Problem = (code: LayoutProblem['code'], message: string, subjects: string[]) => void;

export interface SizingContext {
  doc: DesignDoc;
  opts: SizeOptions;
  f0: number;
  band: { start: number; stop: number };
  junctions: JunctionChoice;
  subs: DesignDoc['substrate'];
  lineOpts: LineOptions | undefined;
  /** The line models every strip is asked of (SizeOptions.models or the core's). */
  models: LineModels;
  cache: LineCache;
  problems: LayoutProblem[];
  warnings: Warning[];
  problem: Problem;
  nodeById: Map<string, DesignNode>;
  /** The pieces to size: the design's segments with each coupled pair split into its two strips. */
  segments: DesignSegment[];
  /** Index in the design file of each entry of `segments`. */
  segIndex: number[];
  /** Pair figures by design segment id (shared by the pair's strips). */
  pairs: Map<string, PairFigures>;
}

/** Checks the board-wide inputs and builds the shared context. */
export function sizingContext(doc: DesignDoc, opts: SizeOptions): SizingContext {
  const f0 = doc.frequency?.f0;
  if (typeof f0 !== 'number' || !(f0 > 0) || !Number.isFinite(f0)) throw new InputError('out-of-range', 'frequency.f0', 'a design frequency above 0 Hz', describe(f0));
  if (!Array.isArray(doc.nodes) || !Array.isArray(doc.segments)) throw new InputError('invalid-design', 'nodes', 'lists of nodes and segments', describe(doc.nodes));
  const subs = doc.substrate;
  if (!subs || typeof subs !== 'object') throw new InputError('invalid-design', 'substrate', 'a substrate (er, h, t, tanDelta, sigma, roughness)', describe(subs));
  const band = doc.frequency.band && doc.frequency.band.stop >= doc.frequency.band.start ? doc.frequency.band : { start: f0, stop: f0 };
  // Lines sized as made (design asMade): the line options carry the cross-section tables (as-made.ts).
  const lineOpts = asMadeLineOptions(doc, opts.line);
  // A face passes its cache back on every edit; it is reused while the substrate's numbers are unchanged.
  const models = opts.models ?? coreLineModels;
  const family = models.strip();
  const cache = opts.cache && opts.cache.fits(subs, lineOpts, family) ? opts.cache : new LineCache(subs, lineOpts, family);
  const problems: LayoutProblem[] = [];
  const nodeById = new Map<string, DesignNode>();
  for (const n of doc.nodes) nodeById.set(n.id, n);
  // A coupled pair is sized and placed as its two strips (coupledPair.ts); `segIndex` maps back to the file.
  const { segments, index } = splitPairs(doc.segments);
  return {
    doc, opts, f0, band, junctions: opts.junctions ?? doc.junctions ?? 'modelled', subs, lineOpts, models, cache, problems, warnings: [],
    problem: (code, message, subjects) => { problems.push({ code, message, subjects }); },
    nodeById, segments, segIndex: index, pairs: new Map(),
  };
}

/** Drawn position of a node. */
export function at(ctx: SizingContext, id: string): Vec2 { return ctx.nodeById.get(id)!.at; }

/** The node at the other end of segment s. */
export function other(s: DesignSegment, n: string): string { return s.a === n ? s.b : s.a; }

/** Drawn direction leaving node n along segment s; null when both ends are drawn at one point. */
export function dirFrom(ctx: SizingContext, n: string, s: DesignSegment): Vec2 | null {
  const d = sub(at(ctx, other(s, n)), at(ctx, n));
  const l = len(d);
  return l > 1e-12 ? { x: d.x / l, y: d.y / l } : null;
}

/** The end of piece w at node n. */
export function endOf(w: Work, n: string): End | null { return w.seg.a === n ? w.endA : w.endB; }

/** Pieces that are copper lines (their ends take corrections). */
export function isLine(w: Work): boolean { return w.seg.kind === 'line' || w.seg.kind === 'taper' || w.seg.kind === 'coupled'; }

/** The design segment id of a strip piece (the second strip's id carries a suffix). */
export function pairId(id: string): string { return id.endsWith(SECOND_STRIP) ? id.slice(0, -SECOND_STRIP.length) : id; }

/** Adds model warnings once each, tagged with the subject when they name none. */
export function pushWarnings(into: Warning[], from: Warning[], subject: string): void {
  for (const w of from) {
    if (into.some((x) => x.code === w.code && x.message === w.message)) continue;
    into.push({ ...w, subjects: w.subjects && w.subjects.length ? w.subjects : [subject] });
  }
}

export function mm(m: number): string { return (m * 1e3).toFixed(3); }
export function deg(rad: number): string { return ((rad * 180) / Math.PI).toFixed(1); }
