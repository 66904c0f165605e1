import { solveSection } from '../core/section/quasi-static-fd.ts';
for (let k = 0; k < 40; k++) {
  const t0 = performance.now();
  const r = solveSection({ er: 4.3, h: 1e-3, width: 1e-3, t: 0 }, { levels: 2, loss: false });
  console.log(r.stats.nodesFine, r.stats.iterations, (performance.now() - t0).toFixed(1));
}
