/**
 * G-code for a design, from the one pipeline every face uses: size → copper geometry → milling plan → one `.nc` file
 * per tool. `exportGcode` is what the CLI (`export --format gcode`) and the app's Outputs call; `planDesignMilling`
 * gives the plan alone (for previews and the mill-readiness check). Needs the polygon engine (`await initPolygons()`).
 */
import type { DesignDoc } from '../design/types.ts';
import type { BoardGeometry } from '../geometry/types.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { buildBoardGeometry } from '../layout/geometry.ts';
import type { SizedDesign } from '../layout/types.ts';
import { designHash } from '../network/sweep.ts';
import { planMilling, type MillingOptions, type MillingPlan } from '../toolpath/index.ts';
import { InputError } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { EXPORT_FILE_NAMES } from './file-names.ts';
import { toGcode } from './gcode.ts';

export interface DesignMilling { sized: SizedDesign; geometry: BoardGeometry; plan: MillingPlan; warnings: Warning[] }

export interface GcodeFile { name: string; text: string; tool: number; label: string }

export interface GcodeExport extends DesignMilling { files: GcodeFile[] }

/** Sizes the design, builds its copper and plans the milling. Layout problems refuse, naming the pieces. */
export function planDesignMilling(doc: DesignDoc, options: Partial<MillingOptions> = {}): DesignMilling {
  const sized = sizeDesign(doc);
  if (sized.problems.length) {
    throw new InputError('impossible-layout', 'design', 'a design that can be laid out', sized.problems.map((p) => p.message).join('; '), 'fix the pieces named in the shop check first');
  }
  const geometry = buildBoardGeometry(sized);
  return { sized, geometry, plan: planMilling(sized, geometry, options), warnings: sized.warnings };
}

/**
 * The G-code files of a design (one per tool, named by EXPORT_FILE_NAMES.gcode). Refuses — an InputError naming
 * the pieces or the option — when the plan has errors: a gap narrower than the cut, islands the cut joins or
 * destroys, moves outside the work area.
 */
export function exportGcode(doc: DesignDoc, options: Partial<MillingOptions>, info: { base: string; application: string; version: string }): GcodeExport {
  const m = planDesignMilling(doc, options);
  const errors = m.plan.findings.filter((f) => f.severity === 'error');
  if (errors.length) {
    const field = errors[0]!.code === 'work-area' ? 'workArea' : 'design';
    throw new InputError('impossible-layout', field, 'a board the mill can make as designed',
      errors.slice(0, 6).map((e) => e.message).join('; ') + (errors.length > 6 ? `; and ${errors.length - 6} more` : ''), errors[0]!.fix);
  }
  const hash = designHash({ ...doc, app: undefined });
  const files = m.plan.programs.map((p) => ({
    name: EXPORT_FILE_NAMES.gcode(info.base, p.tool), tool: p.tool.number, label: p.tool.label,
    text: toGcode(m.plan, p, { application: info.application, version: info.version, designName: doc.name, designHash: hash }),
  }));
  return { ...m, files };
}
