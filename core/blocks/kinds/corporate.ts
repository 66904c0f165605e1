/**
 * Block `corporate`: an N-way feed (2–64 outputs, any count) made of two-way splits, tees or Wilkinson dividers,
 * with equal or tapered output amplitudes, the outputs at a pitch facing a heading, every path matched in phase.
 *
 * Design equations (D. M. Pozar, Microwave Engineering, 4th ed., 2012):
 * - a lossless tee splits power as the admittances of its arms (§7.2): arms Za = Zj·Ptot/Pa and Zb = Zj·Ptot/Pb in
 *   parallel present Zj; each arm is brought to the next junction's level by a quarter-wave transformer
 *   Zq = √(Z_arm·Z_next) (§5.4). The junction level Zj is chosen so the higher-impedance arm is 2·Z0 (the
 *   equal-split arms of the textbook feed), or Z0 when the process cannot make 2·Z0 (milled side copper lowers Z0,
 *   so a high impedance needs copper narrower than the cut leaves), and the input reaches the first junction
 *   through a quarter wave √(Z0·Zj) when Zj ≠ Z0;
 * - a Wilkinson split (Wilkinson 1960; unequal form Pozar §7.3, eqs. 7.37–7.39) with its resistor, its outputs
 *   brought back to Z0 by quarter waves.
 * The N outputs split as ⌈n/2⌉ and ⌊n/2⌋ at every level, so any count is reached with the fewest levels.
 * Phase matched by construction: the feed is sized and swept once at f0 (lossless, with the junction and bend
 * models the sweep uses), and each output's port line is lengthened by exactly the phase its output leads the most
 * delayed one; a symmetric tree needs nothing, and its outputs stay on one row.
 */
import type { DesignDoc } from '../../design/types.ts';
import { sizeDesign } from '../../layout/sizing.ts';
import { BOARD_SIZE_LIMIT } from '../../layout/sizing/board-size.ts';
import { InputError } from '../../util/errors.ts';
import { C0 } from '../../units/index.ts';
import { FEED_PARAM, Sketch, Z0_PARAM, lambdaG, widthFor, ghz, ohm, type BlockContext, type BlockDef, type BlockPieces, type Spec, contextDesign } from '../context.ts';
import { FOOTPRINT_PARAM } from '../fold.ts';
import { fitSpans, levelTargets, matchPhases, placeAsSized, type SpanFit } from '../drawn.ts';
import { wilkinsonValues } from './splitters.ts';
import { processCutWidth } from '../common.ts';
import { requireFigures, type SplitFigures } from './split-check.ts';
import { armPlans, leavingDir, noResistorFits, resistorSpan, toWorld } from './wilkinson-arms.ts';

interface Tree { leaves: number[]; power: number; left?: Tree; right?: Tree }

function buildTree(leaves: number[], power: number[]): Tree {
  const p = leaves.reduce((s, i) => s + power[i]!, 0);
  if (leaves.length === 1) return { leaves, power: p };
  const k = Math.ceil(leaves.length / 2);
  return { leaves, power: p, left: buildTree(leaves.slice(0, k), power), right: buildTree(leaves.slice(k), power) };
}

