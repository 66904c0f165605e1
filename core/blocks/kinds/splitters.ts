/**
 * Blocks `wilkinson` (two-way divider with its resistor), `branchline` (quadrature hybrid) and `ratrace` (180° hybrid
 * ring).
 *
 * Design equations:
 * - Wilkinson: E. J. Wilkinson, "An N-way hybrid power divider", IRE Trans. MTT-8, 1960; the unequal split as in
 *   D. M. Pozar, Microwave Engineering, 4th ed., 2012, §7.3 (eqs. 7.37–7.39): K² = P3/P2,
 *   Z03 = Z0·√((1 + K²)/K³), Z02 = K²·Z03, R = Z0·(K + 1/K); outputs seen as R2 = Z0·K and R3 = Z0/K, brought back to
 *   Z0 by quarter-wave transformers √(Z0·R2) and √(Z0·R3).
 * - Branch-line: Pozar §7.5 (equal split: series arms Z0/√2, shunt arms Z0); the unequal split from the same even–odd
 *   analysis with through |S21| = α and coupled |S31| = β (α² + β² = 1): series arms Z0·α, shunt arms Z0·α/β.
 * - Rat-race: Pozar §7.8: a ring of √2·Z0, 1.5 λ round, ports 90°, 90°, 90° apart (and 270° back).
 */
import type { DesignSegment, PhaseGroup, Target } from '../../design/types.ts';
import { sizeDesign } from '../../layout/sizing.ts';
import { asMadeLineOptions } from '../../layout/as-made.ts';
import { lineModels } from '../../line/index.ts';
import { InputError } from '../../util/errors.ts';
import { FEED_PARAM, Sketch, Z0_PARAM, lambdaG, narrowestWidth, widthFor, ghz, ohm, type BlockContext, type BlockDef, type BlockPieces, type Spec, contextDesign } from '../context.ts';
import { FOOTPRINT_PARAM } from '../fold.ts';
import { fitSpans, levelTargets, matchPhases, placeAsSized } from '../drawn.ts';
import { processCutWidth } from '../common.ts';
import { requireFigures, type SplitFigures } from './split-check.ts';
import { armPlans, noResistorFits, resistorSpan, toWorld } from './wilkinson-arms.ts';

export function wilkinsonValues(z0: number, ratioDb: number): { k: number; z2: number; z3: number; r: number; t2: number; t3: number } {
  const k2 = Math.pow(10, -ratioDb / 10); // K² = P3/P2: ratioDb = 10·log10(P2/P3)
  const k = Math.sqrt(k2);
  const z3 = z0 * Math.sqrt((1 + k2) / (k2 * k));
  const z2 = k2 * z3;
  return { k, z2, z3, r: z0 * (k + 1 / k), t2: Math.sqrt(z0 * z0 * k), t3: Math.sqrt((z0 * z0) / k) };
}

export function branchlineValues(z0: number, ratioDb: number): { series: number; shunt: number; through: number; coupled: number } {
  const r = Math.pow(10, ratioDb / 10); // P_through / P_coupled
  const a = Math.sqrt(r / (1 + r)), b = Math.sqrt(1 / (1 + r));
  return { series: z0 * a, shunt: (z0 * a) / b, through: a, coupled: b };
}

/** Whether the process makes every impedance of `zs` on this laminate (as the host sizes them), quietly. */
function makesAll(ctx: BlockContext, zs: number[]): boolean {
  const opts = asMadeLineOptions(contextDesign(ctx)), minW = narrowestWidth(ctx.process);
  return zs.every((z) => { try { return lineModels.strip().widthFor(ctx.substrate, z, ctx.f0, opts) >= minW; } catch { return false; } });
}

/**
 * The largest split (dB, same sign as `want`, rounded toward 0 dB to 0.1 dB) that `ok` accepts, by bisection on its
 * size; 0 when even the equal split is not made.
 */
export function largestRatio(want: number, ok: (ratioDb: number) => boolean): number {
  const s = Math.sign(want) || 1;
  let lo = 0, hi = Math.abs(want);
  if (!ok(0)) return 0;
  for (let k = 0; k < 24; k++) { const m = (lo + hi) / 2; if (ok(s * m)) lo = m; else hi = m; }
  return s * Math.floor(lo * 10 + 1e-9) / 10;
}

