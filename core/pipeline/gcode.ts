/**
 * G-code for a design through the one pipeline: complete → sized → board → milling plan → one `.nc` file per tool.
 * `exportGcode` and `planDesignMilling` are the short calls for callers that want G-code alone (tests, benchmarks);
 * the faces use exportDesign with the 'gcode' format or `DesignPipeline.plan`, which share the same stages and
 * writer. exportGcode refuses a board that cannot be built and a plan with errors, but does not trace the ports'
 * paths as `build` does (synthetic test boards have ports that no path joins).
 * Needs the polygon engine (`await initPolygons()`).
 */
import type { DesignDoc } from '../design/types.ts';
import type { BoardGeometry } from '../geometry/types.ts';
import type { SizedDesign } from '../layout/types.ts';
import type { MillingOptions, MillingPlan } from '../toolpath/index.ts';
import type { Warning } from '../util/warnings.ts';
import { DesignPipeline } from './stages.ts';
import { writeFiles } from './export.ts';

export interface DesignMilling { sized: SizedDesign; geometry: BoardGeometry; plan: MillingPlan; warnings: Warning[] }

export interface GcodeFile { name: string; text: string; tool: number; label: string }

export interface GcodeExport extends DesignMilling { files: GcodeFile[] }

/** A small pipeline of its own, so these calls never hold a face's stages. */
const shared = new DesignPipeline({ capacity: 16 });

/** Sizes the design, builds its copper and plans the milling. Layout problems refuse, naming the pieces. */
export function planDesignMilling(doc: DesignDoc, options: Partial<MillingOptions> = {}, pipeline = shared): DesignMilling {
  const sized = pipeline.sizedComplete(doc);
  return { sized, geometry: pipeline.board(doc), plan: pipeline.plan(doc, options), warnings: sized.warnings };
}

/**
 * The G-code files of a design (one per tool, named by EXPORT_FILE_NAMES.gcode). Refuses — an InputError naming
 * the pieces or the option — when the plan has errors: a gap narrower than the cut, islands the cut joins or
 * destroys, moves outside the work area.
 */
export function exportGcode(doc: DesignDoc, options: Partial<MillingOptions>, info: { base: string; application?: string; version: string }, pipeline = shared): GcodeExport {
  const m = planDesignMilling(doc, options, pipeline);
  const r = writeFiles(pipeline, doc, { formats: ['gcode'], base: info.base, version: info.version, milling: options }, 'board-only');
  const files = m.plan.programs.map((p, i) => ({ name: r.files[i]!.name, text: r.files[i]!.text, tool: p.tool.number, label: p.tool.label }));
  return { ...m, files };
}
