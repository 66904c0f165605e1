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
 * - band-stop, maximally flat: Pozar §8.5 (eq. 8.79): N open stubs a quarter wave long at f0 with
 *   Z0n = 4·Z0/(π·g_n·Δ), joined by quarter-wave Z0 lines; Δ the fractional bandwidth;
 * - band-stop, equal ripple: N stubs and N − 1 lines of free impedance fitted in Richards' variable to the optimum
 *   equal-ripple response (bandstopRichards.ts; Horton and Wenzel 1965);
 *   both have their design Δ (and the equal-ripple one its design ripple) corrected against the block's own lossless
 *   sweep with the junction models, so the edges and the ripple fall where asked (bandstopSweep).
 */
import { InputError } from '../../util/errors.ts';
import { sizeDesign } from '../../layout/sizing.ts';
import { teeJunction } from '../../discontinuity/hammerstad1981TeeJunction.ts';
import { netlistFromSized } from '../../network/fromSized.ts';
import { solveNetwork } from '../../network/sweep.ts';
import { prototypeValues } from '../lowpassPrototype.ts';
import { equalRippleRow, type StubRow } from '../bandstopRichards.ts';
import { FEED_PARAM, Sketch, Z0_PARAM, lambdaG, stripOfZ0, widthFor, ghz, ohm, type BlockContext, type BlockDef, type BlockPieces, type Spec, contextDesign } from '../context.ts';
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
    if (spec.form !== 'stubs') return lowpassPieces(spec, ctx);
    const fc = (spec.cutoff as number | undefined) ?? ctx.f0;
    let made: BlockPieces;
    try { made = lowpassPieces(spec, ctx); } catch (e) {
      // Stubs so wide for their length that the tee model (Hammerstad 1981) turns its branch ratio n² to zero or
      // below at the cut-off: no stub impedance can be drawn. Refused like a filter that misses, naming the nearest.
      if (e instanceof InputError && e.field === 'lowpass.form') throw stubRefusal(spec, ctx, null, e);
      throw e;
    }
    if (!meetsCutoff(made, ctx, fc, edgeLevel(spec))) throw stubRefusal(spec, ctx, made);
    return made;
  },
};

/** The loss that marks a low-pass edge: the ripple (equal ripple) or 3.01 dB (maximally flat), +0.05 dB for the sweep. */
const edgeLevel = (spec: Spec): number => (spec.response === 'chebyshev' ? (spec.rippleDb as number) + 0.05 : 3.0103);

/**
 * Whether the lossless sweep of the made low-pass (the sweep's junction models) keeps its pass band within `level`
 * up to 0.95·fc and is past it at 1.05·fc: the edge within the issue's 5 %, and no higher ripple inside it.
 */
function meetsCutoff(made: BlockPieces, ctx: BlockContext, fc: number, level: number): boolean {
  const doc = contextDesign(ctx);
  doc.junctions = ctx.junctions; doc.nodes = made.nodes; doc.segments = made.segments;
  const sized = sizeDesign(doc);
  if (sized.problems.length) return false;
  const fs = [...Array.from({ length: 48 }, (_, k) => (fc * 0.95 * (k + 1)) / 48), fc * 1.05];
  const r = solveNetwork(netlistFromSized(sized, { lossless: true }), new Float64Array(fs));
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === 'load'), j = r.ports.findIndex((p) => p.name === 'src');
  const loss = fs.map((_, k) => { const t = 2 * ((k * P + i) * P + j); return -20 * Math.log10(Math.hypot(r.s[t]!, r.s[t + 1]!)); });
  return loss.slice(0, -1).every((x) => x <= level) && loss[loss.length - 1]! > level;
}

/**
 * The refusal of an open-stub low-pass whose stubs the laminate cannot make as stubs: a large ripple (or order) asks
 * for capacitors of a few ohms, stubs as wide as they are long, where the tee model (Hammerstad 1981) no longer
 * places the junction and the made filter misses its ripple or its edge. Names the largest equal ripple (of a
 * ladder of common values) at this order that does make its figures on this laminate and process.
 */
