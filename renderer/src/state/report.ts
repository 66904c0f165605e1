/**
 * The design report as one command: the PDF of `stripwright report` (core designReport, run in the worker as the
 * Outputs panel's `report` file) written at once through the platform — a save dialog on the desktop, a download in
 * a browser — without opening the Outputs panel.
 */
import { exportBase } from '../../../core/index.ts';
import type { Platform } from '../platform/types.ts';
import type { Compute } from './compute.svelte.ts';
import { APP_VERSION, type EditorState } from './editor.svelte.ts';

/** What happened, in words for the status bar or a message: `ok` false when nothing was written because of a fault. */
export interface ReportOutcome { ok: boolean; message: string }

export async function writeDesignReport(editor: EditorState, compute: Compute, platform: Platform): Promise<ReportOutcome> {
  const base = exportBase(editor.doc.name);
  editor.status = 'Writing the design report…';
  const out = await compute.exportFiles({ formats: [], extras: ['report'], base, version: APP_VERSION, fileName: editor.fileName ?? `${base}.json` });
  if (!out.ok) return { ok: false, message: 'error' in out ? `The report was not written: ${out.error}` : 'The report was not written: a newer request replaced it; run the command again.' };
  const pdf = out.value.binary ?? [];
  if (!pdf.length) return { ok: false, message: 'The report was not written: the worker returned no PDF.' };
  const saved = await platform.exportFiles({ title: `Design report of ${editor.doc.name}`, files: pdf });
  if (!saved.ok) return { ok: false, message: `The report was not written: ${saved.error.message}` };
  if (!saved.value) return { ok: true, message: 'Report not written (cancelled).' };
  return { ok: true, message: `Wrote ${saved.value.written.join(', ')}${saved.value.folder ? ` to ${saved.value.folder}` : ''}` };
}
