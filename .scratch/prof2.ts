import { solveSection } from '../core/section/quasi-static-fd.ts';
const G = globalThis as any; G.__E = 100; G.__I = 6; G.__R = 0.3;
for (let k = 0; k < 8; k++) {
  const t0 = performance.now();
  const r = solveSection({ er: 4.3, h: 1e-3, width: 1e-3, t: 0.035e-3 }, { levels: 2, loss: false });
  console.log(r.stats.nodesFine, r.stats.iterations, (performance.now() - t0).toFixed(1));
}