/**
 * Refuses a split ratio the process cannot make here, naming the largest it makes; `why` is the first line it cannot
 * make (the impedance refusal of widthFor, naming the highest impedance made here), when that is the reason.
 */
function ratioRefusal(field: string, what: string, want: number, best: number, cut: number, why?: InputError): InputError {
  return new InputError('out-of-range', field,
    `a split the process makes on this laminate (its narrowest copper and its ${(cut * 1e3).toFixed(3)} mm cut): ${best === 0 ? 'here only the equal split' : `up to ${best > 0 ? '' : '−'}${Math.abs(best).toFixed(1)} dB`}${why ? `; ${why.expected}` : ''}`,
    `${want} dB: ${why ? why.got : `its ${what} cannot be made here`}`, `give --ratio-db ${best.toFixed(1)}${best === 0 ? '' : ' or less'}, or use a thicker laminate, a wider isolation clearance or a finer process`);
}

/** The first of `zs` (named) the process cannot make here, as widthFor refuses it; undefined when all are made. */
function firstUnmade(ctx: BlockContext, field: string, zs: [number, string][]): InputError | undefined {
  for (const [z, what] of zs) {
    try { widthFor(ctx, z, field, what); } catch (e) { if (e instanceof InputError) return e; throw e; }
  }
  return undefined;
}

const band = (f0: number, frac: number) => ({ start: f0 * (1 - frac), stop: f0 * (1 + frac) });
const rl = (id: string, port: string, f0: number, min: number): Target => ({ id, name: `${port} matched`, figure: 'return-loss', ports: [port], band: band(f0, 0.02), limit: { min } });

export const wilkinsonBlock: BlockDef = {
  kind: 'wilkinson',
  title: 'Wilkinson divider',
  summary: 'two-way in-phase divider with its isolation resistor, equal or unequal split',
  source: 'Wilkinson, IRE Trans. MTT-8, 1960; unequal split per Pozar, Microwave Engineering, 4th ed., 2012, §7.3',
  params: [
    Z0_PARAM,
    { name: 'ratioDb', type: 'number', unit: 'db', min: -15, max: 15, default: 0, meaning: 'Power to output 1 over output 2, dB (0 = equal split)' },
    FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec, ctx) {
    const p1 = 1 / (1 + wilkinsonValues(spec.z0 as number, spec.ratioDb as number).k ** 2);
    const figs: SplitFigures = { paths: [{ from: 'in', outs: ['o1', 'o2'], levelsDb: [10 * Math.log10(p1), 10 * Math.log10(1 - p1)], phasesDeg: [0, 0] }], matched: ['in', 'o1', 'o2'], isolated: [['o1', 'o2']] };
    return requireFigures('Wilkinson divider', (c) => makeWilkinson(spec, c), ctx, figs);
  },
};

