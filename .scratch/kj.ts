const ETA = 376.73;

function hjSingle(u: number, er: number): { z0: number; ee: number } {
  const f = 6 + (2 * Math.PI - 6) * Math.exp(-((30.666 / u) ** 0.7528));
  const z01 = (ETA / (2 * Math.PI)) * Math.log(f / u + Math.sqrt(1 + 4 / (u * u)));
  const a = 1 + Math.log((u ** 4 + (u / 52) ** 2) / (u ** 4 + 0.432)) / 49 + Math.log(1 + (u / 18.1) ** 3) / 18.7;
  const b = 0.564 * ((er - 0.9) / (er + 3)) ** 0.053;
  const ee = (er + 1) / 2 + ((er - 1) / 2) * (1 + 10 / u) ** (-a * b);
  return { z0: z01 / Math.sqrt(ee), ee };
}

function kj1984(u: number, g: number, er: number) {
  const s = hjSingle(u, er);
  const v = (u * (20 + g * g)) / (10 + g * g) + g * Math.exp(-g);
  const ae = 1 + Math.log((v ** 4 + (v / 52) ** 2) / (v ** 4 + 0.432)) / 49 + Math.log(1 + (v / 18.1) ** 3) / 18.7;
  const be = 0.564 * ((er - 0.9) / (er + 3)) ** 0.053;
  const eeE = (er + 1) / 2 + ((er - 1) / 2) * (1 + 10 / v) ** (-ae * be);
  const a0 = 0.7287 * (s.ee - (er + 1) / 2) * (1 - Math.exp(-0.179 * u));
  const b0 = (0.747 * er) / (0.15 + er);
  const c0 = b0 - (b0 - 0.207) * Math.exp(-0.414 * u);
  const d0 = 0.593 + 0.694 * Math.exp(-0.562 * u);
  const eeO = ((er + 1) / 2 + a0 - s.ee) * Math.exp(-c0 * g ** d0) + s.ee;
  const Q1 = 0.8695 * u ** 0.194;
  const Q2 = 1 + 0.7519 * g + 0.189 * g ** 2.31;
  const Q3 = 0.1975 + (16.6 + (8.4 / g) ** 6) ** -0.387 + Math.log(g ** 10 / (1 + (g / 3.4) ** 10)) / 241;
  const Q4 = ((2 * Q1) / Q2) / (Math.exp(-g) * u ** Q3 + (2 - Math.exp(-g)) * u ** -Q3);
  const Q5 = 1.794 + 1.14 * Math.log(1 + 0.638 / (g + 0.517 * g ** 2.43));
  const Q6 = 0.2305 + Math.log(g ** 10 / (1 + (g / 5.8) ** 10)) / 281.3 + Math.log(1 + 0.598 * g ** 1.154) / 5.1;
  const Q7 = (10 + 190 * g * g) / (1 + 82.3 * g ** 3);
  const Q8 = Math.exp(-6.5 - 0.95 * Math.log(g) - (g / 0.15) ** 5);
  const Q9 = Math.log(Q7) * (Q8 + 1 / 16.5);
  const Q10 = Q4 - (Q5 / Q2) * Math.exp(Q6 * Math.log(u) * u ** -Q9);
  const k = (s.z0 * Math.sqrt(s.ee)) / ETA;
  const z0e = (s.z0 * Math.sqrt(s.ee / eeE)) / (1 - k * Q4);
  const z0o = (s.z0 * Math.sqrt(s.ee / eeO)) / (1 - k * Q10);
  return { z0e, z0o, eeE, eeO };
}

import { solveSection } from '../core/index.ts';
let worst = { z: 0, e: 0 };
for (const [u, g, er] of [[1, 0.5, 4.4], [0.5, 0.2, 9.8], [2, 1, 3.66], [1, 2, 2.2], [0.3, 0.3, 6]]) {
  const r = solveSection({ er, h: 1e-3, width: u * 1e-3, t: 0, spacing: g * 1e-3 }); const ref = kj1984(u, g, er);
  const [e, o] = r.modes;
  worst.z = Math.max(worst.z, Math.abs(e.z0 / ref.z0e - 1), Math.abs(o.z0 / ref.z0o - 1));
  worst.e = Math.max(worst.e, Math.abs(e.epsEff / ref.eeE - 1), Math.abs(o.epsEff / ref.eeO - 1));
}
console.log('KJ max dz0', (worst.z * 100).toFixed(3), 'dee', (worst.e * 100).toFixed(3));