export const corporateBlock: BlockDef = {
  kind: 'corporate',
  title: 'Corporate feed',
  summary: 'N-way phase-matched feed of two-way splits (tees or Wilkinson), equal or tapered amplitudes',
  source: 'Pozar, Microwave Engineering, 4th ed., 2012, §5.4, §7.2 and §7.3; Wilkinson, IRE Trans. MTT-8, 1960',
  params: [
    { name: 'outputs', type: 'integer', min: 2, max: 64, default: 4, meaning: 'Number of outputs' },
    { name: 'split', type: 'choice', choices: ['tee', 'wilkinson'], default: 'tee', meaning: 'Two-way split: lossless tee or Wilkinson divider with resistor' },
    { name: 'amplitudesDb', type: 'list', unit: 'db', max: 64, optional: true, meaning: 'Relative output levels, dB, one per output (empty = all equal)' },
    { name: 'pitch', type: 'number', unit: 'length', min: 2e-3, max: 500e-3, optional: true, meaning: 'Distance between neighbouring outputs (default half a free-space wavelength at f0)' },
    { name: 'heading', type: 'number', unit: 'none', min: -180, max: 180, default: -90, meaning: 'Direction the outputs face, degrees from +x' },
    Z0_PARAM,
    FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec: Spec, ctx: BlockContext) {
    const n = spec.outputs as number;
    const dbs = (spec.amplitudesDb as number[] | undefined) ?? [];
    const power = Array.from({ length: n }, (_, i) => Math.pow(10, (dbs[i] ?? 0) / 10));
    const total = power.reduce((a, b) => a + b, 0);
    const outs = Array.from({ length: n }, (_, i) => `out${i + 1}`);
    requireRowFits(n, (spec.pitch as number | undefined) ?? C0 / ctx.f0 / 2);
    requireMakeableTaper(spec, ctx);
    // The feed's figures: every output's share in phase, and the input matched. A tee feed cannot be matched at its
    // outputs (a lossless three-port: Pozar §7.1); a Wilkinson tree's output match and isolation (§7.3) depend on
    // the junctions at its arm ends, which no published model covers: they are shown by the sweep, not held here.
    const figs: SplitFigures = {
      paths: [{ from: 'in', outs, levelsDb: power.map((p) => 10 * Math.log10(p / total)), phasesDeg: outs.map(() => 0) }],
      matched: ['in'], isolated: [],
    };
    return requireFigures('corporate feed', (c) => makeFeed(spec, c), ctx, figs);
  },
};

/**
 * Room the drawing needs beside its row of outputs (its 5 mm board margin each side, the widest lines, and the turns
 * of the outer splits), m: a generous allowance of ours.
 */
const ROW_ALLOWANCE = 30e-3;

/** Refuses a row of outputs longer than the largest board laid out, naming the widest pitch that fits. */
function requireRowFits(n: number, pitch: number): void {
  const room = BOARD_SIZE_LIMIT - ROW_ALLOWANCE;
  if ((n - 1) * pitch <= room) return;
  const most = Math.floor((room / (n - 1)) * 1e4) / 10;
  throw new InputError('out-of-range', 'corporate.pitch',
    `a row of outputs within the largest board laid out (${BOARD_SIZE_LIMIT * 1e3} mm a side): at most ${most} mm between ${n} outputs, or at most ${Math.floor(room / pitch) + 1} outputs at this pitch`,
    `${n} outputs at ${(pitch * 1e3).toFixed(1)} mm (the default pitch is half a free-space wavelength at f0), a row of ${((n - 1) * pitch * 1e3).toFixed(0)} mm`,
    `give --pitch ${most}mm or less, fewer outputs, or a higher design frequency`);
}

/** Whether every line of the feed (its impedances, and the resistors' lines) is made here: the sketch alone. */
function sketchable(spec: Spec, ctx: BlockContext): boolean {
  for (const top of spec.split === 'wilkinson' ? [2] as const : [2, 1] as const) {
    try { feedAtLevel(spec, ctx, top, true); return true; } catch (e) {
      if (!(e instanceof InputError) || e.field !== 'corporate.amplitudesDb' || e.code !== 'out-of-range') throw e;
    }
  }
  return false;
}

/**
 * A taper whose splits need lines the process cannot make is refused naming the nearest taper it makes: the same
 * levels scaled toward equal (the largest share of their depth, to 1 %), when the equal feed is made.
 */
