/**
 * Block `launch`: the pad an edge-mounted coaxial connector's centre pin is soldered to, and the transition from
 * the pad to the line.
 *
 * Design:
 * - The pad's width, when the user leaves it empty, is the wider of the line and the connector's pin: the pin must
 *   lie wholly on copper to be soldered, and where the line is already wider than the pin it simply runs to the
 *   board edge under it (common practice for edge launches). The pin's default width, 1.27 mm, is the centre
 *   conductor of the common SMA interface (from memory; the connector's own drawing wins).
 * - A pad of another width than the line is a short line of another impedance at the port. By the theory of small
 *   reflections (D. M. Pozar, Microwave Engineering, 4th ed., 2012, §5.5; §5.8 for a taper as a continuum of small
 *   steps) its reflection is the port's step Γ1 plus the opposite step where the pad returns to the line, delayed
 *   by twice the electrical length between them: |Γ| ≈ 2·|Γ1|·sin(β·ℓ) for a pad of length ℓ. Any taper after the
 *   pad only moves that return step further away, so the generator's taper (taper length left empty) is the
 *   shortest one whose model stays meaningful: a linear flare whose edges turn at most 30° from the line's axis
 *   (the project's rule: a sharper flare is a step, whose fringing the taper's quasi-static sections leave out).
 * - When that pad and flare miss the match and the taper was left to the generator, a compensating section follows
 *   the pad: impedance Zc = Z0²/Zp, so in ln Z the three changes (into the pad, into the section, back to the line)
 *   are −L, 2L and −L; they sum to zero, and their first-order reflection (Pozar §5.5: Γ(θ) ≈ ½·Σ Δln Z·e^{−2jθ_k})
 *   cancels when the return to the line lies at twice the electrical distance of the step into the section: the
 *   section as long electrically as the pad, the two meeting in abrupt steps (compensationFor). What remains is of
 *   second order, 4·|Γ1|·sin²θ against the pad's 2·|Γ1|·sin θ. A narrow pad (a connector's ground tabs close by) is then followed by a wider section, a
 *   wide pad (a thin laminate) by a narrower one.
 * - The made launch is judged by the lossless sweep with the line models and the in-line step model the sweep
 *   uses (Garg and Bahl 1978, core/network/fromSized.ts): its match must be below −25 dB at f0 and 20 dB return loss
 *   over the block's band (0.5·f0 to 1.5·f0). A spec that misses is refused, naming the nearest spec that meets it
 *   (the longest pad at the asked width, the pad width nearest the asked at the asked length, or the automatic pad).
 * What is not modelled: the connector itself (its pin's own capacitance over the pad, its ground tabs); the port is
 * the connector's reference plane at the board edge.
 */
import { InputError } from '../../util/errors.ts';
import { sizeDesign } from '../../layout/sizing.ts';
import { netlistFromSized } from '../../network/fromSized.ts';
import { solveNetwork } from '../../network/sweep.ts';
import { lineModels, stripAt } from '../../line/index.ts';
import { asMadeLineOptions } from '../../layout/as-made.ts';
import { FEED_PARAM, Sketch, Z0_PARAM, contextDesign, round6, round9, widthFor, type BlockContext, type BlockDef, type BlockPieces, type Spec } from '../context.ts';
import { FOOTPRINT_PARAM } from '../fold.ts';

/** Match at f0 (the blocks issue's figure) and return loss over the block's band, dB. */
export const LAUNCH_MATCH_DB = -25;
export const LAUNCH_BAND_RL_DB = 20;
/** The block's band, as fractions of f0. */
const BAND = [0.5, 1.5] as const;
/** Steepest flare of the generator's taper, each edge from the line's axis (the project's rule, see above). */
const FLARE_DEG = 30;
/** The pad's strip runs this far past the port's pad where a compensating section follows, m (the step needs a line). */
const PAD_TAIL = 0.1e-3;
/** Pad and line widths closer than this are one strip (no transition drawn), m. */
const SAME_WIDTH = 1e-6;

