/**
 * The path ledger's meander shape choice (auto, serpentine, trombone) reaches the same core function as
 * `stripwright equalize --style`: the app's worker job gives the same copper as `equalizeGroup` with that style, and
 * a style that cannot make the lengthening is refused in words naming the style and what to try. Scenario of our own:
 * the demo feed with its left riser drawn long, so the right-hand paths fall behind.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { equalizeJob } from '../../renderer/src/worker/equalize-job.ts';
import { equalizeGroup, parseDesign, type DesignDoc, type MeanderStyle } from '../../core/index.ts';
import { initPolygons } from '../../core/geometry/index.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';

const wasm = join(process.cwd(), 'node_modules/clipper2-wasm/dist/es/clipper2z.wasm');
beforeAll(async () => { await initPolygons({ locateFile: () => wasm }); });

/** The demo with the left riser `mm` long (drawn 8 mm): the right-hand outputs lag. */
function demoWithRiser(mm: number): DesignDoc {
  const r = parseDesign(exampleText('demo')!);
  if (!r.ok) throw new Error('demo unreadable');
  const d = r.doc;
  return { ...d, segments: d.segments.map((s) => (s.id === 'risel' && s.kind === 'line' ? { ...s, length: { by: 'length' as const, length: mm * 1e-3 } } : s)) };
}

describe('meander shape in the app', () => {
  it.each<[MeanderStyle, RegExp]>([
    ['serpentine', /serpentine, \d+ bumps/],
    ['trombone', /trombone/],
  ])('%s: the job lays the shape asked for, the same copper as the core with that style', { timeout: 120_000 }, (style, shape) => {
    const doc = demoWithRiser(20);
    const app = equalizeJob({ doc, group: 'outputs', style });
    const core = equalizeGroup(doc, { group: 'outputs', style });
    expect(app.lines[0]).toMatch(shape);
    expect(app.segments).toEqual(core.doc.segments);
    expect(app.nodes).toEqual(core.doc.nodes);
    expect(app.spreadDeg).toBeLessThanOrEqual(0.5);
  });

  it('the two shapes give different copper (the choice is not ignored)', { timeout: 120_000 }, () => {
    const doc = demoWithRiser(20);
    const serp = equalizeJob({ doc, group: 'outputs', style: 'serpentine' });
    const trom = equalizeJob({ doc, group: 'outputs', style: 'trombone' });
    expect(serp.nodes.length).not.toBe(trom.nodes.length);
  });

  it('a shape too long for a small lengthening is refused, naming the shape and what to try', { timeout: 120_000 }, () => {
    const doc = demoWithRiser(10);
    expect(() => equalizeJob({ doc, group: 'outputs', style: 'serpentine' })).toThrow(/smallest serpentine .* adds .* mm.*choose the meander style auto/);
    expect(equalizeJob({ doc, group: 'outputs' }).lines[0]).toMatch(/dogleg/);
  });
});
