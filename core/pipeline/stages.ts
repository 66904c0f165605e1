/**
 * The one pipeline from a design to its files, shared by every face (the CLI's export and build, the app's compute
 * worker):
 *
 *   design → complete (the design's own cross-check, complete: true) → sized (core/layout sizing)
 *          → board geometry (copper, ground, clearance, drills; every sized piece placed or a refusal)
 *          → prepared (etch bias; isolation outlines from the design's process, or a tool override)
 *          → files (files.ts).
 *
 * Each stage is computed once per design revision (revision.ts: a content hash) and kept in a small bounded memo,
 * so the app's layout, check, preview, export, milling and response jobs of one revision share one sizing and one
 * board. Stages that refuse throw an InputError naming the pieces; the refusal is memoised too.
 * Geometry stages need the polygon engine: `await initPolygons()` (core/geometry) once before calling them.
 */
import { crossCheck } from '../design/crossref.ts';
import type { DesignDoc, JunctionChoice } from '../design/types.ts';
import { asMadeOf } from '../design/as-made-default.ts';
import type { BoardGeometry } from '../geometry/types.ts';
import { asMadeLineOptions } from '../layout/as-made.ts';
import { checkFabrication, problemFindings, type Finding } from '../layout/checks.ts';
import { buildBoardGeometry } from '../layout/geometry.ts';
import { LineCache } from '../layout/lineCache.ts';
import { designPaths, tracePaths, type PathReport } from '../layout/paths.ts';
import { processCut } from '../layout/process-cut.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { liveSizing, type LiveSizing } from '../layout/incremental.ts';
import type { SizeOptions } from '../layout/sizing/context.ts';
import type { SizedDesign } from '../layout/types.ts';
import { netlistFromSized, type SizedNetlist } from '../network/fromSized.ts';
import { SweepValues } from '../network/sweepValues.ts';
import { planMilling, type MillingOptions, type MillingPlan } from '../toolpath/index.ts';
import { InputError } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { withEtchBias } from '../export/bias.ts';
import { withIsolation } from '../export/milling.ts';
import type { ExportGeometry } from '../export/layers.ts';
import { designHash } from '../network/sweep.ts';
import { StageMemo } from './memo.ts';
import { refuse } from './refusal.ts';
import { revisionOf } from './revision.ts';

/** The stages, by name (the memo's counters use these). */
export type StageName = 'complete' | 'sized' | 'board' | 'paths' | 'findings' | 'checked' | 'prepared' | 'plan' | 'netlist';

export interface PrepareOptions {
  /** Etch bias per copper edge, m (0: none). */
  bias?: number;
  /** Isolation width override, m (the CLI's --tool); otherwise the design's process gives it. */
  tool?: number;
  /** Add the isolation outlines (asked for by the 'isolation' layer or by a tool override). */
  isolation?: boolean;
}

/** What `stripwright build` asks of the shop check (its options; none changes the design's own sizing but junctions). */
export interface CheckRequest {
  /** Junction choice overriding the design's own: sized as the design with that choice (its own revision). */
  junctions?: JunctionChoice;
  /** Phase tolerance of matched paths, degrees (default: each phase group's own, else the paths' default). */
  toleranceDeg?: number;
  /** Path loss budget, dB (default: the shop check's). */
  lossLimitDb?: number;
  /** These paths (meant to match in phase) instead of the design's phase groups: a port and ports, labels or ids. */
  from?: string;
  to?: readonly string[];
  /** Runs of different paths closer than this are checked for coupling, m (default 3 h; 0 turns the check off). */
  proximityLimit?: number;
}

/** The shop check of one request: the sized design it ran on, its paths and its findings. */
export interface Checked { sized: SizedDesign; paths: PathReport[]; findings: Finding[] }

export interface Prepared { geometry: ExportGeometry; warnings: Warning[]; /** Isolation width used, m, if any. */ isolationWidth?: number }

export class DesignPipeline {
  readonly memo: StageMemo;
  private lines: { key: string; cache: LineCache } | null = null;
  /** Line constants and element values of sweeps, kept across revisions (core/network/sweepValues.ts). */
  readonly values = new SweepValues();

