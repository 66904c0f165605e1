/**
 * A second, test-only transcription of the Hammerstad–Jensen 1980 static microstrip model at t = 0
 * (E. Hammerstad and Ø. Jensen, IEEE MTT-S IMS Digest 1980, pp. 407–409), used to feed published discontinuity
 * formulas with εeff and Z0 without going through the project's own line code. Also a plain bisection synthesis.
 */
const ETA0 = 376.730313668;

export function hjZ01(u: number): number {
  const f = 6 + (2 * Math.PI - 6) * Math.exp(-((30.666 / u) ** 0.7528));
  return (ETA0 / (2 * Math.PI)) * Math.log(f / u + Math.sqrt(1 + (2 / u) ** 2));
}
export function hjEe(u: number, er: number): number {
  const a = 1 + Math.log((u ** 4 + (u / 52) ** 2) / (u ** 4 + 0.432)) / 49 + Math.log(1 + (u / 18.1) ** 3) / 18.7;
  const b = 0.564 * ((er - 0.9) / (er + 3)) ** 0.053;
  return (er + 1) / 2 + ((er - 1) / 2) * (1 + 10 / u) ** (-a * b);
}
export function hjZ0(u: number, er: number): number { return hjZ01(u) / Math.sqrt(hjEe(u, er)); }
/** W/h for a static Z0 (t = 0) by bisection on ln u. */
export function hjSynthU(z0: number, er: number): number {
  let lo = Math.log(1e-3), hi = Math.log(1e3);
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (hjZ0(Math.exp(mid), er) > z0) lo = mid; else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

/**
 * Thickness-corrected HJ static values (Hammerstad & Jensen 1980 paper form, tn = t/h) and the Kirschning–Jansen 1982 εe(f)
 * with the Jansen–Kirschning 1983 Z0(f) (Kirschning & Jansen 1982, Electronics Letters 18(6), and Jansen & Kirschning 1983, Arch. Elektr. Übertr. 37 (from memory); R8 with the frequency term inside the exponential),
 * transcribed again for the tests. fn = f·h in GHz·mm.
 */
export function oracleLine(W: number, h: number, t: number, er: number, f: number): { z0: number; ee: number; z0s: number; ees: number } {
  const u = W / h, tn = t / h;
  let du1 = 0, dur = 0;
  if (tn > 0) {
    du1 = (tn / Math.PI) * Math.log(1 + (4 * Math.E * Math.tanh(Math.sqrt(6.517 * u)) ** 2) / tn);
    dur = 0.5 * (1 + 1 / Math.cosh(Math.sqrt(er - 1))) * du1;
  }
  const u1 = u + du1, ur = u + dur;
  const z0s = hjZ01(ur) / Math.sqrt(hjEe(ur, er));
  const ees = hjEe(ur, er) * (hjZ01(u1) / hjZ01(ur)) ** 2;
  if (f === 0) return { z0: z0s, ee: ees, z0s, ees };
  const fn = f * h * 1e-6;
  const uu = ur;
  const P1 = 0.27488 + (0.6315 + 0.525 / (1 + 0.0157 * fn) ** 20) * uu - 0.065683 * Math.exp(-8.7513 * uu);
  const P2 = 0.33622 * (1 - Math.exp(-0.03442 * er));
  const P3 = 0.0363 * Math.exp(-4.6 * uu) * (1 - Math.exp(-((fn / 38.7) ** 4.97)));
  const P4 = 1 + 2.751 * (1 - Math.exp(-((er / 15.916) ** 8)));
  const P = P1 * P2 * ((0.1844 + P3 * P4) * fn) ** 1.5763;
  const eef = er - (er - ees) / (1 + P);
  const R1 = 0.03891 * er ** 1.4, R2 = 0.267 * uu ** 7, R3 = 4.766 * Math.exp(-3.228 * uu ** 0.641);
  const R4 = 0.016 + (0.0514 * er) ** 4.524, R5 = (fn / 28.843) ** 12, R6 = 22.2 * uu ** 1.92;
  const R7 = 1.206 - 0.3144 * Math.exp(-R1) * (1 - Math.exp(-R2));
  const R8 = 1 + 1.275 * (1 - Math.exp(-0.004625 * R3 * er ** 1.674 * (fn / 18.365) ** 2.745));
  const R9 = ((5.086 * R4 * R5) / (0.3838 + 0.386 * R4)) * (Math.exp(-R6) / (1 + 1.2992 * R5)) * ((er - 1) ** 6 / (1 + 10 * (er - 1) ** 6));
  const R10 = 0.00044 * er ** 2.136 + 0.0184;
  const R11 = (fn / 19.47) ** 6 / (1 + 0.0962 * (fn / 19.47) ** 6);
  const R12 = 1 / (1 + 0.00245 * uu ** 2);
  const R13 = 0.9408 * eef ** R8 - 0.9603;
  const R14 = (0.9408 - R9) * ees ** R8 - 0.9603;
  const R15 = 0.707 * R10 * (fn / 12.3) ** 1.097;
  const R16 = 1 + 0.0503 * er ** 2 * R11 * (1 - Math.exp(-((uu / 15) ** 6)));
  const R17 = R7 * (1 - 1.1241 * (R12 / R16) * Math.exp(-0.026 * fn ** 1.15656 - R15));
  return { z0: z0s * (R13 / R14) ** R17, ee: eef, z0s, ees };
}

/** Width whose Z0(f) is z0 (bisection on ln W). */
export function oracleSynth(z0: number, h: number, t: number, er: number, f: number): number {
  let lo = Math.log(1e-3 * h), hi = Math.log(1e3 * h);
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (oracleLine(Math.exp(mid), h, t, er, f).z0 > z0) lo = mid; else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

export const C0 = 299_792_458;

/** KJK 1981 open-end Δl (Kirschning, Jansen & Koster 1981, Electronics Letters 17(3)), transcribed again for the tests. */
export function oracleOpenEnd(u: number, er: number, ee: number, h: number): number {
  const x1 = 0.434907 * ((ee ** 0.81 + 0.26) / (ee ** 0.81 - 0.189)) * ((u ** 0.8544 + 0.236) / (u ** 0.8544 + 0.87));
  const x2 = 1 + u ** 0.371 / (2.358 * er + 1);
  const x3 = 1 + (0.5274 * Math.atan(0.084 * u ** (1.9413 / x2))) / ee ** 0.9236;
  const x4 = 1 + 0.0377 * Math.atan(0.067 * u ** 1.456) * (6 - 5 * Math.exp(0.036 * (1 - er)));
  const x5 = 1 - 0.218 * Math.exp(-7.5 * u);
  return h * (x1 * x3 * x5) / x4;
}
