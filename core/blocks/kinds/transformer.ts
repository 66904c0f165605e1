/**
 * Blocks `transformer` (multi-section quarter-wave) and `taper` (Klopfenstein tapered line) between two real
 * impedances.
 *
 * Design equations: D. M. Pozar, Microwave Engineering, 4th ed., Wiley, 2012:
 * - binomial (maximally flat), §5.6: ln(Z(n+1)/Z(n)) ≈ 2^−N·C(N,n)·ln(ZL/Z0) (eq. 5.51); fractional bandwidth for a
 *   largest reflection Γm: Δf/f0 = 2 − (4/π)·acos[½·(Γm/|A|)^(1/N)], A = 2^−N·(ZL − Z0)/(ZL + Z0) (eqs. 5.47, 5.53);
 * - Chebyshev (equal ripple), §5.7: Γ(θ) = A·e^(−jNθ)·T_N(sec θm·cos θ) with A = Γm, sec θm = cosh[(1/N)·acosh(|ln(ZL/Z0)|/(2Γm))]
 *   (eqs. 5.60, 5.64); the section reflections Γn are the cosine-series coefficients of that polynomial
 *   (Γ(θ) = 2e^(−jNθ)[Γ0 cos Nθ + Γ1 cos(N−2)θ + …], eq. 5.45), and Z(n+1) = Z(n)·e^(2Γn) (the small-reflection
 *   form of eq. 5.51); bandwidth Δf/f0 = 2 − 4θm/π (eq. 5.65).
 * - taper: the Klopfenstein (1956) profile already in core/layout (segment kind 'taper').
 */
import { InputError } from '../../util/errors.ts';
import { FEED_PARAM, Sketch, widthFor, lambdaG, ghz, ohm, type BlockDef, type BlockContext, type BlockPieces, type Spec } from '../context.ts';
import { FOOTPRINT_PARAM } from '../fold.ts';

function binom(n: number, k: number): number { let r = 1; for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i; return r; }

/** Chebyshev polynomial T_N(x) for any real x. */
export function chebyshevT(n: number, x: number): number {
  if (Math.abs(x) <= 1) return Math.cos(n * Math.acos(x));
  const s = x > 0 ? 1 : n % 2 === 0 ? 1 : -1;
  return s * Math.cosh(n * Math.acosh(Math.abs(x)));
}

export interface TransformerDesign { impedances: number[]; bandwidth: number }

/** Section impedances from z1 to z2 and the fractional bandwidth where |Γ| ≤ gammaM (Pozar §5.6/§5.7). */
export function transformerSections(kind: 'maxflat' | 'chebyshev', n: number, z1: number, z2: number, gammaM: number): TransformerDesign {
  const lr = Math.log(z2 / z1);
  const zs: number[] = [];
  if (kind === 'maxflat') {
    let z = z1;
    for (let k = 0; k < n; k++) {
      // ln Z(k+1) − ln Z(k) = 2^−N C(N,k) ln(ZL/Z0): the section impedance sits between its two neighbours' steps.
      z = z * Math.exp(Math.pow(2, -n) * binom(n, k) * lr);
      zs.push(z);
    }
    const a = Math.abs(Math.pow(2, -n) * (z2 - z1) / (z2 + z1));
    const bw = gammaM >= 2 ** n * a ? 2 : 2 - (4 / Math.PI) * Math.acos(0.5 * Math.pow(gammaM / a, 1 / n));
    return { impedances: zs, bandwidth: bw };
  }
  const ratio = Math.abs(lr) / (2 * gammaM);
  if (!(ratio > 1)) throw new InputError('out-of-range', 'transformer.ripple', `a ripple below ${(Math.abs(lr) / 2).toFixed(4)} (|ln(Z2/Z1)|/2: above it no transformer is needed)`, String(gammaM), 'ask for a smaller ripple or use one section');
  const secM = Math.cosh(Math.acosh(ratio) / n);
  // Γ(θ)e^{jNθ} = Γm·T_N(secθm cosθ) = Σ c_m cos(mθ) over m = N, N−2, …; Γ_k = c_(N−2k)/2 (the middle term of an even N is c_0 itself).
  const sign = Math.sign(lr);
  const coef = (m: number): number => {
    const K = 2048;
    let s = 0;
    for (let i = 0; i < K; i++) { const th = ((i + 0.5) * Math.PI) / K; s += gammaM * chebyshevT(n, secM * Math.cos(th)) * Math.cos(m * th); }
    return ((m === 0 ? 1 : 2) * s) / K;
  };
  const gammas: number[] = [];
  for (let k = 0; k <= n; k++) { const m = Math.abs(n - 2 * k); gammas.push(sign * (m === 0 ? coef(0) : coef(m) / 2)); }
  let z = z1;
  for (let k = 0; k < n; k++) { z = z * Math.exp(2 * gammas[k]!); zs.push(z); }
  const thetaM = Math.acos(1 / secM);
  return { impedances: zs, bandwidth: 2 - (4 * thetaM) / Math.PI };
}