function requireMakeableTaper(spec: Spec, ctx: BlockContext): void {
  const dbs = spec.amplitudesDb as number[] | undefined;
  if (!dbs?.length || sketchable(spec, ctx)) return;
  const scaled = (k: number) => ({ ...spec, amplitudesDb: dbs.map((d) => Math.round(d * k * 100) / 100) });
  if (!sketchable(scaled(0), ctx)) return; // even equal levels are not made: the line's own refusal says why
  let lo = 0, hi = 1;
  for (let it = 0; it < 12; it++) { const m = (lo + hi) / 2; if (sketchable(scaled(m), ctx)) lo = m; else hi = m; }
  const k = Math.floor(lo * 100) / 100, near = (scaled(k).amplitudesDb as number[]).map((d) => +d.toFixed(2));
  let why = '';
  try { feedAtLevel(spec, ctx, spec.split === 'wilkinson' ? 2 : 1, true); } catch (e) { if (e instanceof InputError) why = `; ${e.expected}`; }
  throw new InputError('out-of-range', 'corporate.amplitudesDb',
    `levels whose splits the process makes on this laminate: this taper at up to ${Math.round(k * 100)} % of its depth, ${near.join(', ')} dB${why}`,
    dbs.join(', '), `give --amplitudes-db ${near.join(',')}; or use a thicker laminate, a wider isolation clearance or a finer process`);
}

function makeFeed(spec: Spec, ctx: BlockContext): BlockPieces {
  if (spec.split === 'wilkinson') return feedAtLevel(spec, ctx, 2);
  // Tee splits: the textbook levels (higher arm 2·Z0) when the process can make them; else the low variant (higher
  // arm Z0: an equal split is a quarter wave from Z0 down to Z0/2 and two Z0 arms), which milled side copper allows
  // (it lowers Z0, so high impedances need copper narrower than the cut leaves). Refused, naming the nearest
  // impedance the process can make, when neither fits.
  try {
    return feedAtLevel(spec, ctx, 2);
  } catch (e) {
    if (!(e instanceof InputError) || e.code !== 'out-of-range' || e.field !== 'corporate.amplitudesDb') throw e;
    const made = feedAtLevel(spec, ctx, 1);
    made.notes.splice(1, 0, `Tee splits at the low level: the higher-impedance arm of each split is ${spec.z0 as number} Ω (the textbook ${2 * (spec.z0 as number)} Ω is beyond what the process makes here: ${e.expected}).`);
    return made;
  }
}

/**
 * The feed with tee junction levels set so each split's higher-impedance arm is `top`·Z0 (2: the textbook feed; 1:
 * the low variant). Wilkinson splits work at Z0 whatever `top` is.
 */