/**
 * A compensating section after the pad: impedance Z0²/Zp (ohms), its width and its length (m).
 */
export interface Compensation { z: number; w: number; len: number }
/**
 * The launch's geometry, all in metres: pad width and length, taper length (0: none), line width, and the
 * compensating section when there is one (it then replaces the taper: the pad meets it, and it the line, in steps).
 */
export interface LaunchShape { pw: number; pl: number; tl: number; wl: number; comp?: Compensation }

/** Length of the generator's taper between widths `a` and `b`: a linear flare of FLARE_DEG per edge, at least 0.1 mm. */
export function autoTaperLength(a: number, b: number): number {
  if (Math.abs(a - b) < SAME_WIDTH) return 0;
  return Math.max(0.1e-3, Math.abs(a - b) / 2 / Math.tan((FLARE_DEG * Math.PI) / 180));
}

/** The launch drawn: the port with its pad, the taper (when the pad is not the line's width) and the line. */
function drawLaunch(s: LaunchShape, z0: number, feed: number): Sketch {
  const sk = new Sketch();
  sk.port('conn', { x: 0, y: 0 }, z0, 0, 'connector', { padWidth: s.pw, padLength: s.pl });
  if (s.comp) {
    // The pad as a strip of its own width (the port's pad is its first part, a short tail of it joins the steps),
    // then the section and the line, each meeting the next in a width step (the sweep's Garg and Bahl 1978 model).
    const c = s.comp, z = round6(c.z);
    let x = s.pl + PAD_TAIL;
    sk.vertex('k1', { x, y: 0 }, 'square');
    sk.segments.push({ id: 'pad', kind: 'line', a: 'conn', b: 'k1', width: { by: 'width', width: round9(s.pw) }, length: { by: 'length', length: round9(s.pl + PAD_TAIL) }, label: 'connector pad (the port\'s pad is its first part)' });
    x += c.len;
    sk.vertex('k2', { x, y: 0 }, 'square');
    sk.line('comp', 'k1', 'k2', z, { length: c.len }, 'compensating section (Z0²/Zp, the pad\'s electrical length)');
    sk.port('line', { x: x + feed, y: 0 }, z0, Math.PI, 'line');
    sk.line('run', 'k2', 'line', z0, { length: feed });
  } else if (s.tl > 0) {
    sk.vertex('k1', { x: s.pl + s.tl, y: 0 }, 'square');
    sk.segments.push({ id: 'taper', kind: 'taper', a: 'conn', b: 'k1', profile: 'linear', from: { by: 'width', width: s.pw }, to: { by: 'z0', z0 }, length: { by: 'length', length: s.pl + s.tl }, label: 'pad taper (the pad is its first part)' });
    sk.port('line', { x: s.pl + s.tl + feed, y: 0 }, z0, Math.PI, 'line');
    sk.line('run', 'k1', 'line', z0, { length: feed });
  } else {
    // The pad is the line's own copper under the pin: the line runs to the board edge.
    sk.port('line', { x: s.pl + feed, y: 0 }, z0, Math.PI, 'line');
    sk.line('run', 'conn', 'line', z0, { length: s.pl + feed }, 'line (the pad is its first part)');
  }
  return sk;
}

/** What the lossless sweep (line, taper and step models as the sweep uses them) shows of a launch: |S11| in dB. */
export interface LaunchMatch { atF0Db: number; worstDb: number }

export function launchMatch(s: LaunchShape, z0: number, feed: number, ctx: BlockContext): LaunchMatch | null {
  const sk = drawLaunch(s, z0, feed);
  const doc = contextDesign(ctx);
  doc.junctions = ctx.junctions; doc.nodes = sk.nodes; doc.segments = sk.segments;
  const sized = sizeDesign(doc);
  if (sized.problems.length) return null;
  const fs = Array.from({ length: 11 }, (_, k) => ctx.f0 * (BAND[0] + ((BAND[1] - BAND[0]) * k) / 10));
  const r = solveNetwork(netlistFromSized(sized, { lossless: true }), new Float64Array(fs));
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === 'conn');
  const db = fs.map((_, k) => { const t = 2 * ((k * P + i) * P + i); return 20 * Math.log10(Math.max(1e-12, Math.hypot(r.s[t]!, r.s[t + 1]!))); });
  return { atF0Db: db[5]!, worstDb: Math.max(...db) };
}

