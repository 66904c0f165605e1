/**
 * The milling plan of a sized design: every tool's program, the board as milled, the mill-readiness findings and the
 * estimated time. One function (`planMilling`) for every face; core/export writes its programs as G-code.
 *
 * Frame: programs stay in design metres; `origin` (the board's lower-left corner) is where the files put X0 Y0, and
 * Z0 is the top of the copper. Tools, in the order to run them: 1 the isolation tool (the design's process), then one
 * drill per hole size (smallest first), then the cutout end mill (which also mills holes larger than `maxDrill`).
 */
import { unionRegions } from '../geometry/polygons.ts';
import type { BoardGeometry, Region, Vec2 } from '../geometry/types.ts';
import { cutWidth, checkFabrication } from '../layout/checks.ts';
import type { SizedDesign } from '../layout/types.ts';
import { isolationGapOf, isolationPlan } from '../layout/process-cut.ts';
import { asMadeOf } from '../design/as-made-default.ts';
import { InputError } from '../util/errors.ts';
import { clearingPaths, isolationPaths } from './isolation.ts';
import { drillMoves, groupDrills, holeMillMoves } from './drilling.ts';
import { cutoutLoop, cutoutMoves } from './cutout.ts';
import { buildProgram, loopItem, type WorkItem } from './program.ts';
import { milledBoard, type MilledBoard } from './milled.ts';
import { programSwept } from './swept.ts';
import { millReadiness, type MillFinding } from './readiness.ts';
import { resolveMillingOptions, type MillingOptions } from './options.ts';
import type { Tool, ToolProgram } from './types.ts';

export interface MillingPlan {
  options: MillingOptions;
  /** Design coordinates of X0 Y0 in the files (the board's lower-left corner), m. */
  origin: Vec2;
  /** Board width and height, m. */
  size: { width: number; height: number };
  /** The board blank (its outline, or the copper extent with a margin). */
  board: Region;
  programs: ToolProgram[];
  milled: MilledBoard;
  /** Errors refuse the export; warnings and notes are shown with it. */
  findings: MillFinding[];
  /** Sum of the programs' estimates, s. */
  seconds: number;
}

const mmS = (m: number) => (m * 1e3).toFixed(3);
/** Design-file paths of the process fields named in errors. */
const PROCESS_FIELD = { kind: ['process', 'kind'].join('.'), depth: ['process', 'depth'].join('.') };

/** The board blank: the outline, or the geometry's extent (which already carries the margin when there is no outline). */
export function boardBlank(g: BoardGeometry): Region {
  if (g.outline) return g.outline;
  const e = g.extent;
  return { outer: [{ x: e.minX, y: e.minY }, { x: e.maxX, y: e.minY }, { x: e.maxX, y: e.maxY }, { x: e.minX, y: e.maxY }], holes: [] };
}

/** The isolation tool of the design's fabrication process; etching has no tool, so it is refused with a way out. */
export function isolationTool(sized: SizedDesign): Tool {
  const p = sized.doc.process;
  if (p.kind === 'etch') {
    throw new InputError('bad-choice', PROCESS_FIELD.kind, 'a milling tool for G-code: a V-bit or an end mill', "'etch'",
      'set the design\'s process to the V-bit or end mill you mill with; etched boards need the mask or Gerber outputs instead');
  }
  const t = sized.doc.substrate.t;
  if (p.depth <= t) {
    throw new InputError('out-of-range', PROCESS_FIELD.depth, `a cutting depth below the copper (thicker than ${mmS(t)} mm) so the cut separates the copper`,
      `${mmS(p.depth)} mm`, `set the depth to at least ${mmS(t + 0.02e-3)} mm`);
  }
  const w = cutWidth(p);
  return p.kind === 'v-bit'
    ? { number: 1, kind: 'v-bit', diameter: w, cutWidth: w, tipWidth: p.tipWidth, angleDeg: p.angleDeg, slug: 'isolation',
        label: `${p.angleDeg} deg V-bit, ${mmS(p.tipWidth)} mm tip, ${mmS(p.depth)} mm deep: cuts ${mmS(w)} mm wide at the copper` }
    : { number: 1, kind: 'end-mill', diameter: p.toolDiameter, cutWidth: w, slug: 'isolation', label: `${mmS(p.toolDiameter)} mm end mill, ${mmS(p.depth)} mm deep` };
}

