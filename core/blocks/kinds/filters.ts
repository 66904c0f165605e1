/**
 * Blocks `lowpass` (stepped-impedance or open-stub form) and `bandstop` (quarter-wave open stubs).
 *
 * Design equations:
 * - prototype g-values: Matthaei, Young and Jones 1964, §4.05 (lowpassPrototype.ts);
 * - stepped impedance: D. M. Pozar, Microwave Engineering, 4th ed., 2012, §8.6 (eq. 8.82): a series inductor g_k is
 *   a high-impedance line of βℓ = g_k·R0/Zh, a shunt capacitor g_k a low-impedance line of βℓ = g_k·Zl/R0, at the
 *   cut-off frequency; the prototype starts with a shunt capacitor;
 * - open-stub form: series high-impedance lines and open stubs of Richards' form (Pozar §8.4, eq. 8.67), λ/8 long
 *   at the cut-off, every piece equal to its prototype element at the cut-off (stubPlan);
 * - band-stop: Pozar §8.5 (eq. 8.79): N open stubs a quarter wave long at f0 with Z0n = 4·Z0/(π·g_n·Δ), joined by
 *   quarter-wave Z0 lines; Δ the fractional bandwidth. That form holds for narrow bands; the design Δ is rescaled
 *   against the block's own lossless sweep so the edges fall where asked (stopBandwidth).
 */
import { InputError } from '../../util/errors.ts';
import { sizeDesign } from '../../layout/sizing.ts';
import { teeJunction } from '../../discontinuity/hammerstad1981TeeJunction.ts';
import { netlistFromSized } from '../../network/fromSized.ts';
import { solveNetwork } from '../../network/sweep.ts';
import { prototypeValues } from '../lowpassPrototype.ts';
import { FEED_PARAM, Sketch, Z0_PARAM, lambdaG, stripOfZ0, widthFor, ghz, ohm, type BlockContext, type BlockDef, type Spec, contextDesign } from '../context.ts';
import { FOOTPRINT_PARAM } from '../fold.ts';

const RESPONSE = { name: 'response', type: 'choice', choices: ['maxflat', 'chebyshev'], default: 'chebyshev', meaning: 'Maximally flat (−3 dB at the edge) or equal ripple' } as const;
const ORDER = { name: 'order', type: 'integer', min: 1, max: 10, default: 5, meaning: 'Filter order (number of reactive elements)' } as const;
const RIPPLE = { name: 'rippleDb', type: 'number', unit: 'db', min: 0.01, max: 3, default: 0.5, meaning: 'Pass-band ripple, dB (equal ripple only)', when: (s: Spec) => s.response === 'chebyshev' } as const;

function gValues(spec: Spec): number[] {
  return prototypeValues(spec.response === 'maxflat' ? 'maximally-flat' : 'equal-ripple', spec.order as number, (spec.rippleDb as number | undefined) ?? 0.5);
}

/**
 * The open-stub form, sized so that at the cut-off every piece equals its prototype element exactly. A series line
 * of Zh and electrical length θ is a π of series reactance Zh·sin θ with a shunt susceptance tan(θ/2)/Zh at each
 * end (from the line's ABCD matrix, Pozar §4.4, Table 4.1), so the inductor g_k is the line with
 * sin θ = g_k·R0/Zh, and each stub supplies the capacitor's g_k/R0 less the line ends beside it. The stubs are
 * Richards' λ/8 open stubs at the cut-off (Pozar §8.4, eq. 8.67: tan 45° = 1, so a stub of admittance B is one of
 * impedance 1/B). Sizing each series line as a lumped inductor (βℓ = g·R0/Zh) instead leaves the ends' shunt
 * capacitance on the stubs, whose tan-law susceptance then overshoots the ripple in the band (the ripple edge came
 * about 16 % low for 0.5 dB, order 5).
 * `teeN2[k]` is the tee model's branch turns ratio n² at stub k (Hammerstad 1981, as the sweep uses it): the tee
 * shows a stub of Z as Z/n², so the stub is made n²·Z.
 */
