import { initPolygons, unionRegions } from './core/geometry/polygons.ts';
import { corporateFeed } from './core/layout/generators/corporateFeed.ts';
import { sizeDesign } from './core/layout/sizing.ts';
import { buildBoardGeometry, pieceOutlines } from './core/layout/geometry.ts';
await initPolygons();
for (const n of [256, 1024]) {
  const doc = corporateFeed({ outputs: n, f0: 5.8e9 });
  for (let i = 0; i < 3; i++) buildBoardGeometry(sizeDesign(doc));
  const t: Record<string, number[]> = { size: [], outlines: [], union: [], board: [] };
  for (let i = 0; i < 5; i++) {
    let t0 = performance.now(); const s = sizeDesign(doc); t.size.push(performance.now() - t0);
    t0 = performance.now(); const o = pieceOutlines(s); t.outlines.push(performance.now() - t0);
    t0 = performance.now(); unionRegions(o.outlines.flatMap((x) => x.regions)); t.union.push(performance.now() - t0);
    t0 = performance.now(); buildBoardGeometry(s); t.board.push(performance.now() - t0);
  }
  console.log(n, doc.segments.length, Object.entries(t).map(([k, v]) => `${k} ${Math.min(...v).toFixed(1)}`).join('  '));
}