function makeWilkinson(spec: Spec, ctx: BlockContext): BlockPieces {
  const z0 = spec.z0 as number, ratio = spec.ratioDb as number, feed = spec.feed as number;
  const v = wilkinsonValues(z0, ratio);
  const cut = processCutWidth(ctx.process);
  // Arms, output lines (or transformers) and a resistor that bridges them, all made here.
  const wilkOk = (r: number) => {
    const x = wilkinsonValues(z0, r), eq = Math.abs(r) < 1e-9, zs = [x.z2, x.z3, eq ? z0 : x.t2, eq ? z0 : x.t3];
    if (!makesAll(ctx, zs)) return false;
    const w = zs.map((z) => widthFor(ctx, z, 'wilkinson.ratioDb', 'a line'));
    return resistorSpan([w[0]!, w[1]!], [w[2]!, w[3]!], cut) !== null;
  };
  if (!wilkOk(ratio)) {
    const best = largestRatio(ratio, wilkOk);
    const equal = Math.abs(ratio) < 1e-9;
    const why = firstUnmade(ctx, 'wilkinson.ratioDb', [[v.z2, 'arm 1'], [v.z3, 'arm 2'], [equal ? z0 : v.t2, 'output 1 transformer'], [equal ? z0 : v.t3, 'output 2 transformer']]);
    if (best !== 0 || wilkOk(0)) throw ratioRefusal('wilkinson.ratioDb', 'arms, output lines or resistor', ratio, best, cut, why);
  }
  const w2 = widthFor(ctx, v.z2, 'wilkinson.ratioDb', 'arm 1'), w3 = widthFor(ctx, v.z3, 'wilkinson.ratioDb', 'arm 2');
  const equal = Math.abs(ratio) < 1e-9;
  const wo1 = widthFor(ctx, equal ? z0 : v.t2, 'wilkinson.ratioDb', equal ? 'output 1 line' : 'output 1 transformer');
  const wo2 = widthFor(ctx, equal ? z0 : v.t3, 'wilkinson.ratioDb', equal ? 'output 2 line' : 'output 2 transformer');
  const sk = new Sketch();
  // Each arm: two legs to a bend and back toward the axis, ending beside the other arm's end across the resistor
  // (wilkinson-arms.ts); the outputs leave the ends 45° outward. The resistor is the smallest chip whose pitch
  // keeps the process's cut between the copper there.
  const fp = resistorSpan([w2, w3], [wo1, wo2], cut);
  if (!fp) throw noResistorFits('wilkinson.ratioDb', [w2, w3], [wo1, wo2], cut);
  const span = fp.pitch;
  sk.port('in', { x: -feed, y: 0 }, z0, 0, 'input');
  sk.junction('j', { x: 0, y: 0 });
  sk.line('feed', 'in', 'j', z0, { length: feed });
  const plans = armPlans([lambdaG(ctx, v.z2) / 4, lambdaG(ctx, v.z3) / 4], span);
  const arm = (side: 1 | -1, z: number, tag: string) => {
    const plan = plans[side === 1 ? 0 : 1];
    const O = { x: 0, y: 0 }, axis = { x: 1, y: 0 }, out = { x: 0, y: side };
    const vtx = sk.vertex(`v${tag}`, toWorld(O, axis, out, plan.bend));
    const end = sk.vertex(`j${tag}`, toWorld(O, axis, out, plan.end));
    sk.line(`arm${tag}1`, 'j', vtx, z, { deg: plan.deg[0] }, `arm ${tag}, first leg`);
    sk.line(`arm${tag}2`, vtx, end, z, { deg: plan.deg[1] }, `arm ${tag}, second leg`);
    const e = sk.at(end);
    const L = lambdaG(ctx, z) / 4;
    const turn = sk.vertex(`w${tag}`, { x: e.x + feed, y: e.y + side * feed });
    sk.line(`out${tag}a`, end, turn, equal ? z0 : tag === '1' ? v.t2 : v.t3, equal ? { length: feed } : { deg: 90 }, equal ? undefined : `output ${tag} transformer`);
    const p = sk.port(`o${tag}`, { x: e.x + 2 * feed + (equal ? 0 : L), y: e.y + side * feed }, z0, Math.PI, `output ${tag}`);
    sk.line(`out${tag}b`, turn, p, z0, { length: feed });
  };
  arm(1, v.z2, '1'); arm(-1, v.z3, '2');
  const f0 = ctx.f0;
  const doc = contextDesign(ctx);
  doc.junctions = ctx.junctions; doc.nodes = sk.nodes; doc.segments = sk.segments;
  const resistor: DesignSegment = { id: 'r1', kind: 'lumped', part: 'resistor', value: Math.round(v.r * 100) / 100, size: fp.size, width: { by: 'width', width: Math.min(w2, w3) }, a: 'j1', b: 'j2', label: 'isolation resistor' };
  fitSpans(doc, 'wilkinson', [{ part: resistor, arms: [['arm11', 'arm12'], ['arm21', 'arm22']], span }]);
  // Unequal arms meet their junctions differently: the output lines make up the phase one path lacks.
  matchPhases(doc, 'wilkinson', 'in', ['o1', 'o2'], (o) => `out${o.slice(1)}b`);
  const p1 = 1 / (1 + v.k * v.k), p2 = 1 - p1;
  const groups: PhaseGroup[] = [{ id: 'outputs', name: 'outputs in phase', from: 'in', to: ['o1', 'o2'], toleranceDeg: 2 }];
  return {
    name: `Wilkinson divider ${equal ? 'equal split' : `${ratio} dB split`}, ${ghz(f0)}`,
    nodes: doc.nodes, segments: doc.segments, phaseGroups: groups,
    targets: [
      ...levelTargets(doc, 'in', ['o1', 'o2'], [10 * Math.log10(p1), 10 * Math.log10(p2)], band(f0, 0.01)),
      { id: 'phase', name: 'outputs in phase', figure: 'phase-balance', group: 'outputs', band: band(f0, 0.02), limit: { max: 2 } },
      rl('match', 'in', f0, 20),
      { id: 'isolation', name: 'outputs isolated', figure: 'isolation', ports: ['o1', 'o2'], band: band(f0, 0.02), limit: { min: 20 } },
    ],
    notes: [
      `${wilkinsonBlock.title} (${wilkinsonBlock.source}) at ${ghz(f0)}, ${z0} Ω: P1/P2 = ${ratio} dB (K = ${v.k.toFixed(4)}).`,
      `Arms 90° at f0: arm 1 ${ohm(v.z2)}, arm 2 ${ohm(v.z3)}; resistor ${ohm(v.r)} (${fp.size}) across the arm ends${equal ? '' : `; output transformers ${ohm(v.t2)} and ${ohm(v.t3)}, 90° each`}.`,
      'The arm ends meet the resistor at an angle: no published model of that junction is at hand, so it is joined at its centre (the piece sheet says so).',
    ],
    band: band(f0, 0.25),
  };
}