function stubRefusal(spec: Spec, ctx: BlockContext, made: BlockPieces | null, inner?: InputError): InputError {
  const fc = (spec.cutoff as number | undefined) ?? ctx.f0, n = spec.order as number;
  const works = (trial: Spec): boolean => {
    try { return meetsCutoff(lowpassPieces(trial, ctx), ctx, fc, edgeLevel(trial)); } catch { return false; }
  };
  const asked = spec.response === 'chebyshev' ? spec.rippleDb as number : Infinity;
  // First a smaller ripple at the asked order (narrower stubs), then the asked response at a lower order.
  const ripple = [3, 2.5, 2, 1.5, 1, 0.75, 0.5, 0.25, 0.1, 0.05, 0.01].filter((x) => x < asked).find((x) => works({ ...spec, response: 'chebyshev', rippleDb: x }));
  const order = ripple === undefined ? Array.from({ length: n - 1 }, (_, i) => n - 1 - i).find((k) => works({ ...spec, order: k })) : undefined;
  const what = spec.response === 'chebyshev' ? `${asked} dB equal ripple` : 'maximally flat';
  const nearest = ripple !== undefined ? `${ripple} dB equal ripple at order ${n}` : order !== undefined ? `order ${order} ${what}` : null;
  let why: string;
  if (made) {
    const widest = made.segments.filter((x) => /^s\d+$/.test(x.id) && x.kind === 'line').map((x) => (x.kind === 'line' && x.width.by === 'z0' ? x.width.z0 : Infinity));
    const zMin = Math.min(...widest), line = stripOfZ0(ctx.substrate, zMin, fc);
    why = `${what} needs stubs down to ${zMin.toFixed(1)} Ω, ${(line.width * 1e3).toFixed(1)} mm wide on a ${((line.lambdaG / 8) * 1e3).toFixed(1)} mm stub, where the tee model no longer holds: swept with it, the filter misses its ripple or its cut-off by more than 5 %`;
  } else if (inner && !/needs -/.test(inner.got)) {
    why = `${what}: ${inner.got}`;
  } else {
    why = `${what} needs stubs wider than they are long at ${ghz(fc)}, where the tee model (Hammerstad 1981) no longer places the junction: no stub impedance meets the capacitors`;
  }
  return new InputError('out-of-range', spec.response === 'chebyshev' ? 'lowpass.rippleDb' : 'lowpass.order',
    `an open-stub low-pass this laminate and process can make at order ${n}${ripple !== undefined ? ` (up to ${ripple} dB equal ripple)` : ' (none at this order)'}`,
    why, nearest ? `the nearest it makes within spec: ${nearest}; or the stepped form, or a thinner laminate` : 'use the stepped form, or a thinner laminate');
}

/** The low-pass drawn from its spec (no check of its sweep). */
function lowpassPieces(spec: Spec, ctx: BlockContext): BlockPieces {
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
}

/** The band-stop's view band, as fractions of f0: its pass bands are checked from 0.2·f0 and up to 1.8·f0. */
const VIEW = [0.2, 1.8] as const;

/**
 * What a lossless sweep (with the sweep's junction models) of the drawn band-stop shows: its stop band's edges at
 * `levelDb` (the last frequency below f0, and the first above it, where the loss falls under the level, each found
 * from f0 outwards so a ripple peak in a pass band is not taken for an edge) and the largest loss in the pass bands
 * outside them (from VIEW[0]·f0 and up to VIEW[1]·f0). NaN edges when the loss at f0 is under the level.
 */
