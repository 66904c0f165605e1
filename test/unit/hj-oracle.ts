/**
 * A second, test-only transcription of the Hammerstad–Jensen 1980 static microstrip model at t = 0 (methods.md
 * §1.1; E. Hammerstad and Ø. Jensen, IEEE MTT-S IMS Digest 1980, pp. 407–409), used to feed published discontinuity
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