export const branchlineBlock: BlockDef = {
  kind: 'branchline',
  title: 'Branch-line hybrid',
  summary: 'quadrature (90°) hybrid, equal or unequal split',
  source: 'Pozar, Microwave Engineering, 4th ed., 2012, §7.5',
  params: [Z0_PARAM, { name: 'ratioDb', type: 'number', unit: 'db', min: -10, max: 10, default: 0, meaning: 'Power to the through port over the coupled port, dB (0 = 3 dB hybrid)' }, FEED_PARAM, FOOTPRINT_PARAM],
  generate(spec, ctx) {
    const v = branchlineValues(spec.z0 as number, spec.ratioDb as number);
    const figs: SplitFigures = {
      paths: [{ from: 'p1', outs: ['p2', 'p3'], levelsDb: [20 * Math.log10(v.through), 20 * Math.log10(v.coupled)], phasesDeg: [0, -90] }],
      matched: ['p1', 'p2', 'p3', 'p4'], isolated: [['p1', 'p4'], ['p2', 'p3']],
    };
    return requireFigures('branch-line hybrid', (c) => makeBranchline(spec, c), ctx, figs);
  },
};

function makeBranchline(spec: Spec, ctx: BlockContext): BlockPieces {
  const z0 = spec.z0 as number, ratio = spec.ratioDb as number, feed = spec.feed as number;
  const v = branchlineValues(z0, ratio);
  const lineOk = (r: number) => { const x = branchlineValues(z0, r); return makesAll(ctx, [x.series, x.shunt]); };
  if (!lineOk(ratio) && lineOk(0)) {
    const why = firstUnmade(ctx, 'branchline.ratioDb', [[v.series, 'the series arms'], [v.shunt, 'the shunt arms']]);
    throw ratioRefusal('branchline.ratioDb', 'shunt arms', ratio, largestRatio(ratio, lineOk), processCutWidth(ctx.process), why);
  }
  widthFor(ctx, v.series, 'branchline.ratioDb', 'the series arms'); widthFor(ctx, v.shunt, 'branchline.ratioDb', 'the shunt arms');
  const a = lambdaG(ctx, v.series) / 4, b = lambdaG(ctx, v.shunt) / 4;
  const sk = new Sketch();
  const J = [sk.junction('j1', { x: 0, y: 0 }), sk.junction('j2', { x: a, y: 0 }), sk.junction('j3', { x: a, y: b }), sk.junction('j4', { x: 0, y: b })];
  sk.line('thru1', 'j1', 'j2', v.series, { deg: 90 }, 'series arm');
  sk.line('shunt2', 'j2', 'j3', v.shunt, { deg: 90 }, 'shunt arm');
  sk.line('thru2', 'j3', 'j4', v.series, { deg: 90 }, 'series arm');
  sk.line('shunt1', 'j4', 'j1', v.shunt, { deg: 90 }, 'shunt arm');
  const names = ['input', 'through', 'coupled', 'isolated'];
  const sx = [-1, 1, 1, -1], sy = [-1, -1, 1, 1];
  J.forEach((j, i) => {
    const at = sk.at(j);
    const c = sk.vertex(`c${i + 1}`, { x: at.x + sx[i]! * feed, y: at.y });
    const p = sk.port(`p${i + 1}`, { x: at.x + sx[i]! * feed, y: at.y + sy[i]! * feed }, z0, sy[i]! < 0 ? Math.PI / 2 : -Math.PI / 2, names[i]!);
    sk.line(`f${i + 1}a`, p, c, z0, { length: feed });
    sk.line(`f${i + 1}b`, c, j, z0, { length: feed });
  });
  const f0 = ctx.f0;
  const thr = 20 * Math.log10(v.through), cpl = 20 * Math.log10(v.coupled);
  const doc = contextDesign(ctx);
  doc.junctions = ctx.junctions; doc.nodes = sk.nodes; doc.segments = sk.segments;
  // The shunt arms are the tees' branches: each joins through the tee model's transformer (Hammerstad 1981), which
  // makes a line of Z look like Z/n²; the arms are therefore made n²·Z (two passes settle n², which depends on them).
  let n2 = 1;
  for (let pass = 0; pass < 2 && ctx.junctions === 'modelled'; pass++) {
    const tees = sizeDesign(doc).nodes.filter((n) => n.tee?.modelled).map((n) => n.tee!.atF0.n2);
    if (!tees.length) break;
    n2 = tees.reduce((a, b) => a + b, 0) / tees.length;
    for (const x of doc.segments) if (x.kind === 'line' && x.id.startsWith('shunt')) x.width = { by: 'z0', z0: Math.round(v.shunt * n2 * 1e4) / 1e4 };
  }
  placeAsSized(doc, 'branchline');
  return {
    name: `Branch-line hybrid ${ratio === 0 ? '3 dB' : `${ratio} dB split`}, ${ghz(f0)}`,
    nodes: sk.nodes, segments: sk.segments,
    phaseGroups: [{ id: 'quadrature', name: 'through and coupled in quadrature', from: 'p1', to: ['p2', 'p3'], toleranceDeg: 2, offsetsDeg: [0, 90] }],
    targets: [
      ...levelTargets(doc, 'p1', ['p2', 'p3'], [thr, cpl], band(f0, 0.01)),
      { id: 'quadrature', name: '90° between outputs', figure: 'phase-balance', group: 'quadrature', band: band(f0, 0.01), limit: { max: 3 } },
      rl('match', 'p1', f0, 20),
      { id: 'isolation', name: 'isolated port', figure: 'isolation', ports: ['p1', 'p4'], band: band(f0, 0.01), limit: { min: 20 } },
    ],
    notes: [
      `${branchlineBlock.title} (${branchlineBlock.source}) at ${ghz(f0)}, ${z0} Ω: through/coupled ${ratio} dB (|S21| ${v.through.toFixed(4)}, |S31| ${v.coupled.toFixed(4)}).`,
      `Series arms ${ohm(v.series)}, shunt arms ${ohm(v.shunt)} (made ${ohm(v.shunt * n2)}: the tee model's branch transformer n² = ${n2.toFixed(4)} at f0), each 90° at f0 from the tees' reference planes; opposite arms are alike, so the ring closes.`,
    ],
    band: band(f0, 0.3),
  };
}