/**
 * Plans the whole job. Needs the polygon engine (`await initPolygons()`). Throws InputError for bad options or a
 * process that cannot mill; problems of the board (narrow gaps, joined islands, moves off the work area) are findings.
 */
export function planMilling(sized: SizedDesign, g: BoardGeometry, given: Partial<MillingOptions> = {}, opts: { analyse?: boolean } = {}): MillingPlan {
  const o = resolveMillingOptions(given);
  const tool = isolationTool(sized);
  const proc = sized.doc.process as Extract<SizedDesign['doc']['process'], { depth: number }>;
  // Passes come from the process's isolation clearance (the channel as-made sizing assumed) unless asked for.
  const sizedFor = isolationPlan(proc);
  if (given.passes === undefined) o.passes = isolationPlan(proc, o.overlap).passes;
  const isolationNote = [
    ...isolationGapFinding(sized, sizedFor.gap, isolationGapOf(tool.cutWidth, o.passes, o.overlap), o.passes),
    // The clearance asks for more passes than are milled (MAX_ISOLATION_PASSES): said with the plan, not silently.
    ...(given.passes === undefined ? isolationPlan(proc, o.overlap).warnings.map((w): MillFinding => ({
      severity: 'warning', code: 'isolation-passes', subjects: [], message: w.message,
      fix: 'use a wider cut (a larger tool, or a deeper V-bit cut), or set the isolation clearance to the channel milled',
    })) : []),
  ];
  const { h, t } = sized.doc.substrate;
  // Thin laminates: unless asked for, a tab keeps half the board (the default 0.6 mm is for 1.6 mm boards).
  if (given.tabHeight === undefined) o.tabHeight = Math.max(0.1e-3, Math.min(o.tabHeight, 0.5 * (h + t)));
  const board = boardBlank(g);
  const xs = board.outer.map((p) => p.x), ys = board.outer.map((p) => p.y);
  const origin = { x: Math.min(...xs), y: Math.min(...ys) };
  const size = { width: Math.max(...xs) - origin.x, height: Math.max(...ys) - origin.y };
  const through = h + t + o.breakthrough;
  const programs: ToolProgram[] = [];

  // 1. Isolation (and clearing) with the process's tool.
  const copper = [...g.copper, ...g.groundCopper];
  const paths = isolationPaths(copper, board, tool.cutWidth, proc.depth, o);
  if (o.clear) paths.push(...clearingPaths(copper, board, tool.cutWidth, proc.depth, o));
  if (paths.length) {
    programs.push(buildProgram(tool, o.clear ? ['isolation', 'clearing'] : ['isolation'], paths.map((p) => loopItem(p, o)), origin, o.spindleRpm, o));
  }

  // 2. Drills, one tool per size.
  const { groups, milled: bigHoles } = o.drill ? groupDrills(g.drills, o) : { groups: [], milled: [] };
  for (const grp of groups) {
    const items: WorkItem[] = grp.hits.map((hit) => ({ entries: [hit.at], moves: () => drillMoves(hit.at, through, o) }));
    const dmm = (grp.diameter * 1e3).toFixed(2);
    const drill: Tool = { number: programs.length + 1, kind: 'drill', diameter: grp.diameter, cutWidth: grp.diameter, slug: `drill-${dmm}mm`, label: `${dmm} mm drill, ${grp.hits.length} hole${grp.hits.length === 1 ? '' : 's'}` };
    programs.push(buildProgram(drill, ['drilling'], items, origin, o.spindleRpm, o));
  }

  // 3. Large holes, then the cutout, with the end mill. The cutout comes last so the board is held until the end.
  const holes: WorkItem[] = bigHoles.map((hit) => {
    const m = holeMillMoves(hit, through, o);
    return { entries: [m.start], moves: () => m.moves };
  });
  let cutout: WorkItem | undefined;
  if (o.cutout) {
    const loop = cutoutLoop(board, o);
    cutout = { entries: loop, moves: (i) => cutoutMoves([...loop.slice(i), ...loop.slice(0, i)], through, h + t, o) };
  }
  if (holes.length || cutout) {
    const dmm = (o.cutoutTool * 1e3).toFixed(2);
    const mill: Tool = { number: programs.length + 1, kind: 'end-mill', diameter: o.cutoutTool, cutWidth: o.cutoutTool, slug: 'cutout',
      label: `${dmm} mm end mill${cutout ? ', board cutout' : ''}${holes.length ? `, ${holes.length} milled hole(s)` : ''}` };
    const ops = [...(holes.length ? ['hole-milling' as const] : []), ...(cutout ? ['cutout' as const] : [])];
    programs.push(buildProgram(mill, ops, holes, origin, o.spindleRpm, o, cutout));
  }

  // The board as milled: copper minus what every tool sweeps at the copper surface. `analyse: false` skips it (and
  // the gap checks that need it) for callers that want the toolpaths alone, like the benchmark's first figure.
  const seconds = programs.reduce((s, p) => s + p.seconds, 0);
  if (opts.analyse === false) {
    const none: MilledBoard = { copper: [], swept: [], islands: [], designIslands: [], pieces: [] };
    return { options: o, origin, size, board, programs, milled: none, findings: [...isolationNote, ...millReadiness(programs, origin, o, through)], seconds };
  }
  const swept = unionRegions(programs.flatMap(programSwept));
  const milled = milledBoard(g, sized, board, swept, tool);
  const findings = [...isolationNote, ...gapFindings(sized, g, milled, tool), ...millReadiness(programs, origin, o, through)];
  return { options: o, origin, size, board, programs, milled, findings, seconds };
}

