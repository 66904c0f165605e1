/**
 * The editor's milling job (the code the worker runs): the plan's preview, time, widths as milled and the copper for
 * the board overlay; and G-code through the same export job as the other outputs, read back by gcode-toolpath (npm).
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { exportJob, millingJob, setPolygonInit } from '../../renderer/src/worker/jobs.ts';
import { initPolygons } from '../../core/geometry/index.ts';
import { parseDesign } from '../../core/design/index.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';
import { retrace } from '../../scripts/oracles/gcode-retrace.ts';

const wasm = join(process.cwd(), 'node_modules/clipper2-wasm/dist/es/clipper2z.wasm');
setPolygonInit(() => initPolygons({ locateFile: () => wasm }));
const demo = () => { const r = parseDesign(exampleText('demo')!); if (!r.ok) throw new Error('demo unreadable'); return r.doc; };

describe('milling from the editor', () => {
  it('plans without writing: preview, time per tool, every line piece with its milled width and Z0', async () => {
    const doc = demo();
    const out = await millingJob({ doc, options: {}, write: false, base: 'demo', version: 'test' });
    expect(out.files).toEqual([]);
    expect(out.preview).toMatch(/^<svg[^>]*viewBox/);
    expect(out.preview).toContain('data-layer="milled-copper"');
    expect(out.tools.map((t) => t.file)).toEqual(['demo-T1-isolation.nc', 'demo-T2-cutout.nc']);
    expect(out.seconds).toBeCloseTo(out.tools.reduce((s, t) => s + t.seconds, 0), 9);
    const lines = doc.segments.filter((s) => s.kind === 'line' || s.kind === 'taper').map((s) => s.id).sort();
    expect(out.pieces.map((p) => p.id).sort()).toEqual(lines);
    expect(out.milled.length).toBeGreaterThan(0);
    expect(out.findings.filter((f) => f.severity === 'error')).toEqual([]);
  });
  it('writes G-code through the export job, with the options given', async () => {
    const out = await exportJob({ doc: demo(), layers: ['copper'], mirror: false, formats: ['gcode'], base: 'demo', version: 'test', milling: { units: 'inch', passes: 1 } });
    expect(out.files.map((f) => f.name)).toEqual(['demo-T1-isolation.nc', 'demo-T2-cutout.nc']);
    const t = retrace(out.files[0]!.data);
    expect(t.units).toBe('G20');
    expect(out.notes.join(' ')).toMatch(/one per tool/);
  });
  it('a refused plan writes nothing and says why', async () => {
    await expect(exportJob({ doc: demo(), layers: ['copper'], mirror: false, formats: ['gcode'], base: 'demo', version: 'test', milling: { workArea: { width: 0.05, height: 0.05 } } }))
      .rejects.toThrow(/outside the work area/);
  });
});
