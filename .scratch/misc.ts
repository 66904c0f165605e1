import { solveSection } from '../core/section/quasi-static-fd.ts';
const base = { er: 3.66, h: 0.508e-3, width: 1.1e-3, t: 35e-6 };
const specs: any[] = [
  base,
  { ...base, side: { gap: 0.6e-3, width: Infinity, connection: 'stitched' } },
  { ...base, side: { gap: 0.6e-3, width: Infinity, connection: 'floating' } },
  { ...base, side: { gap: 0.6e-3, width: 2e-3, connection: 'stitched', sides: 'left' } },
  { ...base, side: { gap: 0.6e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 0.2e-3, angleDeg: 60 } },
  { ...base, side: { gap: 0.6e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 0.2e-3 } },
  { ...base, cover: { er: 3.5, thickness: 25e-6 } },
  { ...base, lid: 3e-3 },
  { ...base, etchAngleDeg: 60 },
  { ...base, spacing: 0.3e-3 },
  { ...base, spacing: 0.3e-3, side: { gap: 0.6e-3, width: Infinity, connection: 'floating' } },
  { ...base, spacing: 0.3e-3, side: { gap: 0.6e-3, width: 3e-3, connection: 'stitched', sides: 'right' } },
];
for (const s of specs) {
  const t0 = process.cpuUsage();
  const r = solveSection(s, { potential: true });
  const cu = process.cpuUsage(t0);
  console.log(r.modes.map(m => `${m.mode} z0=${m.z0.toFixed(3)} ee=${m.epsEff.toFixed(4)} err=${(m.error.z0*100).toFixed(3)}% dLdn=${m.dLdn.toExponential(3)} ac/Rs=${(m.dLdn/(2*1.2566e-6*m.z0)).toFixed(3)}`).join(' | '), r.stats.nodesFine, ((cu.user+cu.system)/1000).toFixed(0)+'ms', r.warnings.map(w=>w.message).join(';'));
}