export function bandstopSweep(sk: Sketch, ctx: BlockContext, levelDb: number): { lo: number; hi: number; passMaxDb: number } {
  const doc = contextDesign(ctx);
  doc.junctions = ctx.junctions; doc.nodes = sk.nodes; doc.segments = sk.segments;
  const sized = sizeDesign(doc);
  if (sized.problems.length) return { lo: NaN, hi: NaN, passMaxDb: NaN };
  const net = netlistFromSized(sized, { lossless: true });
  const lossAt = (fs: number[]): number[] => {
    const r = solveNetwork(net, new Float64Array(fs));
    const P = r.ports.length, i = r.ports.findIndex((p) => p.name === 'load'), j = r.ports.findIndex((p) => p.name === 'src');
    return fs.map((_, k) => { const t = 2 * ((k * P + i) * P + j); return -20 * Math.log10(Math.hypot(r.s[t]!, r.s[t + 1]!)); });
  };
  const f0 = ctx.f0;
  /** Loss at frequencies walking from f0 outwards (the solver takes rising frequencies: a falling walk is solved reversed). */
  const walk = (fs: number[]): number[] => (fs[fs.length - 1]! > fs[0]! ? lossAt(fs) : lossAt([...fs].reverse()).reverse());
  /**
   * Walking from f0 towards `to`, the first frequency where the loss falls under the level: found on 60 steps, then
   * on 32 finer ones inside the step that crosses, then read between the two points around it (one solve each: a
   * bisection compiled the network once per halving).
   */
  const edge = (to: number): number => {
    const fs = Array.from({ length: 61 }, (_, k) => f0 + ((to - f0) * k) / 60);
    const k = walk(fs).findIndex((x) => x < levelDb);
    if (k <= 0) return NaN;
    const fine = Array.from({ length: 33 }, (_, i) => fs[k - 1]! + ((fs[k]! - fs[k - 1]!) * i) / 32);
    const l = walk(fine);
    const i = l.findIndex((x) => x < levelDb);
    if (i <= 0) return (fs[k - 1]! + fs[k]!) / 2;
    return fine[i - 1]! + ((fine[i]! - fine[i - 1]!) * (l[i - 1]! - levelDb)) / (l[i - 1]! - l[i]!);
  };
  const lo = edge(f0 * VIEW[0]), hi = edge(f0 * VIEW[1]);
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return { lo, hi, passMaxDb: NaN };
  // The pass bands stop 0.5 % of f0 short of the edges, where the skirt has fallen below the level's last 0.05 dB.
  const a = lo - 0.005 * f0, b = hi + 0.005 * f0;
  const pass = [...Array.from({ length: 80 }, (_, k) => f0 * VIEW[0] + ((a - f0 * VIEW[0]) * k) / 79), ...Array.from({ length: 80 }, (_, k) => b + ((f0 * VIEW[1] - b) * k) / 79)];
  const coarse = lossAt(pass);
  // Ripple peaks are narrow near the edges: the three highest local peaks of the coarse look are looked at again
  // on a fine grid between their neighbours (one solve).
  // (The two bands are one list of 80 each, lower then upper: a peak is looked at between neighbours of its own band,
  // and a band's end next to the stop band counts as a peak when it is higher than its one neighbour.)
  const first = (k: number) => k % 80 === 0, last = (k: number) => k % 80 === 79;
  const peaks = coarse.map((l, k) => ({ l, k })).filter(({ l, k }) => (first(k) || l >= coarse[k - 1]!) && (last(k) || l >= coarse[k + 1]!))
    .sort((x, y) => y.l - x.l).slice(0, 4);
  // The last ripple peak of each pass band sits right by the stop band's edge, where the junctions lift it most:
  // the two coarse steps next to each edge are always looked at again too.
  const windows: [number, number][] = [...peaks.map(({ k }): [number, number] => [pass[first(k) ? k : k - 1]!, pass[last(k) ? k : k + 1]!]), [pass[77]!, pass[79]!], [pass[80]!, pass[82]!]];
  const fine = [...new Set(windows.flatMap(([wa, wb]) => Array.from({ length: 17 }, (_, i) => wa + ((wb - wa) * i) / 16)))].sort((x, y) => x - y);
  return { lo, hi, passMaxDb: Math.max(...coarse, ...(fine.length ? lossAt(fine) : [])) };
}

