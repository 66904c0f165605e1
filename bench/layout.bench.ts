/**
 * Layout benchmark: sizing + copper geometry (outlines and the union into clean polygons) of generated corporate
 * feeds with 16, 64, 256 and 1024 outputs. Prints the median of several runs after a warm-up, the time per piece and
 * the growth exponent between sizes (1.0 = linear). Target: the 64-output feed well inside one 60 Hz frame (16.7 ms).
 */
import { initPolygons } from '../core/geometry/polygons.ts';
import { corporateFeed } from '../core/layout/generators/corporateFeed.ts';
import { sizeDesign } from '../core/layout/sizing.ts';
import { buildBoardGeometry } from '../core/layout/geometry.ts';
import { LineCache } from '../core/layout/lineCache.ts';

function median(xs: number[]): number { const s = xs.slice().sort((a, b) => a - b); return s[Math.floor(s.length / 2)]!; }

export async function run(): Promise<void> {
  await initPolygons();
  const sizes = [16, 64, 256, 1024];
  const rows: { n: number; pieces: number; size: number; sizeWarm: number; geo: number; total: number }[] = [];
  for (const n of sizes) {
    const doc = corporateFeed({ outputs: n, f0: 5.8e9 });
    const runs = n >= 1024 ? 7 : 21;
    // Warm-up until the JIT has settled (and the wasm heap has grown): about a quarter second of work.
    const tw0 = performance.now();
    for (let i = 0; i < 200 && performance.now() - tw0 < 250; i++) buildBoardGeometry(sizeDesign(doc));
    const ts: number[] = [], tw: number[] = [], tg: number[] = [], tt: number[] = [];
    const shared = new LineCache(doc.substrate);
    let pieces = 0;
    for (let i = 0; i < runs; i++) {
      const t0 = performance.now();
      const s = sizeDesign(doc); // a fresh line cache: every synthesis is done again
      const t1 = performance.now();
      buildBoardGeometry(s);
      const t2 = performance.now();
      sizeDesign(doc, { cache: shared }); // as a face re-sizing after an edit, reusing its cache
      const t3 = performance.now();
      ts.push(t1 - t0); tg.push(t2 - t1); tt.push(t2 - t0); tw.push(t3 - t2);
      pieces = s.pieces.length;
    }
    rows.push({ n, pieces, size: median(ts), sizeWarm: median(tw), geo: median(tg), total: median(tt) });
  }
  console.log('outputs  pieces  size ms  size (cache) ms  geometry+union ms  total ms  µs/piece  growth');
  rows.forEach((r, i) => {
    const prev = rows[i - 1];
    const growth = prev ? (Math.log(r.total / prev.total) / Math.log(r.pieces / prev.pieces)).toFixed(2) : '—';
    console.log(`${String(r.n).padStart(7)}  ${String(r.pieces).padStart(6)}  ${r.size.toFixed(2).padStart(7)}  ${r.sizeWarm.toFixed(2).padStart(15)}  ${r.geo.toFixed(2).padStart(17)}  ${r.total.toFixed(2).padStart(8)}  ${((r.total / r.pieces) * 1000).toFixed(1).padStart(8)}  ${growth.padStart(6)}`);
  });
  const r64 = rows.find((r) => r.n === 64)!;
  console.log(`64 outputs: ${r64.total.toFixed(2)} ms of a 16.7 ms frame (${((r64.total / 16.7) * 100).toFixed(0)} %)`);
}