const Z1 = { name: 'z1', type: 'number', unit: 'impedance', min: 5, max: 300, default: 50, meaning: 'Source-side impedance (real)' } as const;
const Z2 = { name: 'z2', type: 'number', unit: 'impedance', min: 5, max: 300, default: 100, meaning: 'Load-side impedance (real)' } as const;

/** src port ─ feed ─ sections ─ feed ─ load port, in a straight row. */
function row(ctx: BlockContext, z1: number, z2: number, feed: number, secs: { z: number; len: { deg: number } | { length: number }; label: string }[]): Sketch {
  const sk = new Sketch();
  let x = 0;
  sk.port('src', { x, y: 0 }, z1, 0, 'source');
  x += feed; let prev = sk.vertex('k0', { x, y: 0 }, 'square');
  sk.line('in', 'src', prev, z1, { length: feed });
  secs.forEach((s, i) => {
    x += 'deg' in s.len ? (lambdaG(ctx, s.z) * s.len.deg) / 360 : s.len.length;
    const nx = sk.vertex(`k${i + 1}`, { x, y: 0 }, 'square');
    sk.line(`sec${i + 1}`, prev, nx, s.z, s.len, s.label);
    prev = nx;
  });
  x += feed;
  sk.port('load', { x, y: 0 }, z2, Math.PI, 'load');
  sk.line('out', prev, 'load', z2, { length: feed });
  return sk;
}