export function stubPlan(g: number[], n: number, z0: number, zh: number, teeN2: number[] = []): { lineRad: number[]; stubZ: number[] } {
  const lineRad: number[] = [], stubZ: number[] = [];
  for (let k = 2; k <= n; k += 2) {
    const sin = (g[k]! * z0) / zh;
    if (!(sin < 1)) throw new InputError('out-of-range', 'lowpass.zHigh', `an inductor line impedance above g${k}·R0 = ${(g[k]! * z0).toFixed(1)} Ω`, `${zh} Ω`, 'raise zHigh (a narrower line) or choose a smaller ripple');
    lineRad[k] = Math.asin(sin);
  }
  for (let k = 1; k <= n; k += 2) {
    const ends = [k - 1, k + 1].filter((i) => i >= 2 && i <= n).reduce((sum, i) => sum + Math.tan(lineRad[i]! / 2) / zh, 0);
    const b = g[k]! / z0 - ends;
    if (!(b > 0)) throw new InputError('out-of-range', 'lowpass.zHigh', `inductor lines whose ends leave stub g${k} a positive susceptance`, `${zh} Ω`, 'raise zHigh (shorter, narrower inductor lines)');
    stubZ[k] = (teeN2[k] ?? 1) / b;
  }
  return { lineRad, stubZ };
}

