import { solveSection } from '../core/section/quasi-static-fd.ts';
import { hammerstadJensenStatic } from '../core/line/index.ts';
const cases = [[1,4.3,0],[1,4.3,0.035],[0.1,2.2,0],[10,13,0]];
solveSection({ er: 4, h: 1e-3, width: 1e-3, t: 0 });
for (const [u, er, tn] of cases) {
  const h = 1e-3;
  const t0 = performance.now();
  const r = solveSection({ er, h, width: u*h, t: tn*h }, { levels: 3, loss: false });
  const dt = performance.now() - t0;
  const hj = hammerstadJensenStatic(u, tn, er);
  console.log(u, er, tn, 'hj z0', hj.z0.toFixed(4), r.stats.nodesFine, r.stats.iterations, dt.toFixed(1)+'ms', JSON.stringify((globalThis as any).__dbg.map((p:any)=>[p.c[0]*1e12,p.ca[0]*1e12, 1/(299792458*Math.sqrt(p.c[0]*p.ca[0]))])));
}