export const bandstopBlock: BlockDef = {
  kind: 'bandstop',
  title: 'Band-stop filter',
  summary: 'quarter-wave open stubs joined by quarter-wave lines',
  source: 'Matthaei, Young and Jones 1964, §4.05; Pozar, Microwave Engineering, 4th ed., 2012, §8.4–8.5; Horton and Wenzel 1965 (equal ripple)',
  params: [
    { ...RESPONSE, default: 'maxflat' }, { ...ORDER, default: 3, max: 7 }, RIPPLE,
    { name: 'bw', type: 'number', unit: 'ratio', min: 0.05, max: 0.8, default: 0.5, meaning: 'Fractional stop bandwidth (0.3 = 30 %)' },
    Z0_PARAM, FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec, ctx) {
    let made;
    try { made = bandstopDesign(spec, ctx); } catch (e) {
      // A row the fit or the process cannot make: the same refusal, with the nearest spec the block does make.
      if (!(e instanceof InputError)) throw e;
      if (e.field.startsWith('bandstop.')) throw withNearest(e, bandstopNearest(spec, ctx, 'band'));
      // A model refusing the block's own sweep (a tee beyond its fit at the top of the view band): the block's spec.
      const nearest = bandstopNearest(spec, ctx, 'band');
      throw new InputError('out-of-range', 'bandstop.bw', 'a band-stop the junction models can sweep from 0.2·f0 to 1.8·f0', `${e.field}: ${e.got}`, nearest ? `the nearest it makes within spec: ${nearest}` : e.hint);
    }
    const miss = bandstopMiss(spec, made.made);
    if (miss) throw bandstopRefusal(spec, made.made, miss, bandstopNearest(spec, ctx, made.made.rippleDb > (bandstopAsk(spec).rippleDb ?? Infinity) + 0.03 ? 'ripple' : 'band'));
    return made.pieces;
  },
};

/** The asked band-stop's figures: its stop bandwidth and (equal ripple) its pass-band ripple, as the spec gives them. */
function bandstopAsk(spec: Spec): { n: number; bw: number; rippleDb: number | null } {
  return { n: spec.order as number, bw: spec.bw as number, rippleDb: spec.response === 'chebyshev' ? spec.rippleDb as number : null };
}

/**
 * How a made band-stop misses its own spec, or null when it meets it: the edges (at the ripple + 0.05 dB, or −3 dB)
 * 5 % of the asked stop bandwidth apart at most, each within 5 % of its place f0·(1 ∓ Δ/2), and the pass bands' loss at most 0.03 dB above the asked ripple (the
 * issue's figures for a filter block). What the lossless sweep with the junction models shows is what is judged.
 */
/** What the lossless sweep shows of a made band-stop: stop bandwidth and edges (fractions of f0), pass-band loss (dB). */
interface Made { bw: number; lo: number; hi: number; rippleDb: number }

function bandstopMiss(spec: Spec, made: Made): string | null {
  const ask = bandstopAsk(spec);
  if (!Number.isFinite(made.bw)) return 'its stop band did not reach the edge level in the sweep';
  const off = made.bw / ask.bw - 1;
  if (Math.abs(off) > 0.05) return `its edges fall ${(made.bw * 100).toFixed(1)} % apart (${(off * 100).toFixed(1)} % off)`;
  const loOff = made.lo / (1 - ask.bw / 2) - 1, hiOff = made.hi / (1 + ask.bw / 2) - 1;
  if (Math.abs(loOff) > 0.05 || Math.abs(hiOff) > 0.05) return `its edges fall at ${made.lo.toFixed(3)}·f0 and ${made.hi.toFixed(3)}·f0 (${(loOff * 100).toFixed(1)} % and ${(hiOff * 100).toFixed(1)} % off: the band is not centred)`;
  if (ask.rippleDb !== null && made.rippleDb > ask.rippleDb + 0.03) return `its pass bands ripple ${made.rippleDb.toFixed(3)} dB`;
  return null;
}

/** A refusal of the design steps with the nearest spec the block makes added to its fix. */
function withNearest(e: InputError, nearest: string | null): InputError {
  return new InputError(e.code, e.field, e.expected, e.got, nearest ? `the nearest it makes within spec: ${nearest}` : e.hint);
}