/** A row of pieces from `src` to `load` (ports at z0), every piece given by its physical length at the block's own frequency. */
export const lowpassBlock: BlockDef = {
  kind: 'lowpass',
  title: 'Low-pass filter',
  summary: 'stepped-impedance or open-stub low-pass from a maximally flat or equal-ripple prototype',
  source: 'Matthaei, Young and Jones 1964, §4.05; Pozar, Microwave Engineering, 4th ed., 2012, §8.4 and §8.6',
  params: [
    { name: 'form', type: 'choice', choices: ['stepped', 'stubs'], default: 'stepped', meaning: 'Stepped-impedance lines, or open stubs for the capacitors' },
    RESPONSE, ORDER, RIPPLE,
    { name: 'cutoff', type: 'number', unit: 'frequency', min: 10e6, max: 100e9, optional: true, meaning: 'Cut-off frequency (default f0): −3 dB (maxflat) or the ripple edge' },
    { name: 'zHigh', type: 'number', unit: 'impedance', min: 50, max: 200, default: 110, meaning: 'Impedance of the inductor lines' },
    { name: 'zLow', type: 'number', unit: 'impedance', min: 5, max: 50, default: 20, meaning: 'Impedance of the capacitor lines (stepped form)' },
    Z0_PARAM, FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec: Spec, ctx: BlockContext) {
    const z0 = spec.z0 as number, feed = spec.feed as number, fc = (spec.cutoff as number | undefined) ?? ctx.f0;
    const zh = spec.zHigh as number, zl = spec.zLow as number, stubs = spec.form === 'stubs';
    if (!(zh > z0) || !(zl < z0)) throw new InputError('out-of-range', 'lowpass.zHigh', `zHigh above and zLow below the ${z0} Ω ports`, `${zh} Ω and ${zl} Ω`, 'widen the two impedances apart');
    widthFor(ctx, zh, 'lowpass.zHigh', 'the inductor lines');
    const g = gValues(spec), n = spec.order as number;
    const sub = ctx.substrate;
    const lenAt = (z: number, rad: number) => (stripOfZ0(sub, z, fc).lambdaG * rad) / (2 * Math.PI);
    const draw = (plan: ReturnType<typeof stubPlan> | null): { sk: Sketch; rows: string[] } => {
      const sk = new Sketch();
      sk.port('src', { x: -feed, y: 0 }, z0, 0, 'input');
      let x = 0, prev = 'src', first = true;
      const rows: string[] = [];
      for (let k = 1; k <= n; k++) {
        const shunt = k % 2 === 1; // starts with a shunt capacitor
        if (!shunt || !plan) {
          const z = shunt ? zl : zh;
          const rad = plan ? plan.lineRad[k]! : shunt ? (g[k]! * zl) / z0 : (g[k]! * z0) / zh;
          if (shunt) widthFor(ctx, zl, 'lowpass.zLow', 'the capacitor lines');
          const L = lenAt(z, rad);
          const a = first ? sk.vertex('k0', { x, y: 0 }, 'square') : prev;
          if (first) { sk.line('in', 'src', a, z0, { length: feed }); first = false; }
          x += L;
          const b = sk.vertex(`k${k}`, { x, y: 0 }, 'square');
          sk.line(`e${k}`, a, b, z, { length: L }, `${shunt ? 'capacitor' : 'inductor'} g${k}`);
          rows.push(`g${k} = ${g[k]!.toFixed(4)} → ${ohm(z)}, ${((rad * 180) / Math.PI).toFixed(2)}° at the cut-off`);
          prev = b;
        } else {
          const zs = plan.stubZ[k]!;
          widthFor(ctx, zs, 'lowpass.form', `stub g${k}`);
          const j = sk.junction(`t${k}`, { x, y: 0 });
          if (first) { sk.line('in', 'src', j, z0, { length: feed }); first = false; }
          else {
            // The previous piece ended at a vertex; re-use it as the tee.
            const seg = sk.segments[sk.segments.length - 1]!;
            seg.b = j; sk.nodes = sk.nodes.filter((nd) => nd.id !== prev);
          }
          const L = lenAt(zs, Math.PI / 4);
          sk.open(`s${k}-end`, { x, y: -L }, 'stub end');
          sk.line(`s${k}`, j, `s${k}-end`, zs, { length: L }, `capacitor g${k} (open stub)`);
          rows.push(`g${k} = ${g[k]!.toFixed(4)} → open stub ${ohm(zs)}, λ/8 at the cut-off`);
          prev = j;
        }
      }
      x += feed;
      sk.port('load', { x, y: 0 }, z0, Math.PI, 'output');
      sk.line('out', prev, 'load', z0, { length: feed });
      return { sk, rows };
    };
    let drawn = draw(stubs ? stubPlan(g, n, z0, zh) : null);
    // The stubs meet the row at tees whose model (the sweep's) scales a branch by n²: two passes settle n² at the
    // cut-off, which depends on the stub widths.
    for (let pass = 0; pass < 2 && stubs && ctx.junctions === 'modelled'; pass++) {
      const probe = contextDesign(ctx, sub);
      probe.nodes = drawn.sk.nodes; probe.segments = drawn.sk.segments;
      const n2: number[] = [];
      for (const nd of sizeDesign(probe).nodes) {
        const k = /^t(\d+)$/.exec(nd.id)?.[1];
        if (k && nd.tee) n2[Number(k)] = teeJunction({ ...nd.tee.arms, h: sub.h, f: fc }).n2;
      }
      drawn = draw(stubPlan(g, n, z0, zh, n2));
    }
    const { sk, rows } = drawn;
    const f0 = ctx.f0, ripple = spec.response === 'chebyshev' ? spec.rippleDb as number : 3.0103;
    return {
      name: `Order ${n} ${stubs ? 'open-stub' : 'stepped-impedance'} low-pass, cut-off ${ghz(fc)}`,
      nodes: sk.nodes, segments: sk.segments, phaseGroups: [],
      targets: [
        { id: 'pass', name: 'pass band', figure: 'insertion-loss', ports: ['src', 'load'], band: { start: fc * 0.05, stop: fc * 0.8 }, limit: { max: +(ripple + 0.5).toFixed(2) } },
      ],
      notes: [
        `${lowpassBlock.title} (${lowpassBlock.source}): order ${n}, ${spec.response === 'maxflat' ? 'maximally flat' : `equal ripple ${spec.rippleDb} dB`}, cut-off ${ghz(fc)}, ${z0} Ω; lengths at the cut-off.`,
        ...rows,
      ],
      band: { start: fc * 0.05, stop: fc * 2 },
    };
  },
};

/**
 * Fractional width of the band where a lossless sweep (the sweep's junction models) of the drawn filter loses more
 * than `levelDb`, about its f0: from the lower edge (below f0) to the upper one (above it); NaN when one is not found.
 */
