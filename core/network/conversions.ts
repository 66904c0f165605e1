/**
 * S, Z and Y matrices of one frequency for real port references, power-wave definition
 * (K. Kurokawa, "Power waves and the scattering matrix", IEEE Trans. MTT, vol. 13, no. 2, pp. 194–202, 1965).
 * With R = diag(Zk) and G = R^½:
 *   S = G⁻¹ (Z − R)(Z + R)⁻¹ G,   Z = G (I + S)(I − S)⁻¹ G,   Y = G⁻¹ (I − S)(I + S)⁻¹ G⁻¹.
 * Matrices are n×n, row-major, interleaved re/im. For real references power waves equal travelling
 * (pseudo) waves; complex references are out of scope.
 */
import { InputError } from '../util/errors.ts';
import { denseInverse, denseMul } from './denseLu.ts';

function identityPlus(m: Float64Array, n: number, sign: 1 | -1): Float64Array {
  const out = new Float64Array(2 * n * n);
  for (let t = 0; t < out.length; t++) out[t] = sign * m[t];
  for (let i = 0; i < n; i++) out[2 * (i * n + i)] += 1;
  return out;
}

function scaleRowsCols(m: Float64Array, n: number, row: Float64Array, col: Float64Array): Float64Array {
  const out = new Float64Array(m.length);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    const t = 2 * (i * n + j), k = row[i] * col[j];
    out[t] = m[t] * k; out[t + 1] = m[t + 1] * k;
  }
  return out;
}

function refs(z0: number | ArrayLike<number>, n: number): Float64Array {
  const r = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const v = typeof z0 === 'number' ? z0 : z0[i];
    if (!(v > 0) || !Number.isFinite(v)) throw new InputError('out-of-range', `zRef[${i}]`, 'a real reference impedance > 0 Ω', String(v));
    r[i] = v;
  }
  return r;
}

const singular = (what: string) => new InputError('singular-network', what, 'a matrix that can be converted', 'a singular matrix', 'the network has no such representation at this frequency (e.g. an ideal open or short)');

/** Z (Ω) from S. Throws InputError when (I − S) is singular (an ideal open has no Z). */
export function sToZ(s: Float64Array, n: number, z0: number | ArrayLike<number>): Float64Array {
  const r = refs(z0, n), g = r.map(Math.sqrt);
  const inv = denseInverse(identityPlus(s, n, -1), n);
  if (!inv) throw singular('Z from S');
  return scaleRowsCols(denseMul(identityPlus(s, n, 1), inv, n), n, g, g);
}

/** Y (S) from S. */
export function sToY(s: Float64Array, n: number, z0: number | ArrayLike<number>): Float64Array {
  const r = refs(z0, n), gi = r.map((x) => 1 / Math.sqrt(x));
  const inv = denseInverse(identityPlus(s, n, 1), n);
  if (!inv) throw singular('Y from S');
  return scaleRowsCols(denseMul(identityPlus(s, n, -1), inv, n), n, gi, gi);
}

/** S from Z (Ω). */
export function zToS(z: Float64Array, n: number, z0: number | ArrayLike<number>): Float64Array {
  const r = refs(z0, n), gi = r.map((x) => 1 / Math.sqrt(x));
  // Normalised zn = G⁻¹ Z G⁻¹; S = (zn − I)(zn + I)⁻¹ — the same as G⁻¹ (Z − R)(Z + R)⁻¹ G for diagonal G.
  const zn = scaleRowsCols(z, n, gi, gi);
  const inv = denseInverse(identityPlus(zn, n, 1), n);
  if (!inv) throw singular('S from Z');
  const m = new Float64Array(zn);
  for (let i = 0; i < n; i++) m[2 * (i * n + i)] -= 1;
  return denseMul(m, inv, n);
}

/** S from Y (S). */
export function yToS(y: Float64Array, n: number, z0: number | ArrayLike<number>): Float64Array {
  const r = refs(z0, n), g = r.map(Math.sqrt);
  const yn = scaleRowsCols(y, n, g, g);
  // S = (I − yn)(I + yn)⁻¹.
  const inv = denseInverse(identityPlus(yn, n, 1), n);
  if (!inv) throw singular('S from Y');
  return denseMul(identityPlus(yn, n, -1), inv, n);
}

/**
 * S for new real references `to` from S for `from`, without going through Z (which an ideal open lacks):
 * with ρ = (to − from)/(to + from) and k = (from + to)/(2√(from·to)) per port,
 *   S' = K (S − ρ)(I − ρ S)⁻¹ K⁻¹
 * (from a' = k(a − ρb), b' = k(b − ρa), which follows from the power-wave definitions).
 */
export function renormalize(s: Float64Array, n: number, from: number | ArrayLike<number>, to: number | ArrayLike<number>): Float64Array {
  const r0 = refs(from, n), r1 = refs(to, n);
  const rho = new Float64Array(n), k = new Float64Array(n), ki = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    rho[i] = (r1[i] - r0[i]) / (r1[i] + r0[i]);
    k[i] = (r0[i] + r1[i]) / (2 * Math.sqrt(r0[i] * r1[i]));
    ki[i] = 1 / k[i];
  }
  const a = new Float64Array(s), b = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    a[2 * (i * n + i)] -= rho[i];
    for (let j = 0; j < n; j++) {
      const t = 2 * (i * n + j);
      b[t] = -rho[i] * s[t]; b[t + 1] = -rho[i] * s[t + 1];
    }
    b[2 * (i * n + i)] += 1;
  }
  const inv = denseInverse(b, n);
  if (!inv) throw singular('renormalised S');
  return scaleRowsCols(denseMul(a, inv, n), n, k, ki);
}
