/**
 * `exportDesign`: the one call from a design to its files, for the CLI's `export` and the app's Outputs panel alike.
 * Refuses (an InputError naming the pieces) whatever `stripwright build` refuses: an unfinished network, sizing
 * problems, pieces that could not be placed, shop-check errors; then writes every asked format from the same
 * prepared board. Nothing is written here: the faces write the returned texts (CLI atomically, the app through its
 * platform), so a refusal leaves no file behind.
 */
import type { DesignDoc } from '../design/types.ts';
import type { Warning } from '../util/warnings.ts';
import { toMask, type Mask } from '../export/mask.ts';
import { checkLayers } from '../export/layers.ts';
import { FORMAT_INFO, svgOf, type ExportFile, type ExportMessage, type WriteContext } from './formats.ts';
import { resolveExportRequest, type ExportRequest } from './request.ts';
import type { DesignPipeline } from './stages.ts';

export const APPLICATION = 'Stripwright';

export interface ExportResult {
  files: ExportFile[];
  /** Notes, warnings and the G-code findings, in the order they arose (a face prints or shows them all). */
  messages: ExportMessage[];
  /** The design's revision (content hash) written into the files. */
  revision: string;
  /** The SVG drawing of the chosen layers (the app's live preview): exactly what the 'svg' format writes. */
  preview: string;
}

export function exportDesign(pipeline: DesignPipeline, doc: DesignDoc, request: ExportRequest): ExportResult {
  return writeFiles(pipeline, doc, request, 'as-build');
}

/**
 * The files of a request. `gate` 'as-build' (every face) refuses what `build` refuses; 'board-only' (exportGcode, for
 * tests and benchmarks of synthetic boards with no ports to trace) needs only a board that can be built and leaves
 * each writer's own refusals (the milling plan's errors).
 */
export function writeFiles(pipeline: DesignPipeline, doc: DesignDoc, request: ExportRequest, gate: 'as-build' | 'board-only'): ExportResult {
  const req = resolveExportRequest(request);
  // Files only from a design `build` accepts; the preview alone (no formats) needs only its board.
  if (req.formats.length && gate === 'as-build') pipeline.buildable(doc); else pipeline.board(doc);
  const isolation = req.tool !== undefined || (req.layers?.includes('isolation') ?? false);
  const prepared = pipeline.prepared(doc, { bias: req.bias, isolation, ...(req.tool !== undefined ? { tool: req.tool } : {}) });
  const layers = req.layers ? checkLayers(req.layers, prepared.geometry, 'layers') : undefined;
  const messages: ExportMessage[] = [];
  const say = (severity: ExportMessage['severity'], text: string) => { messages.push({ severity, text }); };
  const revision = pipeline.revision(doc);
  const sw = { application: APPLICATION, version: req.version, designHash: revision };
  const stamp = `design ${revision}, ${APPLICATION} ${req.version}`;
  let mask: Mask | null = null;
  const ctx: WriteContext = {
    doc, req, board: pipeline.board(doc), geometry: prepared.geometry, layers, sw, stamp, say,
    mask: () => (mask ??= toMask(pipeline.board(doc), { page: req.maskPage, polarity: req.maskPolarity, mirror: req.mirror, bias: req.bias, title: `${doc.name} (${stamp})` })),
    plan: () => pipeline.plan(doc, req.milling),
  };
  const files: ExportFile[] = [];
  for (const f of req.formats) files.push(...FORMAT_INFO[f].write(ctx));
  for (const w of prepared.warnings) say(severityOf(w), w.message);
  return { files, messages, revision, preview: svgOf(ctx) };
}

function severityOf(w: Warning): ExportMessage['severity'] {
  return w.severity === 'error' ? 'error' : w.severity === 'info' ? 'info' : 'warning';
}