function stopBandwidth(sk: Sketch, ctx: BlockContext, levelDb: number): number {
  const doc = contextDesign(ctx);
  doc.junctions = ctx.junctions; doc.nodes = sk.nodes; doc.segments = sk.segments;
  const sized = sizeDesign(doc);
  if (sized.problems.length) return NaN;
  const net = netlistFromSized(sized, { lossless: true });
  const loss = (f: number): number => {
    const r = solveNetwork(net, new Float64Array([f]));
    const P = r.ports.length, i = r.ports.findIndex((p) => p.name === 'load'), j = r.ports.findIndex((p) => p.name === 'src');
    const t = 2 * (i * P + j);
    return -20 * Math.log10(Math.hypot(r.s[t]!, r.s[t + 1]!));
  };
  // Scan from below f0 up to it for the first frequency past the level, and from f0 up for the last one; bisect each.
  const f0 = ctx.f0;
  /** First frequency from `from` up to `to` where the filter is (`inside`) or is not in its stop band, bisected. */
  const edge = (from: number, to: number, inside: boolean): number => {
    const hit = (f: number) => (loss(f) > levelDb) === inside;
    const fs = Array.from({ length: 41 }, (_, k) => from + ((to - from) * k) / 40);
    const k = fs.findIndex(hit);
    if (k <= 0) return NaN;
    let a = fs[k - 1]!, b = fs[k]!;
    for (let it = 0; it < 30; it++) { const m = (a + b) / 2; if (hit(m)) b = m; else a = m; }
    return (a + b) / 2;
  };
  return (edge(f0 * 1.02, f0 * 1.9, false) - edge(f0 * 0.1, f0, true)) / f0;
}

export const bandstopBlock: BlockDef = {
  kind: 'bandstop',
  title: 'Band-stop filter',
  summary: 'quarter-wave open stubs joined by quarter-wave lines',
  source: 'Matthaei, Young and Jones 1964, §4.05; Pozar, Microwave Engineering, 4th ed., 2012, §8.5',
  params: [
    { ...RESPONSE, default: 'maxflat' }, { ...ORDER, default: 3, max: 7 }, RIPPLE,
    { name: 'bw', type: 'number', unit: 'ratio', min: 0.05, max: 0.8, default: 0.5, meaning: 'Fractional stop bandwidth (0.3 = 30 %)' },
    Z0_PARAM, FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec, ctx) {
    const z0 = spec.z0 as number, feed = spec.feed as number, bw = spec.bw as number, f0 = ctx.f0;
    const g = gValues(spec), n = spec.order as number;
    const q = lambdaG(ctx, z0) / 4;
    /** The filter designed for fractional bandwidth `d` (Pozar eq. 8.79 with Δ = d). */
    const draw = (d: number): { sk: Sketch; rows: string[] } => {
      const sk = new Sketch();
      sk.port('src', { x: -feed, y: 0 }, z0, 0, 'input');
      const rows: string[] = [];
      let prev = 'src';
      for (let k = 1; k <= n; k++) {
        const zs = (4 * z0) / (Math.PI * g[k]! * d);
        widthFor(ctx, zs, 'bandstop.bw', `stub ${k}`);
        const x = (k - 1) * q;
        const j = sk.junction(`t${k}`, { x, y: 0 });
        sk.line(k === 1 ? 'in' : `l${k - 1}`, prev, j, z0, k === 1 ? { length: feed } : { deg: 90 }, k === 1 ? undefined : 'quarter-wave line');
        sk.open(`s${k}-end`, { x, y: -lambdaG(ctx, zs) / 4 }, 'stub end');
        sk.line(`s${k}`, j, `s${k}-end`, zs, { deg: 90 }, `stub ${k}`);
        rows.push(`stub ${k}: g${k} = ${g[k]!.toFixed(4)} → ${ohm(zs)}, 90° at f0`);
        prev = j;
      }
      sk.port('load', { x: (n - 1) * q + feed, y: 0 }, z0, Math.PI, 'output');
      sk.line('out', prev, 'load', z0, { length: feed });
      return { sk, rows };
    };
    // Eq. 8.79 is the narrow-band form: the quarter-wave lines are inverters only at f0, so a wide band comes out
    // narrow (a 50 % maximally flat order 3 measured 35 %). The band is symmetric about f0 (every piece is a quarter
    // wave there), so one number corrects it: the design bandwidth is rescaled until the lossless sweep (with the
    // junction models) puts the edge where asked; the edge is −3.01 dB (maximally flat) or the ripple level.
    // (0.05 dB above an equal ripple, so the ripple inside the pass bands is not taken for the edge.)
    const level = spec.response === 'chebyshev' ? (spec.rippleDb as number) + 0.05 : 3.0103;
    let d = bw, drawn = draw(d), measured = NaN;
    for (let it = 0; it < 6; it++) {
      measured = stopBandwidth(drawn.sk, ctx, level);
      if (!Number.isFinite(measured) || Math.abs(measured / bw - 1) < 0.005) break;
      d *= bw / measured;
      drawn = draw(d);
    }
    const { sk, rows } = drawn;
    rows.push(`Designed with Δ = ${(d * 100).toFixed(1)} % so the ${level.toFixed(2)} dB edges fall ${(bw * 100).toFixed(1)} % apart (lossless sweep${Number.isFinite(measured) ? `: ${(measured * 100).toFixed(1)} %` : ''}).`);
    return {
      name: `Order ${n} band-stop, ${ghz(f0)}, ${(bw * 100).toFixed(0)} %`, nodes: sk.nodes, segments: sk.segments, phaseGroups: [],
      targets: [{ id: 'stop', name: 'stop band', figure: 'insertion-loss', ports: ['src', 'load'], band: { start: f0, stop: f0 }, limit: { min: 20 } }],
      notes: [`${bandstopBlock.title} (${bandstopBlock.source}): order ${n}, centre ${ghz(f0)}, ${(bw * 100).toFixed(1)} % bandwidth, ${z0} Ω.`, ...rows],
      band: { start: f0 * 0.2, stop: f0 * 1.8 },
    };
  },
};

