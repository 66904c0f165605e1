import { solveSection, GRID } from '../core/section/quasi-static-fd.ts';
import { hammerstadJensenStatic } from '../core/line/index.ts';
const G = globalThis as any;
import { STOP } from '../core/section/laplace.ts'; if (process.env.TOL) STOP.rel = Number(process.env.TOL);
const [E, I, R, T, F] = process.argv.slice(2).map(Number);
GRID.edgeDivisor = E; GRID.interfaceDivisor = I; GRID.growth = 1 + R; GRID.thicknessCells = T;
const cases = [[1,4.3,0],[1,4.3,0.035],[0.1,2.2,0],[10,13,0],[0.1,10,0.07],[3,2.2,0],[3,4.3,0.02]];
for (let k = 0; k < 5; k++) solveSection({ er: 4, h: 1e-3, width: 1e-3, t: 0 });
for (const [u, er, tn] of cases) {
  const h = 1e-3;
  let dt2 = Infinity, r2: any;
  for (let k = 0; k < 3; k++) { const t1 = process.cpuUsage(); r2 = solveSection({ er, h, width: u*h, t: tn*h }, { loss: false, fineness: F }); const cu = process.cpuUsage(t1); dt2 = Math.min(dt2, (cu.user + cu.system) / 1000); }
  const hj = hammerstadJensenStatic(u, tn, er);
  const z = G.__dbg[0].c.map((c:number, k:number)=>1/(299792458*Math.sqrt(c*G.__dbg[0].ca[k])));
  console.log(u, er, tn, 'hj', hj.z0.toFixed(3), 'levels', z.map((x:number)=>((x/hj.z0-1)*100).toFixed(3)).join(' '), 'extrap', ((r2.modes[0].z0/hj.z0-1)*100).toFixed(3), 'ee', ((r2.modes[0].epsEff/hj.epsEff-1)*100).toFixed(3), 'est', (r2.modes[0].error.z0*100).toFixed(3), r2.stats.nodesFine, r2.stats.iterations, dt2.toFixed(1)+'ms');
}
