/**
 * What a junction model leaves that lengths cannot take out, at one frequency: the extra transmission phase and the
 * reflection against an ideal junction. Two-port algebra only (ABCD of series and shunt elements, S with different
 * real references: D. M. Pozar, Microwave Engineering, 4th ed., §4.4, Table 4.2 and the ABCD → S relations).
 */

export interface Residual {
  /** Extra transmission phase, degrees (positive: the wave arrives later). */
  phaseDeg: number;
  /** |S11 − S11(ideal)| in dB (−400 dB floor when there is none). */
  reflectionDb: number;
}

const db = (x: number) => (x > 1e-20 ? 20 * Math.log10(x) : -400);

/**
 * An ideal transformer of turns ratio n between equal references: |S11| = |n² − 1|/(n² + 1), no phase.
 * (The branch transformer of a tee.)
 */
export function transformerResidual(n2: number): Residual {
  return { phaseDeg: 0, reflectionDb: db(Math.abs(n2 - 1) / (n2 + 1)) };
}

/**
 * A width step's L1 – C – L2 between lines of impedance z1 (wide side, port 1) and z2 at angular frequency w, against
 * the ideal step (the same two references joined directly). Parts may be zero (left out).
 */
export function stepResidual(p: { L1: number; L2: number; C: number; z1: number; z2: number; w: number }): Residual {
  const { z1: R1, z2: R2, w } = p;
  const X1 = w * p.L1, X2 = w * p.L2, B = w * p.C;
  // ABCD = [1 jX1; 0 1]·[1 0; jB 1]·[1 jX2; 0 1]
  //      = [1 − X1·B, j(X1 + X2 − X1·B·X2); jB, 1 − B·X2]
  const A = 1 - X1 * B, Bi = X1 + X2 - X1 * B * X2, Ci = B, D = 1 - B * X2;
  // S21 = 2√(R1R2)/(A R2 + B + C R1 R2 + D R1), S11 = (A R2 + B − C R1 R2 − D R1)/(same)
  const denRe = A * R2 + D * R1, denIm = Bi + Ci * R1 * R2;
  const numRe = A * R2 - D * R1, numIm = Bi - Ci * R1 * R2;
  const m = denRe * denRe + denIm * denIm;
  const s11Re = (numRe * denRe + numIm * denIm) / m, s11Im = (numIm * denRe - numRe * denIm) / m;
  const ideal = (R2 - R1) / (R1 + R2);
  // arg S21 = −arg(den); the ideal step's S21 is real and positive.
  return { phaseDeg: (Math.atan2(denIm, denRe) * 180) / Math.PI, reflectionDb: db(Math.hypot(s11Re - ideal, s11Im)) };
}

/** A length of line left out (an ignored reference-plane shift d at phase constant beta). */
export function shiftResidual(d: number, beta: number, n2: number): Residual {
  return { phaseDeg: (-d * beta * 180) / Math.PI, reflectionDb: transformerResidual(n2).reflectionDb };
}
