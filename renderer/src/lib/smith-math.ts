/**
 * Smith-chart readouts from a reflection coefficient, without the DOM. With Γ = S_ii at a port of reference Z0:
 * Z = Z0·(1 + Γ)/(1 − Γ) and VSWR = (1 + |Γ|)/(1 − |Γ|) (the usual definitions; e.g. D. M. Pozar, Microwave
 * Engineering, 4th ed., §2.3 and §2.4). |Γ| ≥ 1 has no finite Z or VSWR; the readout says so instead of a number.
 */
export interface Readout { gammaMag: number; gammaDeg: number; z: { re: number; im: number } | null; vswr: number | null }

export function readout(re: number, im: number, z0: number): Readout {
  const mag = Math.hypot(re, im);
  const deg = mag === 0 ? 0 : (Math.atan2(im, re) * 180) / Math.PI;
  if (!(mag < 1)) return { gammaMag: mag, gammaDeg: deg === -180 ? 180 : deg, z: null, vswr: null };
  // (1 + Γ)/(1 − Γ) = ((1 + a) + jb)·((1 − a) + jb) / |1 − Γ|²
  const d = (1 - re) * (1 - re) + im * im;
  const zr = (1 - re * re - im * im) / d, zi = (2 * im) / d;
  return { gammaMag: mag, gammaDeg: deg === -180 ? 180 : deg, z: { re: z0 * zr, im: z0 * zi }, vswr: (1 + mag) / (1 - mag) };
}

/** Nearest point of any trace to (re, im) in the Γ plane, within `reach`; null when none is that close. */
export function nearestOnTraces(traces: { re: ArrayLike<number>; im: ArrayLike<number> }[], re: number, im: number, reach: number): { trace: number; index: number } | null {
  let best: { trace: number; index: number } | null = null, bestD = reach * reach;
  traces.forEach((t, i) => {
    for (let k = 0; k < t.re.length; k++) {
      const dx = t.re[k]! - re, dy = t.im[k]! - im, d = dx * dx + dy * dy;
      if (d <= bestD) { bestD = d; best = { trace: i, index: k }; }
    }
  });
  return best;
}
