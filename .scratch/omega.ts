import { solveSection } from '../core/section/index.ts';
const specs: any[] = [
  { er: 4.4, h: 1.6e-3, width: 3e-3, t: 35e-6 },
  { er: 3.66, h: 0.508e-3, width: 1.0e-3, t: 35e-6, side: { gap: 0.4e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 45e-6 } },
  { er: 4.4, h: 1.6e-3, width: 2.6e-3, t: 35e-6, etchAngleDeg: 75, side: { gap: 0.11e-3, width: Infinity, connection: 'floating' }, trench: { depth: 15e-6, angleDeg: 30 } },
];
for (const s of specs) { solveSection(s); const c = process.cpuUsage(); const r = solveSection(s, { loss: false }); const d = process.cpuUsage(c); console.log(process.env.SECTION_OMEGA, r.stats.iterations, ((d.user + d.system) / 1000).toFixed(0), r.modes[0].z0.toFixed(4)); }
