/**
 * The app's compute worker runs every job of one design revision on one pipeline (core/pipeline): layout, board,
 * check, preview, export, milling and response size the design once and build its board once. A new revision is
 * sized again. The layout result no longer carries the document back to the page.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { layoutJob, geometryJob, checkJob, exportJob, millingJob, responseJob, pipeline, setPolygonInit } from '../../renderer/src/worker/jobs.ts';
import { initPolygons } from '../../core/geometry/index.ts';
import { parseDesign } from '../../core/design/index.ts';
import { designSweepSettings } from '../../core/network/index.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';

const wasm = join(process.cwd(), 'node_modules/clipper2-wasm/dist/es/clipper2z.wasm');
setPolygonInit(() => initPolygons({ locateFile: () => wasm }));
const demo = () => { const r = parseDesign(exampleText('demo')!); if (!r.ok) throw new Error('demo unreadable'); return r.doc; };
const none = () => {};

describe('one pipeline per revision in the worker', () => {
  it('every job of one revision shares one sizing and one board', { timeout: 60_000 }, async () => {
    pipeline.memo.clear();
    // Each job gets its own copy of the document, as postMessage gives the worker.
    const lay = await layoutJob({ doc: demo() }, none);
    expect('doc' in lay.sized).toBe(false);
    await geometryJob({ doc: demo() });
    await checkJob({ doc: demo() });
    await exportJob({ doc: demo(), formats: [], base: 'demo', version: 't', layers: ['copper'] });
    await exportJob({ doc: demo(), formats: ['dxf', 'gerber', 'mask-pdf'], base: 'demo', version: 't' });
    await millingJob({ doc: demo(), options: {}, write: false, base: 'demo', version: 't' });
    await responseJob({ doc: demo(), settings: { ...designSweepSettings(demo()), points: 11 } }, none);
    expect(pipeline.count('sized')).toBe(1);
    expect(pipeline.count('board')).toBe(1);
    expect(pipeline.count('netlist')).toBe(1);
    const edited = demo();
    edited.frequency = { ...edited.frequency, f0: edited.frequency.f0 * 1.01 };
    await layoutJob({ doc: edited }, none);
    await exportJob({ doc: edited, formats: ['svg'], base: 'demo', version: 't' });
    expect(pipeline.count('sized')).toBe(2);
    expect(pipeline.count('board')).toBe(2);
  });
});