function feedAtLevel(spec: Spec, ctx: BlockContext, top: 1 | 2): BlockPieces;
function feedAtLevel(spec: Spec, ctx: BlockContext, top: 1 | 2, sketchOnly: true): null;
function feedAtLevel(spec: Spec, ctx: BlockContext, top: 1 | 2, sketchOnly = false): BlockPieces | null {
    const n = spec.outputs as number, z0 = spec.z0 as number, feed = spec.feed as number;
    const wilk = spec.split === 'wilkinson';
    const dbs = (spec.amplitudesDb as number[] | undefined) ?? [];
    if (dbs.length && dbs.length !== n) throw new InputError('out-of-range', 'corporate.amplitudesDb', `one level per output (${n} values)`, `${dbs.length} values`, 'give a level for every output, or none for equal amplitudes');
    if (dbs.some((d) => d < -30 || d > 30)) throw new InputError('out-of-range', 'corporate.amplitudesDb', 'levels from −30 dB to 30 dB', dbs.join(', '));
    const power = Array.from({ length: n }, (_, i) => Math.pow(10, (dbs[i] ?? 0) / 10));
    const pitch = (spec.pitch as number | undefined) ?? C0 / ctx.f0 / 2;
    const tree = buildTree(Array.from({ length: n }, (_, i) => i), power);
    const sk = new Sketch();
    const parts: SpanFit[] = [];
    const outputs: string[] = [];
    const notes: string[] = [];
    const xOf = (i: number) => (i - (n - 1) / 2) * pitch;
    const centre = (t: Tree): number => (t.left ? (centre(t.left) + centre(t.right!)) / 2 : xOf(t.leaves[0]!));
    let seq = 0;
    /** Quarter waves that feed a tee: the impedances they join and the tee below them (the n² pass reads it). */
    const feedsTee = new Map<string, { zAbove: number; zj: number; tee: string }>();
    /** Junction level Zj of a split: the higher arm is 2·Z0 (tee); a Wilkinson split works at Z0. */
    const level = (t: Tree): number => (!t.left || wilk ? z0 : (top * z0 * Math.min(t.left.power, t.right!.power)) / t.power);
    const drop = (z: number) => lambdaG(ctx, z) / 4;
    /** Grows the split of `t` below node `jid` at (x, y); returns nothing: leaves become ports. */
    const grow = (t: Tree, jid: string, x: number, y: number): void => {
      if (!t.left) return;
      const zj = level(t);
      const kids = [t.left, t.right!];
      if (!wilk) {
        kids.forEach((c) => {
          const k = seq++;
          const zArm = (zj * t.power) / c.power;
          widthFor(ctx, zArm, 'corporate.amplitudesDb', `the split arm toward outputs ${c.leaves.map((i) => i + 1).join(', ')}`);
          const xc = centre(c);
          const v = sk.vertex(`v${k}`, { x: xc, y });
          sk.line(`arm${k}`, jid, v, zArm, 'drawn');
          descend(c, v, xc, y, zArm, k);
        });
        return;
      }
      // Wilkinson split pointing down: two-leg arms ending side by side across the resistor (wilkinson-arms.ts), the
      // runs to the children leaving the arm ends 45° outward; the resistor is the smallest chip whose pitch keeps
      // the process's cut between the copper there.
      const v = wilkinsonValues(z0, 10 * Math.log10(t.left.power / t.right!.power));
      const toward = (c: Tree) => `outputs ${c.leaves.map((i) => i + 1).join(', ')}`;
      const zArm = [v.z2, v.z3] as const;
      // The arm end sits at R2 = Z0·K or R3 = Z0/K (Pozar §7.3): the run to the child's quarter wave stays at that
      // level, so its drawn length does not mismatch the split (a Z0 run there left an unequal split at −21 dB match).
      const zEnd = [z0 * v.k, z0 / v.k] as const;
      const wArm = kids.map((c, i) => widthFor(ctx, zArm[i]!, 'corporate.amplitudesDb', `a Wilkinson arm toward ${toward(c)}`)) as [number, number];
      const wEnd = kids.map((c, i) => widthFor(ctx, zEnd[i]!, 'corporate.amplitudesDb', `the run from a Wilkinson arm toward ${toward(c)}`)) as [number, number];
      const cut = processCutWidth(ctx.process);
      const fp = resistorSpan(wArm, wEnd, cut);
      if (!fp) throw noResistorFits('corporate.amplitudesDb', wArm, wEnd, cut);
      const span = fp.pitch;
      const plans = armPlans([drop(v.z2), drop(v.z3)], span);
      const ks: number[] = [];
      const ends = kids.map((c, side) => {
        const k = seq++;
        ks.push(k);
        const z = zArm[side]!, plan = plans[side]!, s = side === 0 ? -1 : 1;
        const O = { x, y }, axis = { x: 0, y: -1 }, out = { x: s, y: 0 };
        const a = sk.vertex(`w${k}`, toWorld(O, axis, out, plan.bend));
        const e = sk.vertex(`e${k}`, toWorld(O, axis, out, plan.end));
        sk.line(`wa${k}`, jid, a, z, { deg: plan.deg[0] });
        sk.line(`wb${k}`, a, e, z, { deg: plan.deg[1] });
        // Away from the arm end 45° outward (the copper there keeps the cut from the other side's), then across to
        // the child and down again.
        const dir = leavingDir(axis, out), L = 2 * span;
        const low = sk.vertex(`d${k}`, { x: sk.at(e).x + dir.x * L, y: sk.at(e).y + dir.y * L });
        sk.line(`dn${k}`, e, low, zEnd[side]!, { length: L });
        const xc = centre(c), ye = sk.at(low).y;
        const turn = sk.vertex(`h${k}`, { x: xc, y: ye });
        sk.line(`run${k}`, low, turn, zEnd[side]!, 'drawn');
        descend(c, turn, xc, ye, side === 0 ? v.t2 : v.t3, k);
        return e;
      });
      const [k0, k1] = ks as [number, number];
      parts.push({ part: { id: `r${k0}`, kind: 'lumped', part: 'resistor', value: Math.round(v.r * 100) / 100, size: fp.size, width: { by: 'width', width: 0.8e-3 }, a: ends[0]!, b: ends[1]!, label: 'isolation resistor' }, arms: [[`wa${k0}`, `wb${k0}`], [`wa${k1}`, `wb${k1}`]], span });
      notes.push(`Split toward outputs ${t.leaves.map((i) => i + 1).join('–')}: Wilkinson arms ${ohm(v.z2)} / ${ohm(v.z3)}, resistor ${ohm(v.r)}, output quarter waves ${ohm(v.t2)} / ${ohm(v.t3)}.`);
    };
    /** From the corner above child `c`: its quarter wave down to the next junction (or the output). */
    const descend = (c: Tree, from: string, x: number, y: number, zAbove: number, k: number): void => {
      const zNext = c.left ? level(c) : z0;
      const zq = wilk ? zAbove : Math.sqrt(zAbove * zNext);
      widthFor(ctx, zq, 'corporate.amplitudesDb', `a quarter-wave transformer toward outputs ${c.leaves.map((i) => i + 1).join(', ')}`);
      const y2 = y - drop(zq);
      if (c.left) {
        const j = sk.junction(`j${k}`, { x, y: y2 });
        if (!wilk) feedsTee.set(`q${k}`, { zAbove, zj: zNext, tee: j });
        sk.line(`q${k}`, from, j, zq, { deg: 90 }, 'quarter-wave transformer');
        grow(c, j, x, y2);
        return;
      }
      const t = sk.vertex(`t${k}`, { x, y: y2 }, 'square');
      sk.line(`q${k}`, from, t, zq, { deg: 90 }, 'quarter-wave transformer');
      const o = `out${c.leaves[0]! + 1}`;
      sk.port(o, { x, y: y2 - feed }, z0, Math.PI / 2, `output ${c.leaves[0]! + 1}`);
      sk.line(`run-${o}`, t, o, z0, { length: feed }, `output ${c.leaves[0]! + 1} line`);
      outputs.push(o);
    };
    const zRoot = level(tree);
    sk.port('in', { x: 0, y: 2 * feed }, z0, -Math.PI / 2, 'input');
    if (Math.abs(zRoot - z0) > 1e-9) {
      sk.vertex('k0', { x: 0, y: feed }, 'square');
      sk.line('feed', 'in', 'k0', z0, { length: feed });
      sk.junction('j', { x: 0, y: 0 });
      sk.line('qin', 'k0', 'j', Math.sqrt(z0 * zRoot), { deg: 90 }, 'input quarter-wave transformer');
      feedsTee.set('qin', { zAbove: z0, zj: zRoot, tee: 'j' });
    } else {
      sk.junction('j', { x: 0, y: 0 });
      sk.line('feed', 'in', 'j', z0, { length: 2 * feed });
    }
    grow(tree, 'j', 0, 0);
    if (sketchOnly) return null;
    outputs.sort((a, b) => Number(a.slice(3)) - Number(b.slice(3)));
    const f0 = ctx.f0;
    const doc: DesignDoc = contextDesign(ctx);
    doc.junctions = ctx.junctions; doc.nodes = sk.nodes; doc.segments = sk.segments;
    if (parts.length) fitSpans(doc, 'corporate', parts); else placeAsSized(doc, 'corporate');
    if (ctx.junctions === 'modelled') teeLevels(doc, feedsTee);
    // Phase matching: each output line is lengthened by the phase its output leads the most delayed one, read from
    // the lossless sweep at f0 with the junction models (matchPhases).
    const before = new Map(doc.nodes.filter((x) => x.kind === 'port').map((x) => [x.id, x.at.y]));
    matchPhases(doc, 'corporate', 'in', outputs, (o) => `run-${o}`);
    const longest = Math.max(0, ...doc.nodes.filter((x) => x.kind === 'port' && x.id !== 'in').map((x) => Math.abs(x.at.y - before.get(x.id)!)));
    placeAsSized(doc, 'corporate');
    rotate(doc, ((spec.heading as number) + 90) * (Math.PI / 180));
    const total = power.reduce((s, p) => s + p, 0);
    const levels = power.map((p) => 10 * Math.log10(p / total));
    notes.unshift(
      `${corporateBlock.title} (${corporateBlock.source}): ${n} outputs at ${(pitch * 1e3).toFixed(2)} mm pitch, ${wilk ? 'Wilkinson' : 'tee'} splits, ${ghz(f0)}, ${z0} Ω.`,
      `Output levels (ideal): ${levels.map((l) => l.toFixed(2)).join(', ')} dB.`,
      longest > 0 ? `Paths matched by lengthening output lines (longest addition ${(longest * 1e3).toFixed(2)} mm), so those outputs sit that much lower than the row.` : 'The tree is symmetric: every path is alike and the outputs stay on one row.',
    );
    return {
      name: `${n}-way corporate feed, ${ghz(f0)}`,
      nodes: doc.nodes, segments: doc.segments,
      phaseGroups: [{ id: 'outputs', name: 'outputs in phase', from: 'in', to: outputs, toleranceDeg: 5 }],
      targets: [
        { id: 'phase', name: 'outputs in phase', figure: 'phase-spread', group: 'outputs', band: { start: f0, stop: f0 }, limit: { max: 5 } },
        { id: 'match', name: 'input matched', figure: 'return-loss', ports: ['in'], band: { start: f0 * 0.98, stop: f0 * 1.02 }, limit: { min: 15 } },
        ...levelTargets(doc, 'in', outputs, outputs.map((o) => levels[Number(o.slice(3)) - 1]!), { start: f0, stop: f0 }),
      ],
      notes,
      band: { start: f0 * 0.8, stop: f0 * 1.2 },
    };
}

