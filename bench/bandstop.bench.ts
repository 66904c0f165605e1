/**
 * Band-stop block benchmark (`npm run bench -- bandstop`): CPU time of generating an equal-ripple band-stop (the fit
 * in Richards' variable and the correction against its own lossless sweep) for a few specs across the accepted range,
 * first (cold: nothing remembered) and again (warm: the same spec, as the app's preview and placing ask it twice; the
 * fits are remembered by their inputs, core/blocks/bandstopRichards.ts), and the wall time beside it. The design is
 * the generator's alone (plain microstrip sizing on glass-epoxy 1.6 mm, the junction models on).
 */
import { generateBlock, contextOf } from '../core/blocks/index.ts';
import { newDesign } from '../core/design/index.ts';
import { timed } from './timing.ts';


export async function run(): Promise<void> {
  const ctx = contextOf(newDesign({ f0: 2.45e9, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } }));
  const specs: [number, number, number][] = [[3, 0.5, 0.5], [5, 1, 0.3], [7, 1, 0.8], [7, 3, 0.8], [7, 0.1, 0.5]];
  const rows: string[] = ['spec                       cold cpu ms (wall)   again cpu ms (wall)'];
  for (const [n, r, bw] of specs) {
    const raw = { response: 'chebyshev', order: String(n), rippleDb: String(r), bw: String(bw) };
    const cold = timed(() => generateBlock('bandstop', raw, ctx));
    const warm = timed(() => generateBlock('bandstop', raw, ctx));
    rows.push(`order ${n}, ${r} dB, ${(bw * 100).toFixed(0)} %`.padEnd(27) + `${cold.cpu.toFixed(0).padStart(8)} (${cold.wall.toFixed(0)})`.padEnd(21) + `${warm.cpu.toFixed(0).padStart(8)} (${warm.wall.toFixed(0)})`);
  }
  console.log(rows.join('\n'));
}
