import { solveSection, hammerstadJensenStatic } from '../core/index.ts';
const cases: [number, number, number][] = [[0.3, 4.4, 0.022], [1, 3.66, 0.069], [2, 4.4, 0.044], [5, 9.8, 0.035], [1, 2.2, 0.14], [0.1, 10, 0.07]];
for (const [u, er, tn] of cases) {
  const c0 = process.cpuUsage();
  const m = solveSection({ er, h: 1e-3, width: u * 1e-3, t: tn * 1e-3 }, { loss: false });
  const c = process.cpuUsage(c0);
  const hj = hammerstadJensenStatic(u, tn, er);
  console.log(u, er, tn, ((m.modes[0].z0 / hj.z0 - 1) * 100).toFixed(3), ((m.modes[0].epsEff / hj.epsEff - 1) * 100).toFixed(3), 'est', (m.modes[0].error.z0 * 100).toFixed(3), m.stats.nodesFine, ((c.user + c.system) / 1000).toFixed(0) + 'ms');
}
