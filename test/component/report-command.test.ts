/**
 * The report command (renderer/src/state/report.ts): asks the worker for the report alone (no shop formats), hands
 * the one PDF to the platform's save, and says what happened — written (with the file and folder), cancelled, or
 * not written with the reason. The PDF itself is checked with poppler in test/reference/report-pdf.test.ts and, from
 * the app, in test/e2e/measured-report.spec.ts.
 */
import { describe, expect, it } from 'vitest';
import { writeDesignReport } from '../../renderer/src/state/report.ts';
import type { Compute } from '../../renderer/src/state/compute.svelte.ts';
import type { EditorState } from '../../renderer/src/state/editor.svelte.ts';
import type { Platform } from '../../renderer/src/platform/types.ts';
import { exportBase } from '../../core/index.ts';

const PDF = { name: 'feed-a-report.pdf', data: new Uint8Array([0x25, 0x50, 0x44, 0x46]) };

function setup(opts: { worker?: unknown; save?: unknown }) {
  const asked: unknown[] = [], saved: { title: string; files: unknown[] }[] = [];
  const editor = { doc: { name: 'Feed A' }, fileName: null, status: '' } as unknown as EditorState;
  const compute = { exportFiles: async (req: unknown) => { asked.push(req); return opts.worker ?? { ok: true, value: { preview: '', files: [], notes: [], binary: [PDF] } }; } } as unknown as Compute;
  const platform = { exportFiles: async (req: { title: string; files: unknown[] }) => { saved.push(req); return opts.save ?? { ok: true, value: { folder: '/home/me', written: [PDF.name] } }; } } as unknown as Platform;
  return { editor, compute, platform, asked, saved };
}

describe('the design report as one command', () => {
  it('asks for the report alone and saves that one PDF through the platform', async () => {
    const t = setup({});
    const r = await writeDesignReport(t.editor, t.compute, t.platform);
    expect(t.asked).toHaveLength(1);
    // File stems follow the core's one naming rule (exportBase), as Outputs and the CLI name theirs.
    expect(t.asked[0]).toMatchObject({ formats: [], extras: ['report'], base: exportBase('Feed A'), fileName: `${exportBase('Feed A')}.json` });
    expect(t.saved).toHaveLength(1);
    expect(t.saved[0]!.files).toEqual([PDF]);
    expect(r).toEqual({ ok: true, message: 'Wrote feed-a-report.pdf to /home/me' });
  });
  it('says so when the person cancels the save dialog', async () => {
    const t = setup({ save: { ok: true, value: null } });
    expect(await writeDesignReport(t.editor, t.compute, t.platform)).toEqual({ ok: true, message: 'Report not written (cancelled).' });
  });
  it('gives the reason when the design cannot be reported or the file cannot be written', async () => {
    const refused = setup({ worker: { ok: false, error: 'pieces p3 got no copper' } });
    const a = await writeDesignReport(refused.editor, refused.compute, refused.platform);
    expect(a.ok).toBe(false);
    expect(a.message).toContain('pieces p3 got no copper');
    expect(refused.saved).toHaveLength(0);
    const io = setup({ save: { ok: false, error: { code: 'io', message: 'the disk is full' } } });
    const b = await writeDesignReport(io.editor, io.compute, io.platform);
    expect(b).toEqual({ ok: false, message: 'The report was not written: the disk is full' });
  });
});