/** The refusal of a band-stop that was made but misses its spec. */
function bandstopRefusal(spec: Spec, made: Made, miss: string, nearest: string | null): InputError {
  const ask = bandstopAsk(spec);
  const what = `order ${ask.n}, ${ask.rippleDb !== null ? `${ask.rippleDb} dB ripple, ` : 'maximally flat, '}${(ask.bw * 100).toFixed(1)} %`;
  return new InputError('out-of-range', ask.rippleDb !== null && made.rippleDb > ask.rippleDb + 0.03 ? 'bandstop.rippleDb' : 'bandstop.bw',
    'a band-stop that meets its own spec in the lossless sweep with the junction models (pass-band ripple at most 0.03 dB over the asked, edges within 5 % of their places and of the stop bandwidth)',
    `${what}: ${miss}`, nearest ? `the nearest it makes within spec: ${nearest}` : 'ask for a lower order, a larger ripple or a band nearer 50 %');
}

/**
 * The nearest spec the block makes within spec, tried in this order (each by designing it and sweeping it): for
 * equal ripple a larger ripple at the same order and band (the junctions add a small fixed reflection a very small
 * ripple cannot hide; the impedances also ease), then a wider stop band at the same order and ripple (narrow bands
 * need stubs too thin to make), then the next lower order. Null when none of them is made.
 */
function bandstopNearest(spec: Spec, ctx: BlockContext, first: 'ripple' | 'band'): string | null {
  const ask = bandstopAsk(spec);
  const pct = (x: number) => `${+(x * 100).toFixed(1)} %`;
  const dB = ask.rippleDb;
  type Try = { spec: Spec; words: string };
  const ripples: Try[] = dB === null ? [] : [dB * 2, dB * 5, dB * 20, dB * 100].map((x) => Math.min(3, +x.toPrecision(1)))
    .filter((x, i, a) => x > dB && a.indexOf(x) === i).map((x) => ({ spec: { ...spec, rippleDb: x }, words: `${x} dB ripple at order ${ask.n} and ${pct(ask.bw)}` }));
  const bands: Try[] = [0.2, 0.3, 0.5, 0.8].filter((x) => x > ask.bw + 1e-9)
    .map((x) => ({ spec: { ...spec, bw: x }, words: `a ${pct(x)} stop band at order ${ask.n}${dB !== null ? ` and ${dB} dB` : ''}` }));
  const orders: Try[] = Array.from({ length: ask.n - 1 }, (_, i) => ask.n - 1 - i)
    .map((k) => ({ spec: { ...spec, order: k }, words: `order ${k} at the same ${dB !== null ? 'ripple and ' : ''}band` }));
  // Last, the middle of the range (a 50 % band, and at least 1 dB of ripple for equal ripple), from the asked order down.
  const middle: Try[] = Array.from({ length: ask.n }, (_, i) => ask.n - i).map((k) => ({
    spec: { ...spec, order: k, bw: 0.5, ...(dB !== null ? { rippleDb: Math.max(1, dB) } : {}) },
    words: `a 50 % stop band at order ${k}${dB !== null ? ` and ${Math.max(1, dB)} dB` : ''}`,
  }));
  // Maximally flat asks the stubs alone to set the band (Pozar eq. 8.79: a 50 % band at order 3 wants a 127 Ω stub,
  // too thin on a thin laminate); the equal-ripple row frees the lines' impedances too (Horton and Wenzel 1965), so
  // a small ripple at the same order and band is the nearest spec for a maximally flat one.
  const equalRipple: Try[] = dB !== null ? [] : [0.1, 0.5].map((x) => ({ spec: { ...spec, response: 'chebyshev', rippleDb: x }, words: `${x} dB equal ripple at order ${ask.n} and ${pct(ask.bw)}` }));
  for (const t of [...equalRipple, ...(first === 'ripple' ? [...ripples, ...bands] : [...bands, ...ripples]), ...orders, ...middle]) {
    try { if (bandstopMiss(t.spec, bandstopDesign(t.spec, ctx).made) === null) return t.words; } catch (e) { if (!(e instanceof InputError)) throw e; }
  }
  return null;
}