/** A match in words: below −60 dB the figure says nothing more (no step at all gives numbers near the solver's floor). */
const dbWords = (db: number): string => (db < -60 ? 'below −60 dB' : `${db.toFixed(1)} dB`);

const meets = (m: LaunchMatch | null): boolean => !!m && m.atF0Db < LAUNCH_MATCH_DB && m.worstDb < -LAUNCH_BAND_RL_DB;

/**
 * The compensating section for a pad that is not the line's width (see the doc comment): Zc = Z0²/Zp, so the three
 * steps (into the pad, into the section, back to the line) are −L, 2L and −L in ln Z, and their first-order
 * reflection cancels when the return to the line lies at twice the electrical distance of the step into the section
 * (Pozar §5.5: Γ(θ) ≈ ½·Σ Δln Z·e^{−2jθ_k}): the section is as long, electrically, as the pad's strip. The steps are
 * abrupt (a flare would spread them and push the return further out). Null when the process cannot make the section.
 */
export function compensationFor(s: LaunchShape, z0: number, ctx: BlockContext): Compensation | null {
  const opts = asMadeLineOptions(contextDesign(ctx));
  const at = (w: number) => stripAt(lineModels.strip(), ctx.substrate, w, ctx.f0, opts);
  const pad = at(s.pw), z = (z0 * z0) / pad.z0;
  let w: number;
  try { w = widthFor(ctx, z, 'launch.padWidth', 'the compensating section'); } catch (e) { if (e instanceof InputError) return null; throw e; }
  // θc = θp: the section has the pad's electrical length (its strip, tail included).
  const len = ((s.pl + PAD_TAIL) * at(w).lambdaG) / pad.lambdaG;
  return { z, w, len };
}

/**
 * The launch made from a shape: as drawn when it meets the match, else, when the taper was left to the generator,
 * with the compensating section when that meets it. The figures are those of the one returned.
 */
function madeLaunch(s: LaunchShape, autoTaper: boolean, z0: number, feed: number, ctx: BlockContext): { shape: LaunchShape; m: LaunchMatch | null } {
  const m = launchMatch(s, z0, feed, ctx);
  if (meets(m) || !autoTaper || s.tl === 0) return { shape: s, m };
  const comp = compensationFor(s, z0, ctx);
  if (!comp) return { shape: s, m };
  const c = { ...s, comp }, mc = launchMatch(c, z0, feed, ctx);
  return meets(mc) || (mc && (!m || mc.atF0Db < m.atF0Db)) ? { shape: c, m: mc } : { shape: s, m };
}

/** The launch's shape from its spec: the pad and taper as asked, or the generator's where left empty. */
function shapeOf(spec: Spec, wl: number): LaunchShape {
  const pw = (spec.padWidth as number | undefined) ?? Math.max(wl, spec.pinWidth as number);
  const same = Math.abs(pw - wl) < SAME_WIDTH || (spec.padWidth === undefined && pw === wl);
  const tl = same ? 0 : (spec.taperLength as number | undefined) ?? autoTaperLength(pw, wl);
  return { pw: same ? wl : pw, pl: spec.padLength as number, tl, wl };
}

