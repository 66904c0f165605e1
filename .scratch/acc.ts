// Prints the largest deviations of the outside checks (for the README and docs).
import { solveSection, hammerstadJensenStatic } from '../core/index.ts';
let mz = 0, me = 0;
for (const u of [0.1, 0.3, 1, 3, 10]) for (const er of [2, 4.4, 9.8, 13]) {
  const m = solveSection({ er, h: 1e-3, width: u * 1e-3, t: 0 }).modes[0]!; const hj = hammerstadJensenStatic(u, 0, er);
  mz = Math.max(mz, Math.abs(m.z0 / hj.z0 - 1)); me = Math.max(me, Math.abs(m.epsEff / hj.epsEff - 1));
}
console.log('HJ t=0 max dz0', (mz * 100).toFixed(3), 'dee', (me * 100).toFixed(3));
mz = 0; me = 0;
for (const [u, er, tn] of [[0.3, 4.4, 0.022], [1, 3.66, 0.069], [2, 4.4, 0.044], [5, 9.8, 0.035], [1, 2.2, 0.14]]) {
  const m = solveSection({ er, h: 1e-3, width: u * 1e-3, t: tn * 1e-3 }, { loss: false }).modes[0]!; const hj = hammerstadJensenStatic(u, tn, er);
  mz = Math.max(mz, Math.abs(m.z0 / hj.z0 - 1)); me = Math.max(me, Math.abs(m.epsEff / hj.epsEff - 1));
}
console.log('HJ t>0 max dz0', (mz * 100).toFixed(3), 'dee', (me * 100).toFixed(3));
function ellipK(k: number) { let a = 1, b = Math.sqrt(1 - k * k); for (let i = 0; i < 40; i++) { const an = (a + b) / 2; b = Math.sqrt(a * b); a = an; } return Math.PI / (2 * a); }
mz = 0; me = 0;
for (const [er, s, w] of [[4.4, 1, 0.2], [4.4, 0.5, 0.3], [9.8, 1, 0.5], [3.66, 2, 0.3], [2.2, 0.6, 0.15], [9.8, 0.4, 0.1]]) {
  const h = 1e-3, S = s * h, W = w * h;
  const k = S / (S + 2 * W), k3 = Math.tanh(Math.PI * S / (4 * h)) / Math.tanh(Math.PI * (S + 2 * W) / (4 * h));
  const r1 = ellipK(k) / ellipK(Math.sqrt(1 - k * k)), r3 = ellipK(k3) / ellipK(Math.sqrt(1 - k3 * k3)); const q = r3 / r1;
  const ee = (1 + er * q) / (1 + q), z0 = 60 * Math.PI / Math.sqrt(ee) / (r1 + r3);
  const m = solveSection({ er, h, width: S, t: 0, side: { gap: W, width: Infinity, connection: 'stitched' } }).modes[0]!;
  mz = Math.max(mz, Math.abs(m.z0 / z0 - 1)); me = Math.max(me, Math.abs(m.epsEff / ee - 1));
}
console.log('CBCPW max dz0', (mz * 100).toFixed(3), 'dee', (me * 100).toFixed(3));