/** The band-stop designed and corrected against its own lossless sweep, with what that sweep shows of it. */
function bandstopDesign(spec: Spec, ctx: BlockContext): { pieces: BlockPieces; made: Made } {
  {
    const z0 = spec.z0 as number, feed = spec.feed as number, bw = spec.bw as number, f0 = ctx.f0;
    const g = gValues(spec), n = spec.order as number, ripple = spec.response === 'chebyshev';
    const rippleDb = ripple ? spec.rippleDb as number : 3.0103;
    /** The row drawn: stub k of `stubZ[k]`, line k (between stubs k and k + 1) of `lineZ[k]`, all 90° at f0. */
    const draw = (stubZ: number[], lineZ: number[], stubWhat: string[]): { sk: Sketch; rows: string[] } => {
      const sk = new Sketch();
      sk.port('src', { x: -feed, y: 0 }, z0, 0, 'input');
      const rows: string[] = [];
      let prev = 'src', x = 0;
      for (let k = 1; k <= n; k++) {
        const zs = stubZ[k - 1]!, zl = lineZ[k - 2];
        widthFor(ctx, zs, 'bandstop.bw', `stub ${k}`);
        if (zl !== undefined) { widthFor(ctx, zl, 'bandstop.bw', `line ${k - 1}`); x += lambdaG(ctx, zl) / 4; }
        const j = sk.junction(`t${k}`, { x, y: 0 });
        sk.line(k === 1 ? 'in' : `l${k - 1}`, prev, j, zl ?? z0, k === 1 ? { length: feed } : { deg: 90 }, k === 1 ? undefined : 'quarter-wave line');
        sk.open(`s${k}-end`, { x, y: -lambdaG(ctx, zs) / 4 }, 'stub end');
        sk.line(`s${k}`, j, `s${k}-end`, zs, { deg: 90 }, `stub ${k}`);
        if (zl !== undefined) rows.push(`line ${k - 1}: ${ohm(zl)}, 90° at f0`);
        rows.push(`stub ${k}: ${stubWhat[k - 1]} → ${ohm(zs)}, 90° at f0`);
        prev = j;
      }
      sk.port('load', { x: x + feed, y: 0 }, z0, Math.PI, 'output');
      sk.line('out', prev, 'load', z0, { length: feed });
      return { sk, rows };
    };
    let lastRow: StubRow | undefined; // the previous fit, where the next (for a corrected band or ripple) starts
    /** The filter designed for fractional bandwidth `d` (and design ripple `r`), stubs scaled by the tees' n². */
    const design = (d: number, r: number, n2: number[]): { sk: Sketch; rows: string[] } => {
      if (!ripple) {
        // Maximally flat: Pozar eq. 8.79 with Δ = d, lines at Z0.
        const zs = g.slice(1, n + 1).map((gk, k) => ((4 * z0) / (Math.PI * gk * d)) * (n2[k + 1] ?? 1));
        return draw(zs, Array<number>(n - 1).fill(z0), g.slice(1, n + 1).map((gk, k) => `g${k + 1} = ${gk.toFixed(4)}`));
      }
      const row = equalRippleRow(g, n, r, (Math.PI / 2) * (1 - d / 2), lastRow);
      lastRow = row;
      if (row.fitDb > 0.01) {
        throw new InputError('out-of-range', 'bandstop.bw', `a stop band wide enough for stubs below ${(5 * z0).toFixed(0)} Ω at order ${n}, ${r.toFixed(2)} dB`,
          `${(bw * 100).toFixed(1)} % (the nearest row misses the ripple by ${row.fitDb.toFixed(2)} dB)`, 'ask for a wider stop band, a lower order or a smaller ripple');
      }
      return draw(row.stubZ.map((z, k) => z * z0 * (n2[k + 1] ?? 1)), row.lineZ.map((z) => z * z0), row.stubZ.map(() => 'equal-ripple row'));
    };
    /** Each tee's branch turns ratio n² at f0 (Hammerstad 1981, as the sweep uses it): the tee shows a stub of Z as Z/n². */
    const teeN2 = (sk: Sketch): number[] => {
      const n2: number[] = [];
      if (ctx.junctions !== 'modelled') return n2;
      const probe = contextDesign(ctx);
      probe.nodes = sk.nodes; probe.segments = sk.segments;
      for (const nd of sizeDesign(probe).nodes) {
        const k = /^t(\d+)$/.exec(nd.id)?.[1];
        if (k && nd.tee) n2[Number(k)] = teeJunction({ ...nd.tee.arms, h: ctx.substrate.h, f: f0 }).n2;
      }
      return n2;
    };
    // Pozar's eq. 8.79 is the narrow-band form: the quarter-wave lines are inverters only at f0, so a wide band comes
    // out narrow (a 50 % maximally flat order 3 measured 35 %). The equal-ripple row is exact in Richards' variable
    // but not for the junctions and the lines' dispersion. The band is symmetric about f0 (every piece is a quarter
    // wave there), so one number corrects the edges: the design bandwidth is rescaled until the lossless sweep (with
    // the junction models) puts them where asked; the edge is −3.01 dB (maximally flat) or 0.05 dB above the ripple
    // (so the ripple inside the pass bands is not taken for the edge).
    const level = ripple ? rippleDb + 0.05 : 3.0103;
    let d = bw, n2: number[] = [];
    let drawn = design(d, rippleDb, n2);
    for (let pass = 0; pass < 2; pass++) { n2 = teeN2(drawn.sk); drawn = design(d, rippleDb, n2); }
    // The junctions also lift the ripple a little near the edges (most on thick FR-4): the design ripple is
    // lowered by what the sweep shows above the asked one.
    let measured = NaN, r = rippleDb, seen = NaN, lo = NaN, hi = NaN;
    // The draft kept is the measured one nearest its spec (the steps need not settle monotonically).
    let best: { drawn: typeof drawn; measured: number; seen: number; lo: number; hi: number; d: number; r: number; score: number } | null = null;
    for (let it = 0; it < 8; it++) {
      const m = bandstopSweep(drawn.sk, ctx, level);
      measured = (m.hi - m.lo) / f0; seen = m.passMaxDb; lo = m.lo / f0; hi = m.hi / f0;
      if (!Number.isFinite(measured)) break;
      const over = ripple ? seen - rippleDb : 0;
      const score = Math.max(Math.abs(measured / bw - 1) / 0.05, over / 0.03, Math.abs(lo / (1 - bw / 2) - 1) / 0.05, Math.abs(hi / (1 + bw / 2) - 1) / 0.05);
      if (!best || score < best.score) best = { drawn, measured, seen, lo, hi, d, r, score };
      if (Math.abs(measured / bw - 1) < 0.005 && over < 0.02) break;
      d *= bw / measured;
      if (over > 0.02) r = Math.max(0.002, r * rippleDb / seen);
      drawn = design(d, r, n2);
    }
    if (best) ({ drawn, measured, seen, lo, hi, d, r } = best);
    const { sk, rows } = drawn;
    rows.push(`Designed with Δ = ${(d * 100).toFixed(1)} %${ripple ? ` and ${r.toFixed(3)} dB ripple` : ''} so the ${level.toFixed(2)} dB edges fall ${(bw * 100).toFixed(1)} % apart (lossless sweep${Number.isFinite(measured) ? `: ${(measured * 100).toFixed(1)} %${ripple ? `, pass bands within ${seen.toFixed(3)} dB` : ''}` : ''}).`);
    const kind = ripple ? `equal ripple ${rippleDb} dB (N stubs and N − 1 lines fitted to the optimum response, Horton and Wenzel 1965)` : 'maximally flat';
    return {
      pieces: {
        name: `Order ${n} band-stop, ${ghz(f0)}, ${(bw * 100).toFixed(0)} %`, nodes: sk.nodes, segments: sk.segments, phaseGroups: [],
        targets: [{ id: 'stop', name: 'stop band', figure: 'insertion-loss', ports: ['src', 'load'], band: { start: f0, stop: f0 }, limit: { min: 20 } }],
        notes: [`${bandstopBlock.title} (${bandstopBlock.source}): order ${n}, ${kind}, centre ${ghz(f0)}, ${(bw * 100).toFixed(1)} % bandwidth, ${z0} Ω.`, ...rows],
        band: { start: f0 * 0.2, stop: f0 * 1.8 },
      },
      made: { bw: measured, lo, hi, rippleDb: ripple ? seen : 0 },
    };
  }
}