/**
 * A warning when the passes asked for open a channel other than the one the lines were sized beside (as-made
 * sizing only: plain microstrip sizing assumes no side copper at all). 5 µm is below what a router holds.
 */
function isolationGapFinding(sized: SizedDesign, sizedGap: number, milledGap: number, passes: number): MillFinding[] {
  if (asMadeOf(sized.doc).sizing !== 'as-made' || Math.abs(milledGap - sizedGap) <= 5e-6) return [];
  return [{
    severity: 'warning', code: 'isolation-gap', subjects: [],
    message: `${passes} isolation pass${passes === 1 ? '' : 'es'} open ${mmS(milledGap)} mm beside the copper, but the lines were sized as made beside ${mmS(sizedGap)} mm (the process's isolation clearance)`,
    fix: 'leave the pass count unset so the isolation clearance of the design sets it, or size the lines as plain microstrip',
  }];
}

/** Narrow gaps (from the shop check, naming the pieces) and islands the cut joins, destroys or cuts through. */
function gapFindings(sized: SizedDesign, g: BoardGeometry, milled: MilledBoard, tool: Tool): MillFinding[] {
  const out: MillFinding[] = [];
  for (const f of checkFabrication(sized, g)) {
    if (f.code === 'min-gap' && f.severity === 'error') out.push({ severity: 'error', code: 'narrow-gap', message: f.message, fix: f.fix, subjects: f.subjects, ...(f.at ? { at: f.at } : {}) });
  }
  for (const isl of milled.islands) {
    if (isl.designIslands.length < 2) continue;
    const names = isl.designIslands.flatMap((i) => milled.designIslands[i]!.subjects.slice(0, 4));
    out.push({ severity: 'error', code: 'joined', subjects: names, message: `the cut does not separate ${isl.designIslands.length} copper areas (${names.join(', ')}): the ${mmS(tool.cutWidth)} mm cut cannot pass between them`, fix: 'widen the gap between them to more than the cut width, or use a finer tool' });
  }
  milled.designIslands.forEach((d) => {
    if (d.keptArea < 0.5 * d.area) out.push({ severity: 'error', code: 'destroyed', subjects: d.subjects.slice(0, 12), message: `milling removes ${(100 * (1 - d.keptArea / d.area)).toFixed(0)} % of the copper of ${d.subjects.slice(0, 6).join(', ')}`, fix: 'check the process tool and the design' });
    else if (d.milledIslands > 1) out.push({ severity: 'error', code: 'split', subjects: d.subjects.slice(0, 12), message: `milling cuts the copper of ${d.subjects.slice(0, 6).join(', ')} into ${d.milledIslands} pieces`, fix: 'widen the copper where the cut crosses it (it is narrower than the tool leaves)' });
  });
  const leftover = milled.islands.filter((i) => i.designIslands.length === 0);
  if (leftover.length) {
    const area = leftover.reduce((s, i) => s + i.area, 0);
    out.push({ severity: 'info', code: 'leftover', subjects: [], message: `${leftover.length} area(s) of unused copper stay on the board (${(area * 1e6).toFixed(1)} mm², not connected to the design)`, fix: 'normal for isolation milling; turn on clearing to remove them' });
  }
  return out;
}

