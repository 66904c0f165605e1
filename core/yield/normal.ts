/**
 * Normal deviates by inversion: z = Φ⁻¹(u) with Algorithm AS 241, PPND16 (M. J. Wichura, "Algorithm AS 241: The
 * percentage points of the normal distribution", Applied Statistics 37(3), 477–484, 1988), accurate to about 1 part
 * in 10^16. One uniform gives one normal, so a draw's place in its stream fixes its value.
 *
 * Same numbers on every machine: the algorithm needs ln and √ besides + − × ÷. IEEE 754 requires √ (like + − × ÷)
 * to be correctly rounded, but Math.log may differ in its last bit between engines, so ln here is our own
 * (`lnExact`: halving/doubling into [√½, √2), which is exact, then the atanh series 2·Σ s^(2k+1)/(2k+1) with
 * s = (m − 1)/(m + 1), |s| < 0.172, to 12 terms, below 1e-17 of the sum).
 */
const LN2 = 0.6931471805599453;

/** ln x for 0 < x < ∞ from + − × ÷ only (see above). */
export function lnExact(x: number): number {
  let m = x, e = 0;
  while (m >= Math.SQRT2) { m /= 2; e++; }
  while (m < Math.SQRT1_2) { m *= 2; e--; }
  const s = (m - 1) / (m + 1), s2 = s * s;
  let sum = 1 / 23;
  for (let k = 21; k >= 1; k -= 2) sum = 1 / k + s2 * sum;
  return e * LN2 + 2 * s * sum;
}

/** Φ⁻¹(p) for 0 < p < 1 (AS 241 PPND16). */
export function normalQuantile(p: number): number {
  const q = p - 0.5;
  if (Math.abs(q) <= 0.425) {
    const r = 0.180625 - q * q;
    return q * (((((((2509.0809287301226727 * r + 33430.575583588128105) * r + 67265.770927008700853) * r + 45921.953931549871457) * r
      + 13731.693765509461125) * r + 1971.5909503065514427) * r + 133.14166789178437745) * r + 3.387132872796366608)
      / (((((((5226.495278852854561 * r + 28729.085735721942674) * r + 39307.89580009271061) * r + 21213.794301586595867) * r
      + 5394.1960214247511077) * r + 687.1870074920579083) * r + 42.313330701600911252) * r + 1);
  }
  let r = q < 0 ? p : 1 - p;
  r = Math.sqrt(-lnExact(r));
  let z: number;
  if (r <= 5) {
    r -= 1.6;
    z = (((((((7.7454501427834140764e-4 * r + 0.0227238449892691845833) * r + 0.24178072517745061177) * r + 1.27045825245236838258) * r
      + 3.64784832476320460504) * r + 5.7694972214606914055) * r + 4.6303378461565452959) * r + 1.42343711074968357734)
      / (((((((1.05075007164441684324e-9 * r + 5.475938084995344946e-4) * r + 0.0151986665636164571966) * r + 0.14810397642748007459) * r
      + 0.68976733498510000455) * r + 1.6763848301838038494) * r + 2.05319162663775882187) * r + 1);
  } else {
    r -= 5;
    z = (((((((2.01033439929228813265e-7 * r + 2.71155556874348757815e-5) * r + 0.0012426609473880784386) * r + 0.026532189526576123093) * r
      + 0.29656057182850489123) * r + 1.7848265399172913358) * r + 5.4637849111641143699) * r + 6.6579046435011037772)
      / (((((((2.04426310338993978564e-15 * r + 1.4215117583164458887e-7) * r + 1.8463183175100546818e-5) * r + 7.868691311456132591e-4) * r
      + 0.0148753612908506148525) * r + 0.13692988092273580531) * r + 0.59983220655588793769) * r + 1);
  }
  return q < 0 ? -z : z;
}
