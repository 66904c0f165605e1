/**
 * Every file format the pipeline writes, in one table: the name a face shows, the help line of the CLI, and the
 * writer. Adding an exporter is one entry here (plus its pure writer in core/export): the CLI's --format, the app's
 * Outputs panel, the file names and the tests that compare the two faces all read this table.
 */
import type { DesignDoc } from '../design/types.ts';
import type { BoardGeometry } from '../geometry/types.ts';
import type { MillFinding, MillingPlan } from '../toolpath/index.ts';
import { InputError } from '../util/errors.ts';
import { toDxf } from '../export/dxf.ts';
import { toDxfR12 } from '../export/dxf-r12.ts';
import { toSvg } from '../export/svg.ts';
import { toGerber } from '../export/gerber.ts';
import { toExcellon } from '../export/excellon.ts';
import type { Mask } from '../export/mask.ts';
import { toGcode, MILLING_CAUTIONS } from '../export/gcode.ts';
import { EXPORT_FILE_NAMES } from '../export/file-names.ts';
import type { ExportGeometry, ExportLayer } from '../export/layers.ts';
import type { ResolvedRequest } from './request.ts';

export const EXPORT_FORMATS = ['dxf', 'svg', 'gerber', 'drill', 'mask', 'mask-pdf', 'gcode'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export interface ExportFile { name: string; text: string; /** What it is, in words (shown beside the file). */ what: string }
export interface ExportMessage { severity: 'info' | 'warning' | 'error'; text: string }

/** What a writer gets: the request, the board before and after bias/isolation, and lazily shared results. */
export interface WriteContext {
  doc: DesignDoc;
  req: ResolvedRequest;
  /** The board as designed (no bias): the mask applies the bias itself so its sheet can state it. */
  board: BoardGeometry;
  /** The board with bias and isolation outlines, as asked. */
  geometry: ExportGeometry;
  layers: ExportLayer[] | undefined;
  sw: { application: string; version: string; designHash: string };
  /** "design <hash>, Stripwright <version>": the stamp of every file (never a timestamp). */
  stamp: string;
  /** The mask sheet (computed once for 'mask' and 'mask-pdf'). */
  mask(): Mask;
  /** The milling plan (the pipeline's memoised stage). */
  plan(): MillingPlan;
  say(severity: ExportMessage['severity'], text: string): void;
}

export interface FormatInfo {
  /** Short name for the app's Outputs panel. */
  label: string;
  /** The CLI's usage lines for this format (first line after the name, then continuation lines). */
  help: string[];
  write(ctx: WriteContext): ExportFile[];
}

const frame = (c: WriteContext) => ({ origin: c.req.origin, mirror: c.req.mirror });

export const FORMAT_INFO: Record<ExportFormat, FormatInfo> = {
  dxf: {
    label: 'DXF (mm)',
    help: ['DXF drawing (mm): one closed polyline per outline and hole, a layer per kind, drills as circles',
      '(--dxf-version 2007, the default, or r12 for older cutters)'],
    write: (c) => [c.req.dxfVersion === 'r12'
      ? { name: EXPORT_FILE_NAMES.dxf(c.req.base), text: toDxfR12(c.geometry, { ...frame(c), stamp: c.stamp, ...(c.layers ? { layers: c.layers } : {}) }), what: 'DXF R12 drawing, mm' }
      : { name: EXPORT_FILE_NAMES.dxf(c.req.base), text: toDxf(c.geometry, { ...frame(c), stamp: c.stamp, ...(c.layers ? { layers: c.layers } : {}) }), what: 'DXF drawing, mm' }],
  },
  svg: {
    label: 'SVG (1:1)',
    help: ['SVG drawing at true size (width/height in mm), one group per layer'],
    write: (c) => [{ name: EXPORT_FILE_NAMES.svg(c.req.base), text: svgOf(c), what: 'SVG drawing, true size' }],
  },
  gerber: {
    label: 'Gerber X2',
    help: ['Gerber X2 (RS-274X, mm, 4.6): NAME-copper-top.gbr (copper as regions), NAME-copper-bottom.gbr',
      '(the ground plane) and NAME-profile.gbr'],
    write: (c) => {
      const gb = toGerber(c.geometry, { ...frame(c), ...c.sw });
      return [
        { name: EXPORT_FILE_NAMES.gerberCopperTop(c.req.base), text: gb.copper, what: 'Gerber X2, top copper' },
        { name: EXPORT_FILE_NAMES.gerberCopperBottom(c.req.base), text: gb.bottom, what: 'Gerber X2, bottom copper (ground plane)' },
        { name: EXPORT_FILE_NAMES.gerberProfile(c.req.base), text: gb.profile, what: 'Gerber X2, board profile' },
      ];
    },
  },
  drill: {
    label: 'Excellon drill',
    help: ['Excellon (METRIC): NAME-plated.drl and NAME-nonplated.drl (only those the board has)'],
    write: (c) => {
      const d = toExcellon(c.geometry, { ...frame(c), ...c.sw });
      const out: ExportFile[] = [];
      if (d.plated) out.push({ name: EXPORT_FILE_NAMES.drillPlated(c.req.base), text: d.plated, what: 'Excellon, plated holes' });
      if (d.nonPlated) out.push({ name: EXPORT_FILE_NAMES.drillNonPlated(c.req.base), text: d.nonPlated, what: 'Excellon, non-plated holes' });
      if (!out.length) c.say('info', 'the board has no drilled holes; no drill file written');
      return out;
    },
  },
  mask: {
    label: 'Photo/toner mask (SVG)',
    help: ['1:1 photo mask / toner-transfer sheet (SVG page) with scale bar and registration marks'],
    write: (c) => [{ name: EXPORT_FILE_NAMES.maskSvg(c.req.base), text: c.mask().svg, what: maskWhat(c, false) }],
  },
  'mask-pdf': {
    label: 'Photo/toner mask (PDF)',
    help: ['the same sheet as a vector PDF (NAME-mask.pdf)'],
    write: (c) => [{ name: EXPORT_FILE_NAMES.maskPdf(c.req.base), text: c.mask().pdf, what: maskWhat(c, true) }],
  },
  gcode: {
    label: 'G-code (milling)',
    help: ['G-code for a milling machine, one file per tool (NAME-T1-isolation.nc, NAME-T2-drill-0.80mm.nc, …,',
      'NAME-Tn-cutout.nc): isolation with the design\'s process tool, drilling, cutout with tabs'],
    write: (c) => gcodeFiles(c),
  },
};

/** The SVG drawing (also the app's live preview, so the preview is the file). */
export function svgOf(c: Pick<WriteContext, 'geometry' | 'layers' | 'req' | 'stamp'>): string {
  return toSvg(c.geometry, { mirror: c.req.mirror, style: c.req.svgStyle, stamp: c.stamp, ...(c.layers ? { layers: c.layers } : {}) });
}

function maskWhat(c: WriteContext, pdf: boolean): string {
  return `photo mask${pdf ? ' (PDF)' : ''}, ${c.req.maskPolarity}${c.req.mirror ? ', mirrored' : ''}, print at 100 %`;
}

function gcodeFiles(c: WriteContext): ExportFile[] {
  const plan = c.plan();
  const errors = plan.findings.filter((f) => f.severity === 'error');
  if (errors.length) throw millRefusal(errors);
  if (c.req.bias !== 0) c.say('info', 'the etch bias does not change the G-code (the mill cuts the drawn copper)');
  const files = plan.programs.map((p) => ({
    name: EXPORT_FILE_NAMES.gcode(c.req.base, p.tool),
    text: toGcode(plan, p, { application: c.sw.application, version: c.sw.version, designName: c.doc.name, designHash: c.sw.designHash }),
    what: `G-code, tool ${p.tool.number}: ${p.tool.label}, about ${Math.ceil(p.seconds / 60)} min`,
  }));
  for (const f of plan.findings) c.say(f.severity, f.message);
  const worst = plan.milled.pieces.reduce<(typeof plan.milled.pieces)[number] | null>((a, b) => (!a || Math.abs(b.z0Shift) > Math.abs(a.z0Shift) ? b : a), null);
  if (worst) c.say('info', `as milled, the largest Z0 shift is ${signed(worst.z0Shift)} Ω on ${worst.id} (${(worst.topWidth * 1e3).toFixed(3)} mm at the top, ${(worst.footWidth * 1e3).toFixed(3)} mm at the foot)`);
  c.say('info', `about ${Math.ceil(plan.seconds / 60)} min of machining in ${files.length} file(s), one per tool, run in tool order. ${MILLING_CAUTIONS.join(' ')}`);
  return files;
}

/** The refusal of a plan with errors (gap narrower than the cut, joined or destroyed islands, off the work area). */
export function millRefusal(errors: readonly MillFinding[]): InputError {
  const field = errors[0]!.code === 'work-area' ? 'workArea' : 'design';
  return new InputError('impossible-layout', field, 'a board the mill can make as designed',
    errors.slice(0, 6).map((e) => e.message).join('; ') + (errors.length > 6 ? `; and ${errors.length - 6} more` : ''), errors[0]!.fix);
}

/** A shift with its sign, to 0.01 (a shift that rounds to zero shows as +0.00, never −0.00). */
function signed(x: number): string { const r = Math.round(x * 100) / 100; return `${r >= 0 ? '+' : '−'}${Math.abs(r).toFixed(2)}`; }