export const launchBlock: BlockDef = {
  kind: 'launch',
  title: 'Connector launch',
  summary: 'pad for an edge-mounted connector\'s pin, with a taper or a compensating section to the line when the pad is not the line\'s width',
  source: 'the pad as wide as the line or the pin (common practice); its reflection and compensating section by the theory of small reflections, Pozar, Microwave Engineering, 4th ed., 2012, §5.5 and §5.8; judged by the sweep with the Garg and Bahl 1978 step model',
  params: [
    { name: 'pinWidth', type: 'number', unit: 'length', min: 0.2e-3, max: 5e-3, default: 1.27e-3, meaning: 'Width of the connector\'s centre pin on the pad (1.27 mm: SMA class; your connector\'s drawing wins)' },
    { name: 'padWidth', type: 'number', unit: 'length', min: 0.3e-3, max: 10e-3, optional: true, meaning: 'Width of the connector pad (not given: the wider of the line and the pin)' },
    { name: 'padLength', type: 'number', unit: 'length', min: 0.3e-3, max: 20e-3, default: 3e-3, meaning: 'Length of the pad the pin lies on, from the board edge' },
    { name: 'taperLength', type: 'number', unit: 'length', min: 0.1e-3, max: 50e-3, optional: true, meaning: 'Length of the linear taper from the pad to the line (not given: a 30° flare, the shortest the models describe)' },
    Z0_PARAM, FEED_PARAM, FOOTPRINT_PARAM,
  ],
  generate(spec, ctx) {
    const z0 = spec.z0 as number, feed = spec.feed as number;
    const wl = widthFor(ctx, z0, 'launch.z0', 'the line');
    const { shape, m } = madeLaunch(shapeOf(spec, wl), spec.taperLength === undefined, z0, feed, ctx);
    if (!meets(m)) throw launchRefusal(spec, ctx, shape, m);
    const sk = drawLaunch(shape, z0, feed);
    const f0 = ctx.f0, mm = (x: number) => `${(x * 1e3).toFixed(2)} mm`;
    const how = shape.comp
      ? `${mm(shape.pw)} × ${mm(shape.pl)} pad, then a ${shape.comp.z.toFixed(1)} Ω compensating section ${mm(shape.comp.len)} long (Z0²/Zp; Zp = ${((z0 * z0) / shape.comp.z).toFixed(1)} Ω: the first-order reflections cancel), meeting the pad and the ${mm(wl)} ${z0} Ω line in steps`
      : shape.tl > 0
      ? `${mm(shape.pw)} × ${mm(shape.pl)} pad, ${mm(shape.tl)} linear taper${spec.taperLength === undefined ? ` (${FLARE_DEG}° flare)` : ''} to the ${mm(wl)} ${z0} Ω line`
      : `${mm(shape.pl)} pad on the ${mm(wl)} ${z0} Ω line itself (the line is at least as wide as the ${mm(spec.pinWidth as number)} pin)`;
    return {
      name: `Connector launch, ${mm(shape.pw)} pad`, nodes: sk.nodes, segments: sk.segments, phaseGroups: [],
      targets: [
        { id: 'match', name: 'launch matched at f0', figure: 'return-loss', ports: ['conn'], band: { start: f0, stop: f0 }, limit: { min: -LAUNCH_MATCH_DB } },
        { id: 'band', name: 'launch over its band', figure: 'return-loss', ports: ['conn'], band: { start: f0 * BAND[0], stop: f0 * BAND[1] }, limit: { min: LAUNCH_BAND_RL_DB } },
      ],
      notes: [
        `${launchBlock.title} (${launchBlock.source}).`,
        `${how[0]!.toUpperCase()}${how.slice(1)}; lossless sweep with the line and step models: match ${dbWords(m!.atF0Db)} at f0, ${dbWords(m!.worstDb)} at worst over ${BAND[0]}–${BAND[1]}·f0. The connector itself is not modelled.`,
      ],
      band: { start: f0 * BAND[0], stop: f0 * BAND[1] },
    } satisfies BlockPieces;
  },
};

/**
 * The refusal of a launch that misses its match, naming the nearest spec that meets it, each found by sweeping:
 * the generator's taper (when one was given), the longest pad at the asked width, the width nearest the asked at
 * the asked length (towards the line's width, which always meets: no step at all), and the automatic pad.
 */