export const transformerBlock: BlockDef = {
  kind: 'transformer',
  title: 'Quarter-wave transformer',
  summary: 'multi-section quarter-wave match between two real impedances, maximally flat or equal ripple',
  source: 'Pozar, Microwave Engineering, 4th ed., 2012, §5.6 (binomial) and §5.7 (Chebyshev)',
  params: [
    Z1, Z2,
    { name: 'response', type: 'choice', choices: ['maxflat', 'chebyshev'], default: 'maxflat', meaning: 'Maximally flat (binomial) or equal ripple (Chebyshev)' },
    { name: 'sections', type: 'integer', min: 1, max: 8, default: 3, meaning: 'Number of quarter-wave sections' },
    { name: 'ripple', type: 'number', unit: 'none', min: 0.001, max: 0.3, default: 0.05, meaning: 'Largest |Γ| in the band (sets the Chebyshev ripple and the band reported)' },
    FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec: Spec, ctx: BlockContext): BlockPieces {
    const z1 = spec.z1 as number, z2 = spec.z2 as number, n = spec.sections as number, gm = spec.ripple as number;
    const kind = spec.response as 'maxflat' | 'chebyshev';
    if (Math.abs(z1 - z2) < 1e-9) throw new InputError('out-of-range', 'transformer.z2', 'a load impedance different from the source', String(z2), 'equal impedances need no transformer');
    const d = transformerSections(kind, n, z1, z2, gm);
    d.impedances.forEach((z, i) => widthFor(ctx, z, 'transformer.z2', `section ${i + 1}`));
    const sk = row(ctx, z1, z2, spec.feed as number, d.impedances.map((z, i) => ({ z, len: { deg: 90 }, label: `section ${i + 1}` })));
    const f0 = ctx.f0, half = Math.min(d.bandwidth, 1.6) / 2;
    const rl = -20 * Math.log10(gm);
    return {
      name: `${n}-section ${kind === 'maxflat' ? 'maximally flat' : 'equal-ripple'} transformer ${z1} → ${z2} Ω, ${ghz(f0)}`,
      nodes: sk.nodes, segments: sk.segments, phaseGroups: [],
      // The computed band shrunk by 10 %: the junction steps and dispersion move the edges a little.
      targets: [{ id: 'match', name: `|Γ| ≤ ${gm} over the band`, figure: 'return-loss', ports: ['src'], band: { start: f0 * (1 - 0.9 * half), stop: f0 * (1 + 0.9 * half) }, limit: { min: +(rl - 0.5).toFixed(2) } }],
      notes: [
        `${transformerBlock.title}: ${n} sections, ${z1} Ω → ${z2} Ω at ${ghz(f0)} (${transformerBlock.source}).`,
        `Section impedances: ${d.impedances.map(ohm).join(', ')}, each 90° at f0; |Γ| ≤ ${gm} over ${(d.bandwidth * 100).toFixed(1)} % of f0 (ideal lines).`,
      ],
      band: { start: f0 * Math.max(0.05, 1 - 1.5 * half - 0.1), stop: f0 * (1 + 1.5 * half + 0.1) },
    };
  },
};

export const taperBlock: BlockDef = {
  kind: 'taper',
  title: 'Tapered line',
  summary: 'Klopfenstein tapered line between two real impedances',
  source: 'R. W. Klopfenstein, "A transmission line taper of improved design", Proc. IRE 44, 1956 (core/layout/klopfenstein1956Taper.ts)',
  params: [Z1, Z2, { name: 'lengthDeg', type: 'number', unit: 'none', min: 90, max: 1440, default: 360, meaning: 'Electrical length of the taper at f0, degrees' }, FEED_PARAM],
  generate(spec, ctx) {
    const z1 = spec.z1 as number, z2 = spec.z2 as number, L = spec.lengthDeg as number, feed = spec.feed as number;
    widthFor(ctx, Math.max(z1, z2), 'taper.z2', 'the narrow end');
    const sk = new Sketch();
    const len = (lambdaG(ctx, Math.sqrt(z1 * z2)) * L) / 360;
    sk.port('src', { x: 0, y: 0 }, z1, 0, 'source');
    sk.vertex('k0', { x: feed, y: 0 }, 'square');
    sk.vertex('k1', { x: feed + len, y: 0 }, 'square');
    sk.port('load', { x: 2 * feed + len, y: 0 }, z2, Math.PI, 'load');
    sk.line('in', 'src', 'k0', z1, { length: feed });
    sk.segments.push({ id: 'taper', kind: 'taper', a: 'k0', b: 'k1', profile: 'klopfenstein', from: { by: 'z0', z0: z1 }, to: { by: 'z0', z0: z2 }, length: { by: 'degrees', deg: L } });
    sk.line('out', 'k1', 'load', z2, { length: feed });
    const f0 = ctx.f0;
    return {
      name: `Tapered line ${z1} → ${z2} Ω, ${L}° at ${ghz(f0)}`, nodes: sk.nodes, segments: sk.segments, phaseGroups: [],
      targets: [{ id: 'match', name: 'match above f0', figure: 'return-loss', ports: ['src'], band: { start: f0, stop: 2 * f0 }, limit: { min: 20 } }],
      notes: [`${taperBlock.title} (${taperBlock.source}): ${z1} Ω → ${z2} Ω over ${L}° at ${ghz(f0)}; a Klopfenstein taper passes everything above its lowest matched frequency.`],
      band: { start: f0 * 0.25, stop: f0 * 2.5 },
    };
  },
};