export const launchBlock: BlockDef = {
  kind: 'launch',
  title: 'Connector launch',
  summary: 'connector pad with a taper to the line',
  source: 'pad and taper sizes are the user\'s (common practice: the pad as wide as the connector pin\'s footprint); taper per core/layout',
  params: [
    { name: 'padWidth', type: 'number', unit: 'length', min: 0.3e-3, max: 10e-3, default: 1.5e-3, meaning: 'Width of the connector pad' },
    { name: 'padLength', type: 'number', unit: 'length', min: 0.3e-3, max: 20e-3, default: 3e-3, meaning: 'Length of the connector pad' },
    { name: 'taperLength', type: 'number', unit: 'length', min: 0.5e-3, max: 50e-3, default: 3e-3, meaning: 'Length of the taper from the pad to the line' },
    Z0_PARAM, FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec, ctx) {
    const z0 = spec.z0 as number, feed = spec.feed as number, pw = spec.padWidth as number, pl = spec.padLength as number, tl = spec.taperLength as number;
    widthFor(ctx, z0, 'launch.z0', 'the line');
    const sk = new Sketch();
    sk.port('conn', { x: 0, y: 0 }, z0, 0, 'connector', { padWidth: pw, padLength: pl });
    sk.vertex('k1', { x: pl + tl, y: 0 }, 'square');
    sk.segments.push({ id: 'taper', kind: 'taper', a: 'conn', b: 'k1', profile: 'linear', from: { by: 'width', width: pw }, to: { by: 'z0', z0 }, length: { by: 'length', length: pl + tl }, label: 'pad taper (the pad is its first part)' });
    sk.port('line', { x: pl + tl + feed, y: 0 }, z0, Math.PI, 'line');
    sk.line('run', 'k1', 'line', z0, { length: feed });
    const f0 = ctx.f0;
    return {
      name: `Connector launch, ${(pw * 1e3).toFixed(2)} mm pad`, nodes: sk.nodes, segments: sk.segments, phaseGroups: [],
      targets: [{ id: 'match', name: 'launch matched', figure: 'return-loss', ports: ['conn'], band: { start: f0 * 0.9, stop: f0 * 1.1 }, limit: { min: 15 } }],
      notes: [`${launchBlock.title}: ${(pw * 1e3).toFixed(2)} × ${(pl * 1e3).toFixed(2)} mm pad, ${(tl * 1e3).toFixed(2)} mm linear taper to ${z0} Ω.`],
      band: { start: f0 * 0.5, stop: f0 * 1.5 },
    };
  },
};