  /**
   * Size each revision from the one sized before it (core/layout/incremental.ts liveSizing: only the ends whose own
   * inputs changed are handled afresh; bit for bit sizeDesign). For a face that sizes a design being edited a little
   * at a time in a worker of its own (the app's response worker during a drag).
   */
  private readonly live: boolean;
  /** The last live sizing, and the one options object its memo is kept for (per line cache). */
  private lastLive: { opts: SizeOptions; sizing: LiveSizing | null } | null = null;

  constructor(opts: { capacity?: number; live?: boolean } = {}) {
    this.memo = new StageMemo(opts.capacity ?? 48);
    this.live = opts.live === true;
  }

  revision(doc: DesignDoc): string { return revisionOf(doc); }

  /** How many times a stage really ran (for tests and the reuse benchmark). */
  count(stage: StageName): number { return this.memo.count(stage); }

  /** The design checked as a finished network (the cross-check with complete: true); refuses naming the nodes. */
  complete(doc: DesignDoc): DesignDoc {
    return this.memo.get('complete', this.revision(doc), () => {
      const { errors } = crossCheck(doc, { complete: true });
      if (errors.length) throw refuse(errors[0]!.path || 'design', 'a finished, consistent network', errors.map((e) => e.message), 'connect or delete the nodes named, then export again');
      return doc;
    });
  }

  /** Sized pieces and placed nodes; problems stay data here (the live layout shows them). */
  sized(doc: DesignDoc): SizedDesign {
    return this.memo.get('sized', this.revision(doc), () => (this.live ? this.sizedLive(doc) : sizeDesign(doc, { cache: this.lineCache(doc) })));
  }

  private sizedLive(doc: DesignDoc): SizedDesign {
    const cache = this.lineCache(doc);
    if (this.lastLive?.opts.cache !== cache) this.lastLive = { opts: { cache }, sizing: null };
    const live = this.lastLive;
    try {
      live.sizing = liveSizing(live.sizing, doc, live.opts);
    } catch (err) {
      live.sizing = null; // a refusal leaves no memo to build on
      throw err;
    }
    return live.sizing.sized;
  }

  /** The sized design of a finished network with no sizing problems; refuses naming the pieces. */
  sizedComplete(doc: DesignDoc): SizedDesign {
    this.complete(doc);
    const sized = this.sized(doc);
    if (sized.problems.length) {
      const first = sized.problems[0]!;
      throw refuse(first.subjects[0] ?? 'design', 'a design that can be sized as drawn', sized.problems.map((p) => p.message), 'fix the pieces named here first; nothing is built or written until sizing has no problems');
    }
    return sized;
  }

  /** The united board geometry; every sized piece has copper or the board is refused, naming the pieces left out. */
  board(doc: DesignDoc): BoardGeometry {
    const sized = this.sizedComplete(doc);
    return this.memo.get('board', this.revision(doc), () => {
      const g = buildBoardGeometry(sized);
      const drawn = new Set(g.pieces.map((p) => p.id));
      const missing = sized.pieces.filter((p) => !drawn.has(p.id)).map((p) => `piece ${p.id} could not be placed (its ends are not placed apart)`);
      if (missing.length) throw refuse(sized.pieces.find((p) => !drawn.has(p.id))!.id, 'copper for every sized piece', missing, 'check the pieces named: their nodes must be placed at two different points');
      return g;
    });
  }

  /** The paths and phase report of the sized design (sizing problems give none). */
  paths(doc: DesignDoc, opts: { sensitivities?: boolean } = {}): PathReport[] {
    const sens = opts.sensitivities === true;
    return this.memo.get('paths', `${this.revision(doc)}|${sens}`, () => {
      const sized = this.sized(doc);
      return sized.problems.length ? [] : designPaths(sized, { sensitivities: sens });
    });
  }

  /** The shop check on the board (what `stripwright build` reports). */
  findings(doc: DesignDoc): Finding[] {
    const board = this.board(doc);
    return this.memo.get('findings', this.revision(doc), () => checkFabrication(this.sized(doc), board, { paths: this.paths(doc) }));
  }

  /** Refuses when the shop check has errors (exactly when `build` exits 1), naming them. */
  buildable(doc: DesignDoc): void {
    const errors = this.findings(doc).filter((f) => f.severity === 'error');
    if (errors.length) throw refuse(errors[0]!.subjects[0] ?? 'design', 'a board the shop check passes (as `stripwright build` does)', errors.map((f) => `${f.message} (${f.fix})`), 'fix the findings named; `stripwright build` lists them all');
  }

