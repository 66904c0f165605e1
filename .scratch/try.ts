import { solveSection } from '../core/section/quasi-static-fd.ts';
import { hammerstadJensenStatic } from '../core/line/index.ts';
const cases = [[0.1,2.2],[0.5,4.3],[1,4.3],[2,9.8],[5,3],[10,13]];
for (const [u, er] of cases) {
  for (const fin of [1, 2]) {
  const h = 1e-3;
  const t0 = performance.now();
  const r = solveSection({ er, h, width: u*h, t: 0 }, { fineness: fin });
  const dt = performance.now() - t0;
  const hj = hammerstadJensenStatic(u, 0, er);
  const m = r.modes[0];
  console.log(u, er, fin, 'z0', m.z0.toFixed(3), 'hj', hj.z0.toFixed(3), ((m.z0/hj.z0-1)*100).toFixed(3)+'%', 'ee', ((m.epsEff/hj.epsEff-1)*100).toFixed(3)+'%', 'err', (m.error.z0*100).toFixed(3), r.stats.nodesFine, r.stats.iterations, dt.toFixed(1)+'ms');
  }
}
