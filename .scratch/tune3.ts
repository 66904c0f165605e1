import { solveSection, GRID } from '../core/section/quasi-static-fd.ts';
import { hammerstadJensenStatic } from '../core/line/index.ts';
const G = globalThis as any;
const [E, I, R, T, F] = process.argv.slice(2).map(Number);
GRID.edgeDivisor = E; GRID.interfaceDivisor = I; GRID.growth = 1 + R; GRID.thicknessCells = T;
const cases = [[1,4.3,0],[1,4.3,0.035],[0.1,2.2,0],[10,13,0],[3,2.2,0]];
for (const [u, er, tn] of cases) {
  const h = 1e-3;
  const r2 = solveSection({ er, h, width: u*h, t: tn*h }, { loss: false, levels: 3, fineness: F||1 });
  const hj = hammerstadJensenStatic(u, tn, er);
  const d = G.__dbg[0];
  const z = d.c.map((c:number, k:number)=>1/(299792458*Math.sqrt(c*d.ca[k])));
  const p = (a:number[]) => Math.log2((a[0]-a[1])/(a[1]-a[2]));
  console.log(u, er, tn, 'levels', z.map((x:number)=>((x/hj.z0-1)*100).toFixed(3)).join(' '), 'p_c', p(d.c).toFixed(2), 'p_ca', p(d.ca).toFixed(2), r2.stats.nodesFine);
}