  /**
   * The shop check as `stripwright build` reports it, from the same stages as export: a design with sizing problems
   * gets them as its findings (no copper, no paths); otherwise the board (refused as export refuses it: an unfinished
   * network or pieces not placed), the paths with their sensitivities and the fabrication findings.
   */
  check(doc: DesignDoc, req: CheckRequest = {}): Checked {
    const d = req.junctions !== undefined && req.junctions !== (doc.junctions ?? 'modelled') ? { ...doc, junctions: req.junctions } : doc;
    const sized = this.sized(d);
    if (sized.problems.length) return { sized, paths: [], findings: problemFindings(sized) };
    const board = this.board(d);
    const key = designHash([req.toleranceDeg ?? null, req.lossLimitDb ?? null, req.from ?? null, req.to ?? null, req.proximityLimit ?? null]);
    return this.memo.get('checked', `${this.revision(d)}|${key}`, () => {
      const popts = { sensitivities: true, ...(req.toleranceDeg !== undefined ? { toleranceDeg: req.toleranceDeg } : {}) };
      const paths = req.from !== undefined && req.to ? [tracePaths(sized, req.from, [...req.to], popts)] : designPaths(sized, popts);
      const findings = checkFabrication(sized, board, {
        paths, ...(req.lossLimitDb !== undefined ? { lossLimitDb: req.lossLimitDb } : {}), ...(req.proximityLimit !== undefined ? { proximityLimit: req.proximityLimit } : {}),
      });
      return { sized, paths, findings };
    });
  }

  /** Board geometry with the etch bias and, when asked, the isolation outlines of the process's cut. */
  prepared(doc: DesignDoc, opts: PrepareOptions = {}): Prepared {
    const board = this.board(doc);
    const bias = opts.bias ?? 0;
    const width = opts.tool ?? (opts.isolation ? isolationWidthOf(doc) : undefined);
    return this.memo.get('prepared', `${this.revision(doc)}|${bias}|${width ?? '-'}`, () => {
      const warnings: Warning[] = [];
      let g: ExportGeometry = board;
      if (bias !== 0) { const b = withEtchBias(g, bias); g = b.geometry; warnings.push(...b.warnings); }
      if (width !== undefined) { const m = withIsolation(g, width); g = m.geometry; warnings.push(...m.warnings); }
      return { geometry: g, warnings, ...(width !== undefined ? { isolationWidth: width } : {}) };
    });
  }

  /** The milling plan with the design's process tool; board problems are the plan's findings. */
  plan(doc: DesignDoc, options: Partial<MillingOptions> = {}): MillingPlan {
    const board = this.board(doc);
    return this.memo.get('plan', `${this.revision(doc)}|${designHash(options)}`, () => planMilling(this.sized(doc), board, options));
  }

  /** The network of the sized design (for sweeps). */
  netlist(doc: DesignDoc): SizedNetlist {
    return this.memo.get('netlist', this.revision(doc), () => {
      const sized = this.sized(doc);
      return netlistFromSized(sized, { ...(sized.lineOptions ? { line: sized.lineOptions } : {}), values: this.values });
    });
  }

  /** One line cache per substrate and line-model choice, kept across revisions: re-sizing after an edit reuses it. */
  private lineCache(doc: DesignDoc): LineCache {
    const proc = doc.process;
    const made = asMadeOf(doc);
    const asMade = made.sizing === 'as-made';
    const key = JSON.stringify([doc.substrate, made, asMade ? proc : null, asMade ? doc.areas : null]);
    if (!this.lines || this.lines.key !== key) this.lines = { key, cache: new LineCache(doc.substrate, asMadeLineOptions(doc)) };
    return this.lines.cache;
  }
}

/** The isolation width of the design's own process: end mill or V-bit; etching has none, which is refused. */
export function isolationWidthOf(doc: DesignDoc): number {
  const cut = processCut(doc.process);
  if (!cut) {
    throw new InputError('bad-choice', 'tool', 'an end mill or V-bit as the process, or a tool width for the isolation outlines',
      'an etched design', 'set the design\'s process to the tool you mill with, or give the width (CLI: --tool 0.2mm)');
  }
  return cut.cutWidth; // the outline of one pass's tool centre: half a cut from the copper
}