/**
 * Each split's input is the branch of a tee (its arms leave sideways), and the tee model the sweep uses (Hammerstad
 * 1981) joins the branch through a transformer that shows the junction's Zj as n²·Zj. The quarter wave above the
 * tee therefore matches to n²·Zj (Pozar §5.4: Zq = √(Z_above·n²·Zj)); left at √(Z_above·Zj) it mismatches each
 * arm, whose drawn length then moves the split (0.15 dB on an 8-output −10 dB edge taper). n² depends on the widths,
 * so two passes settle it.
 */
function teeLevels(doc: DesignDoc, feedsTee: Map<string, { zAbove: number; zj: number; tee: string }>): void {
  for (let pass = 0; pass < 2; pass++) {
    const n2 = new Map(sizeDesign(doc).nodes.filter((x) => x.tee?.modelled).map((x) => [x.id, x.tee!.atF0.n2]));
    let moved = false;
    for (const seg of doc.segments) {
      const q = feedsTee.get(seg.id), k = q && n2.get(q.tee);
      if (!q || k === undefined || seg.kind !== 'line') continue;
      seg.width = { by: 'z0', z0: Math.round(Math.sqrt(q.zAbove * q.zj * k) * 1e6) / 1e6 };
      moved = true;
    }
    if (!moved) return;
    placeAsSized(doc, 'corporate');
  }
}

/** Turns the whole drawing about the input by `a` radians (port headings too). */
function rotate(doc: DesignDoc, a: number): void {
  if (Math.abs(a) < 1e-12) return;
  const c = Math.cos(a), s = Math.sin(a);
  for (const n of doc.nodes) {
    const { x, y } = n.at;
    n.at = { x: Math.round((c * x - s * y) * 1e9) / 1e9, y: Math.round((s * x + c * y) * 1e9) / 1e9 };
    if (n.kind === 'port') n.heading = Math.atan2(Math.sin(n.heading + a), Math.cos(n.heading + a));
  }
}
