import { solveSection } from '../core/section/index.ts';

const T: any = { er: 3.66, h: 0.508e-3, t: 35e-6, side: { gap: 0.4e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 45e-6 } };
for (const u of [0.05, 0.2, 1, 5, 20]) {
  const c0 = process.cpuUsage();
  const r = solveSection({ ...T, width: u * T.h }, { loss: true });
  const c = process.cpuUsage(c0);
  console.log(u, r.stats.nodesFine, r.stats.iterations, ((c.user + c.system) / 1000).toFixed(0) + 'ms', r.modes[0].z0.toFixed(2), (r.modes[0].error.z0*100).toFixed(3));
}