export const ratraceBlock: BlockDef = {
  kind: 'ratrace',
  title: 'Rat-race hybrid',
  summary: '180° hybrid ring: sum and difference ports',
  source: 'Pozar, Microwave Engineering, 4th ed., 2012, §7.8',
  params: [Z0_PARAM, FEED_PARAM, FOOTPRINT_PARAM],
  generate(spec, ctx) {
    const half = 10 * Math.log10(0.5);
    const figs: SplitFigures = {
      paths: [{ from: 's', outs: ['o1', 'o2'], levelsDb: [half, half], phasesDeg: [0, 0] }, { from: 'd', outs: ['o1', 'o2'], levelsDb: [half, half], phasesDeg: [0, 180] }],
      matched: ['s', 'd', 'o1', 'o2'], isolated: [['s', 'd'], ['o1', 'o2']],
    };
    return requireFigures('rat-race hybrid', (c) => makeRatrace(spec, c), ctx, figs);
  },
};

function makeRatrace(spec: Spec, ctx: BlockContext): BlockPieces {
  const z0 = spec.z0 as number, feed = spec.feed as number, zr = Math.SQRT2 * z0;
  widthFor(ctx, zr, 'ratrace.z0', 'the ring');
  const a = lambdaG(ctx, zr) / 4;
  const sk = new Sketch();
  // A 2a × a rectangle, symmetric about x = a, so the ring closes: ports at the left side's middle (Δ), on the top
  // at a/2 and 3a/2, and the right side's middle (Σ... see below); corners are bends.
  sk.junction('j1', { x: 0, y: a / 2 });
  sk.vertex('c1', { x: 0, y: a });
  sk.junction('j2', { x: a / 2, y: a });
  sk.junction('j3', { x: (3 * a) / 2, y: a });
  sk.vertex('c2', { x: 2 * a, y: a });
  sk.junction('j4', { x: 2 * a, y: a / 2 });
  sk.vertex('c3', { x: 2 * a, y: 0 });
  sk.vertex('c4', { x: 0, y: 0 });
  sk.line('r1a', 'j1', 'c1', zr, { deg: 45 }); sk.line('r1b', 'c1', 'j2', zr, { deg: 45 });
  sk.line('r2', 'j2', 'j3', zr, { deg: 90 });
  sk.line('r3a', 'j3', 'c2', zr, { deg: 45 }); sk.line('r3b', 'c2', 'j4', zr, { deg: 45 });
  sk.line('r4a', 'j4', 'c3', zr, { deg: 45 }); sk.line('r4b', 'c3', 'c4', zr, 'drawn', 'closes the ring'); sk.line('r4c', 'c4', 'j1', zr, { deg: 45 });
  const port = (id: string, j: string, dx: number, dy: number, label: string) => {
    const at = sk.at(j);
    sk.port(id, { x: at.x + dx * feed, y: at.y + dy * feed }, z0, Math.atan2(-dy, -dx), label);
    sk.line(`f${id}`, id, j, z0, { length: feed });
  };
  // From j3: 90° to j2 and 90° to j4 (in phase: the sum port); from j1: 90° to j2, 270° to j4 (opposite: difference).
  port('d', 'j1', -1, 0, 'difference (Δ)'); port('o1', 'j2', 0, 1, 'output 1'); port('s', 'j3', 0, 1, 'sum (Σ)'); port('o2', 'j4', 1, 0, 'output 2');
  const f0 = ctx.f0;
  // The top side carries two tees whose reference planes lengthen its copper; the drawn bottom side must span the
  // same width, so it is electrically longer than 180° by that much. The two vertical pieces next to it give the
  // excess back (half each), so the path from j4 to j1 stays 270° and the ring stays symmetric (and closed).
  const doc = contextDesign(ctx);
  doc.junctions = ctx.junctions; doc.nodes = sk.nodes; doc.segments = sk.segments;
  let excess = 0;
  for (let pass = 0; pass < 2; pass++) {
    placeAsSized(doc, 'ratrace');
    const bottom = sizeDesign(doc).pieces.find((x) => x.id === 'r4b')!;
    excess = bottom.deg - 180;
    for (const x of doc.segments) if ((x.id === 'r4a' || x.id === 'r4c') && x.kind === 'line' && x.length.by === 'degrees') x.length = { by: 'degrees', deg: Math.round((45 - excess / 2) * 1e9) / 1e9 };
  }
  placeAsSized(doc, 'ratrace');
  return {
    name: `Rat-race hybrid, ${ghz(f0)}`, nodes: doc.nodes, segments: doc.segments,
    phaseGroups: [
      { id: 'sum', name: 'sum port feeds the outputs in phase', from: 's', to: ['o1', 'o2'], toleranceDeg: 2 },
      { id: 'difference', name: 'difference port feeds them 180° apart', from: 'd', to: ['o1', 'o2'], toleranceDeg: 2, offsetsDeg: [0, 180] },
    ],
    targets: [
      { id: 'sum', name: 'sum in phase', figure: 'phase-balance', group: 'sum', band: band(f0, 0.01), limit: { max: 3 } },
      { id: 'difference', name: 'difference 180°', figure: 'phase-balance', group: 'difference', band: band(f0, 0.01), limit: { max: 3 } },
      { id: 'isolation', name: 'Σ and Δ isolated', figure: 'isolation', ports: ['s', 'd'], band: band(f0, 0.01), limit: { min: 20 } },
      rl('match', 's', f0, 20),
    ],
    notes: [
      `${ratraceBlock.title} (${ratraceBlock.source}) at ${ghz(f0)}: ring ${ohm(zr)}, 1.5 λ round, drawn as a 2:1 rectangle symmetric about its middle so it closes.`,
      'Σ (s) is 90° from both outputs; Δ (d) is 90° from output 1 and 270° from output 2.',
    ],
    band: band(f0, 0.3),
  };
}