function launchRefusal(spec: Spec, ctx: BlockContext, made: LaunchShape, m: LaunchMatch | null): InputError {
  const z0 = spec.z0 as number, feed = spec.feed as number, wl = made.wl;
  // The neighbours are tried as asked shapes: the generator adds (or sizes anew) a compensating section for each.
  const shape: LaunchShape = { pw: made.pw, pl: made.pl, tl: made.tl, wl };
  const mm = (x: number) => `${+(x * 1e3).toFixed(2)} mm`;
  const auto = spec.taperLength === undefined;
  const ok = (s: LaunchShape): boolean => { try { return meets(madeLaunch(s, auto, z0, feed, ctx).m); } catch (e) { if (e instanceof InputError) return false; throw e; } };
  const taper = (pw: number): number => (Math.abs(pw - wl) < SAME_WIDTH ? 0 : (spec.taperLength as number | undefined) ?? autoTaperLength(pw, wl));
  const ways: string[] = [];
  if (!auto) {
    const gen = { ...shape, tl: autoTaperLength(shape.pw, wl) };
    if (meets(madeLaunch(gen, true, z0, feed, ctx).m)) ways.push(`no taper length (the generator's ${mm(gen.tl)} flare, or its compensating section)`);
  }
  // Longest pad at the asked width: the reflection grows with the pad's length (2·|Γ1|·sin βℓ).
  const minLen = 0.3e-3;
  if (ok({ ...shape, pl: minLen })) {
    let lo = minLen, hi = shape.pl;
    for (let k = 0; k < 12; k++) { const mid = (lo + hi) / 2; if (ok({ ...shape, pl: mid })) lo = mid; else hi = mid; }
    ways.push(`a pad at most ${mm(Math.floor(lo * 1e5) / 1e5)} long at ${mm(shape.pw)} wide`);
  }
  // Nearest width at the asked length, between the asked width and the line's (no step).
  {
    let lo = shape.pw, hi = wl; // lo misses, hi meets
    for (let k = 0; k < 12; k++) { const mid = (lo + hi) / 2; if (ok({ ...shape, pw: mid, tl: taper(mid) })) hi = mid; else lo = mid; }
    const w = hi > lo ? Math.ceil(hi * 1e5) / 1e5 : Math.floor(hi * 1e5) / 1e5;
    ways.push(`a pad ${hi > shape.pw ? 'at least' : 'at most'} ${mm(w)} wide at ${mm(shape.pl)} long`);
  }
  if (spec.padWidth !== undefined) {
    const { padWidth: _asked, ...rest } = spec;
    const own = shapeOf(rest, wl);
    if (ok(own)) ways.push(`no pad width (the generator's ${mm(own.pw)}${own.tl === 0 ? ', the line\'s own' : ''})`);
  }
  const field = spec.padWidth !== undefined ? 'launch.padWidth' : spec.taperLength !== undefined ? 'launch.taperLength' : 'launch.padLength';
  const seen = m ? `${m.atF0Db.toFixed(1)} dB at f0, ${m.worstDb.toFixed(1)} dB at worst over ${BAND[0]}–${BAND[1]}·f0` : 'a layout the sizing refuses';
  if (!ways.length) ways.push('a connector with a pin nearer the line\'s width, or a laminate whose line is as wide as the pin');
  return new InputError('out-of-range', field,
    `a launch matched below ${LAUNCH_MATCH_DB} dB at f0 with ${LAUNCH_BAND_RL_DB} dB return loss over ${BAND[0]}–${BAND[1]}·f0 (lossless sweep with the line and step models)`,
    `a ${mm(made.pw)} × ${mm(made.pl)} pad${made.comp ? ` with a ${made.comp.z.toFixed(1)} Ω compensating section` : made.tl > 0 ? ` with a ${mm(made.tl)} taper` : ''} to the ${mm(wl)} ${z0} Ω line: ${seen}`,
    `the nearest that meets it: ${ways.join('; or ')}`);
}
