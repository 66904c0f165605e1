/**
 * Sizing: design document → sized pieces with compensations, node discontinuity data, and placed positions.
 *
 * Per piece (models cited where each is used below):
 * - width from its Z0 by exact synthesis at f0 with dispersion (core/line synthesizeLine), or as given;
 * - nominal length from its electrical length at f0 (l = θ λg/360, own εe(f0)), a physical length, or the drawn
 *   distance (through corner points);
 * - compensations at each end, reported per piece, applied where the model is verified:
 *     open end      Kirschning–Jansen–Koster 1981 Δl, applied (the copper ends Δl short);
 *     via to ground Goldfarb–Pucel 1991 L as an equivalent length Δl = arctan(ωL/Z0)/β, applied;
 *     miter/square  path measured through the corner point (common practice), amount 0;
 *     arc bend      straight copper shortened by R tan(θ/2) on each side, the arc's centreline counted instead, the
 *                   corner-to-corner span grown so the path keeps its electrical length;
 *     lumped pads   the line's own copper stops at the pad edge (the pad carries the rest of the path);
 *     launch pads   likewise at an edge launch;
 *     tee planes    Hammerstad 1981 reference-plane shifts at f0 (static line values): each arm's copper is drawn
 *                   that much longer, so its electrical length runs from plane to plane as asked (junctions
 *                   'modelled'); with 'ideal' junctions the shifts are only reported;
 *     width step    Garg–Bahl 1978 L/C, for the network only (no length change), each part within its fit range;
 *     cross, other  junctions with no model (four arms, or three not in a T): joined at the centre, reported.
 * Impossible requests become LayoutProblems naming pieces (or an InputError('impossible-layout') with `strict`).
 */
import type { DesignDoc, DesignNode, DesignSegment, JunctionChoice, WidthSpec } from '../design/types.ts';
import type { Vec2 } from '../geometry/types.ts';
import type { LineOptions, LineResult } from '../line/index.ts';
import { lengthForDegrees } from '../line/index.ts';
import { InputError, describe } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';
import { openEndExtension, openEndCapacitance, OPEN_END_SOURCE, OPEN_END_CITATION } from '../discontinuity/kirschningJansenKoster1981OpenEnd.ts';
import { miterCut, MITER_CITATION } from '../discontinuity/douvilleJames1978Miter.ts';
import { viaGround, viaEquivalentLength, VIA_CITATION } from '../discontinuity/goldfarbPucel1991Via.ts';
import { widthStep, STEP_CITATION } from '../discontinuity/gargBahl1978Step.ts';
import { stepResidual } from '../discontinuity/junctionResidual.ts';
import { sizeTee, noJunctionModel } from './junctions.ts';
import { arcBend, ARC_BEND_SOURCE } from '../discontinuity/curvedBend.ts';
import { klopfensteinProfile } from './klopfenstein1956Taper.ts';
import { LineCache, figures } from './lineCache.ts';
import { asMadeLineOptions } from './as-made.ts';
import { plainShift } from './as-made-shift.ts';
import { smdFootprint } from './footprints.ts';
import { add, dot, len, mul, sub, unit, crossZ } from './copper.ts';
import type { Compensation, LayoutProblem, SizedDesign, SizedNode, SizedPiece, TaperSection, SmdFootprint } from './types.ts';
import { pairDrawingProblem, pairLength, pairLinks, sizePair, splitPairs, SECOND_STRIP, type CoupledSegment, type PairData } from './coupledPair.ts';

export interface SizeOptions {
  /** Line-model choices (dispersion, conductor loss); defaults as core/line. */
  line?: LineOptions;
  /** Throw InputError('impossible-layout') on the first problem instead of returning problems as data. */
  strict?: boolean;
  /** Reuse a line cache across calls on the same substrate (faces re-size on every edit). */
  cache?: LineCache;
  /** Junction choice, overriding the design's own (the CLI's --junctions). */
  junctions?: JunctionChoice;
}

/** Largest turn a square or mitered corner may make (the miter fit's own limit), rad. */
export const MAX_CORNER_TURN = (135 * Math.PI) / 180;
/** Loop closure tolerance, m. */
export const CLOSE_TOL = 1e-6;
/**
 * Largest side of a board this app lays out, m (our choice): far above any blank made in-house, and small enough that
 * the polygon engine's work stays bounded. A design beyond it (a quarter wave at 1 MHz is tens of metres) is refused
 * here, during sizing, before any geometry is built.
 */
export const BOARD_SIZE_LIMIT = 1;
/** Klopfenstein default ripple when the design gives none: return loss 34 dB (|Γm| ≈ 0.02; Klopfenstein 1956, Proc. IRE 44(1), worked example, from memory). */
export const DEFAULT_TAPER_RIPPLE_DB = 34;

interface End { node: string; width: number; r: LineResult }

interface Work {
  seg: DesignSegment;
  piece: SizedPiece;
  endA: End | null;
  endB: End | null;
  /** Σ of applied shortenings that remove copper at an end (open, via). */
  cut: number;
  /** Σ of pad extents (copper replaced by pads). */
  pads: number;
  /** Σ of arc span extras (R tan(θ/2) − Rθ/2). */
  arcExtra: number;
  /** Straight run the ends need (arc tangents, miter intrusions), m. */
  straightNeed: number;
  /** Σ of the static (f → 0, largest) tee plane shifts at its ends, which the network's line must keep, m. */
  teeReserve: number;
  ok: boolean;
}

export function sizeDesign(doc: DesignDoc, opts: SizeOptions = {}): SizedDesign {
  const f0 = doc.frequency?.f0;
  if (typeof f0 !== 'number' || !(f0 > 0) || !Number.isFinite(f0)) throw new InputError('out-of-range', 'frequency.f0', 'a design frequency above 0 Hz', describe(f0));
  if (!Array.isArray(doc.nodes) || !Array.isArray(doc.segments)) throw new InputError('invalid-design', 'nodes', 'lists of nodes and segments', describe(doc.nodes));
  const subs = doc.substrate;
  if (!subs || typeof subs !== 'object') throw new InputError('invalid-design', 'substrate', 'a substrate (er, h, t, tanDelta, sigma, roughness)', describe(subs));
  const junctions: JunctionChoice = opts.junctions ?? doc.junctions ?? 'modelled';
  const band = doc.frequency.band && doc.frequency.band.stop >= doc.frequency.band.start ? doc.frequency.band : { start: f0, stop: f0 };
  // Lines sized as made (design asMade): the line options carry the cross-section tables (as-made.ts).
  const lineOpts = asMadeLineOptions(doc, opts.line);
  // A face passes its cache back on every edit; it is reused while the substrate's numbers are unchanged.
  const cache = opts.cache && opts.cache.fits(subs, lineOpts) ? opts.cache : new LineCache(subs, lineOpts);
  const problems: LayoutProblem[] = [];
  const warnings: Warning[] = [];
  const problem = (code: LayoutProblem['code'], message: string, subjects: string[]) => problems.push({ code, message, subjects });

  const nodeById = new Map<string, DesignNode>();
  for (const n of doc.nodes) nodeById.set(n.id, n);
  // A coupled pair is sized and placed as its two strips (coupledPair.ts); `segIndex` maps back to the file.
  const { segments, index: segIndex } = splitPairs(doc.segments);
  const pairs = new Map<string, Omit<PairData, 'strip' | 'partner' | 'segment'>>();
  const adj = new Map<string, string[]>();
  for (const n of doc.nodes) adj.set(n.id, []);
  const segById = new Map<string, DesignSegment>();
  for (const s of segments) {
    segById.set(s.id, s);
    for (const end of [s.a, s.b]) {
      if (!nodeById.has(end)) { problem('bad-topology', `segment ${s.id} ends at node '${end}', which does not exist`, [s.id]); continue; }
      adj.get(end)!.push(s.id);
    }
    if (s.a === s.b) problem('bad-topology', `segment ${s.id} starts and ends at the same node ${s.a}`, [s.id, s.a]);
  }

  // ---- topology: every end must be an end, every vertex joins two pieces, every junction three or four
  for (const n of doc.nodes) {
    const k = adj.get(n.id)!.length;
    const segs = adj.get(n.id)!;
    if (k === 0) { problem('dangling-end', `node ${n.id} (${n.kind}) is not connected to any piece; delete it or connect it`, [n.id]); continue; }
    switch (n.kind) {
      case 'port': case 'open': case 'short':
        if (k !== 1) problem('bad-topology', `${n.kind} ${n.id} has ${k} pieces (${segs.join(', ')}); an end takes exactly one — put a junction there instead`, [n.id, ...segs]);
        break;
      case 'vertex':
        if (k === 1) problem('dangling-end', `piece ${segs[0]} ends at vertex ${n.id} with nothing beyond it; end it with an open end, a short or a port`, [n.id, ...segs]);
        else if (k > 2) problem('bad-topology', `vertex ${n.id} joins ${k} pieces (${segs.join(', ')}); a vertex joins two — make it a junction`, [n.id, ...segs]);
        break;
      case 'junction':
        if (k < 3) problem(k === 1 ? 'dangling-end' : 'bad-topology', `junction ${n.id} has ${k} piece(s) (${segs.join(', ')}); a tee needs three and a cross four${k === 2 ? ' — make it a vertex' : ''}`, [n.id, ...segs]);
        else if (k > 4) problem('bad-topology', `junction ${n.id} joins ${k} pieces; at most four (a cross) are modelled`, [n.id, ...segs]);
        break;
    }
  }

  const at = (id: string): Vec2 => nodeById.get(id)!.at;
  const other = (s: DesignSegment, n: string) => (s.a === n ? s.b : s.a);
  /** Drawn direction leaving node n along segment s. */
  const dirFrom = (n: string, s: DesignSegment): Vec2 | null => {
    const d = sub(at(other(s, n)), at(n));
    const l = len(d);
    return l > 1e-12 ? { x: d.x / l, y: d.y / l } : null;
  };

  // ---- widths
  const h = subs.h, er = subs.er;
  const resolve = (spec: WidthSpec, field: string, segId: string): LineResult | null => {
    try {
      if (!spec || typeof spec !== 'object') throw new InputError('invalid-design', field, "a width given by 'z0' or 'width'", describe(spec));
      if (spec.by === 'z0') return cache.forZ0(spec.z0, f0);
      if (spec.by === 'width') return cache.forWidth(spec.width, f0);
      throw new InputError('bad-choice', `${field}.by`, "'z0' or 'width'", describe((spec as { by?: unknown }).by));
    } catch (e) {
      if (e instanceof InputError) { problem('bad-value', `piece ${segId}: ${e.message}`, [segId]); return null; }
      throw e;
    }
  };

  // A pair's geometry and mode figures at f0 (once per design segment; its strips share them), and the single line of
  // its strip width, which the end corrections (open ends, bends, pads) use.
  const resolvePair = (seg: CoupledSegment, field: string): LineResult | null => {
    const id = seg.id;
    try {
      const drawing = pairDrawingProblem(seg, (n) => nodeById.get(n));
      if (drawing) { problem('bad-topology', drawing, [pairId(id)]); return null; }
      let data = pairs.get(pairId(id));
      if (!data) {
        const r = sizePair(subs, seg, f0, field);
        data = r.data;
        pairs.set(pairId(id), data);
        pushWarnings(warnings, r.warnings, pairId(id));
      }
      return cache.forWidth(data.width, f0);
    } catch (e) {
      if (e instanceof InputError) { problem('bad-value', `piece ${pairId(id)}: ${e.message}`, [pairId(id)]); return null; }
      throw e;
    }
  };

  const works: Work[] = [];
  const workById = new Map<string, Work>();
  segments.forEach((seg, k) => {
    const i = segIndex[k]!;
    const piece: SizedPiece = {
      id: seg.id, kind: seg.kind, a: seg.a, b: seg.b, z0: NaN, width: NaN, nominalLength: 0, length: 0, span: 0, deg: 0, effectiveDeg: 0,
      line: null, compensations: [], warnings: [],
    };
    if (seg.label !== undefined) piece.label = seg.label;
    const w: Work = { seg, piece, endA: null, endB: null, cut: 0, pads: 0, arcExtra: 0, straightNeed: 0, teeReserve: 0, ok: true };
    works.push(w); workById.set(seg.id, w);
    const field = `segments[${i}]`;
    if (!nodeById.has(seg.a) || !nodeById.has(seg.b) || seg.a === seg.b) { w.ok = false; return; } // reported above
    let ra: LineResult | null, rb: LineResult | null;
    if (seg.kind === 'taper') { ra = resolve(seg.from, `${field}.from`, seg.id); rb = resolve(seg.to, `${field}.to`, seg.id); }
    else if (seg.kind === 'coupled') { ra = rb = resolvePair(seg, field); }
    else { ra = rb = resolve(seg.width, `${field}.width`, seg.id); }
    if (!ra || !rb) { w.ok = false; return; }
    w.endA = { node: seg.a, width: ra.width, r: ra };
    w.endB = { node: seg.b, width: rb.width, r: rb };
    piece.z0 = ra.z0; piece.width = ra.width;
    piece.line = figures(ra);
    if (lineOpts?.crossSection) piece.asMade = plainShift(subs, ra, f0, opts.line, lineOpts.crossSection);
    if (seg.kind === 'taper') { piece.widthB = rb.width; piece.z0B = rb.z0; }
    if (seg.kind === 'coupled') {
      const data = pairs.get(pairId(seg.id))!;
      const strip: 1 | 2 = seg.id.endsWith(SECOND_STRIP) ? 2 : 1;
      piece.pair = { ...data, segment: pairId(seg.id), partner: strip === 1 ? seg.id + SECOND_STRIP : pairId(seg.id), strip };
      // The coupled run's phase is the modes' mean, not the single strip's (coupledPair.ts).
      const beta = (data.betaEven + data.betaOdd) / 2;
      piece.line = { ...piece.line, beta, lambdaG: (2 * Math.PI) / beta, epsEff: ((beta * 299_792_458) / (2 * Math.PI * f0)) ** 2 };
    }
    pushWarnings(piece.warnings, ra.warnings, seg.id);
    if (rb !== ra) pushWarnings(piece.warnings, rb.warnings, seg.id);
  });

  // ---- nominal lengths
  for (let i = 0; i < works.length; i++) {
    const w = works[i]!;
    if (!w.ok) continue;
    const { seg, piece } = w;
    try {
      if (seg.kind === 'line') {
        const r = w.endA!.r;
        piece.nominalLength = nominalLength(seg.length, r, seg, at, `segments[${segIndex[i]}].length`);
      } else if (seg.kind === 'coupled') {
        piece.nominalLength = pairLength(seg, piece.line!.beta, `segments[${segIndex[i]}]`);
      } else if (seg.kind === 'taper') {
        sizeTaper(w, cache, f0, Math.max(band.stop, f0), at, i);
      } else if (seg.kind === 'lumped') {
        const fp = smdFootprint(seg.size);
        piece.part = { part: seg.part, value: seg.value, footprint: fp };
        piece.nominalLength = fp.pitch;
      } else if (seg.kind === 'sparams') {
        piece.sparams = { name: seg.name, touchstone: seg.touchstone };
        piece.nominalLength = seg.length.length;
      }
    } catch (e) {
      if (e instanceof InputError) { problem('bad-value', `piece ${seg.id}: ${e.message}`, [seg.id]); w.ok = false; continue; }
      throw e;
    }
  }

  // ---- nodes: bends, tees, steps, ends
  const sizedNodes: SizedNode[] = doc.nodes.map((n) => ({ id: n.id, kind: n.kind, at: n.at, pos: { x: NaN, y: NaN }, segments: adj.get(n.id)!.slice(), warnings: [] }));
  const nodeOut = new Map(sizedNodes.map((n) => [n.id, n]));
  const endOf = (w: Work, n: string): End | null => (w.seg.a === n ? w.endA : w.endB);
  const isLine = (w: Work) => w.seg.kind === 'line' || w.seg.kind === 'taper' || w.seg.kind === 'coupled';

  const comp = (w: Work, c: Compensation) => w.piece.compensations.push(c);
  for (const n of doc.nodes) {
    const sn = nodeOut.get(n.id)!;
    const segs = adj.get(n.id)!.map((id) => workById.get(id)!).filter((w) => w && w.ok);
    if (segs.length !== adj.get(n.id)!.length) continue; // a piece here failed to size; its problem is reported
    for (const w of segs) if (!dirFrom(n.id, w.seg)) problem('bad-topology', `piece ${w.seg.id} is drawn with both ends at the same point, so its direction is unknown; move node ${other(w.seg, n.id)}`, [w.seg.id]);
    if (segs.some((w) => !dirFrom(n.id, w.seg))) continue;
    switch (n.kind) {
      case 'port': {
        sn.port = { zRef: n.zRef, heading: n.heading, ...(n.launch ? { launch: n.launch } : {}) };
        const w = segs[0];
        if (w && Number.isFinite(n.heading)) {
          // The drawing sets the direction; a port heading that disagrees is probably a slip worth showing.
          const d = dirFrom(n.id, w.seg)!;
          const off = Math.abs(Math.atan2(Math.sin(Math.atan2(d.y, d.x) - n.heading), Math.cos(Math.atan2(d.y, d.x) - n.heading)));
          if (off > (5 * Math.PI) / 180) sn.warnings.push(warn('note', `port ${n.id} says its line leaves at ${deg(n.heading)}°, but ${w.seg.id} is drawn leaving at ${deg(Math.atan2(d.y, d.x))}°; the drawing is used`, { subjects: [n.id, w.seg.id], severity: 'info' }));
        }
        if (w && n.launch && isLine(w)) {
          w.pads += n.launch.padLength;
          comp(w, { model: 'launch-pad', source: 'common practice', amount_m: n.launch.padLength, applied: true, node: n.id,
            note: `the edge-launch pad (${mm(n.launch.padWidth)} × ${mm(n.launch.padLength)} mm) carries this part of the path; the line copper starts at its inner edge` });
        }
        break;
      }
      case 'open': {
        const w = segs[0];
        if (!w || !isLine(w)) break;
        const e = endOf(w, n.id)!;
        const oe = openEndExtension({ u: e.width / h, er, eeStatic: e.r.epsEffStatic, h });
        sn.open = { dl: oe.dl, capacitance: openEndCapacitance(oe.dl, e.r.epsEffStatic, e.r.z0Static) };
        pushWarnings(sn.warnings, oe.warnings, n.id);
        w.cut += oe.dl;
        comp(w, { model: 'open-end', source: OPEN_END_CITATION, amount_m: oe.dl, applied: true, node: n.id,
          note: `open-end extension Δl = ${mm(oe.dl)} mm (${OPEN_END_SOURCE}): the stub is drawn that much shorter than its electrical length` });
        break;
      }
      case 'short': {
        const w = segs[0];
        if (!w || !isLine(w)) break;
        const e = endOf(w, n.id)!;
        try {
          const g = viaGround({ h, drill: n.via.drill, count: n.via.count, f: f0, rho: 1 / subs.sigma, ...(n.via.plating !== undefined ? { plating: n.via.plating } : {}) });
          const beta = (2 * Math.PI) / e.r.lambdaG;
          const dl = viaEquivalentLength(g.X, e.r.z0, beta);
          sn.via = { ...n.via, L: g.L, R: g.R, X: g.X, dlEquivalent: dl };
          pushWarnings(sn.warnings, g.warnings, n.id);
          w.cut += dl;
          comp(w, { model: 'via', source: VIA_CITATION, amount_m: dl, applied: true, node: n.id,
            note: `via inductance ${(g.L * 1e12).toFixed(1)} pH (X = ${g.X.toFixed(2)} Ω at f0) looks like ${mm(dl)} mm more of this line (Δl = arctan(X/Z0)/β), so the stub is drawn that much shorter` });
        } catch (err) {
          if (err instanceof InputError) problem('bad-value', `via at ${n.id}: ${err.message}`, [n.id, w.seg.id]);
          else throw err;
        }
        break;
      }
      case 'vertex': {
        if (segs.length !== 2) break;
        const [w1, w2] = segs as [Work, Work];
        const d1 = mul(dirFrom(n.id, w1.seg)!, -1); // arriving along w1
        const d2 = dirFrom(n.id, w2.seg)!;          // leaving along w2
        const turn = Math.acos(Math.max(-1, Math.min(1, dot(d1, d2))));
        const lineish = isLine(w1) && isLine(w2);
        const e1 = endOf(w1, n.id), e2 = endOf(w2, n.id);
        const W1 = e1!.width, W2 = e2!.width;
        if (lineish && Math.abs(W1 - W2) > 1e-9 * Math.max(W1, W2)) {
          const wide = W1 > W2 ? { w: w1, e: e1! } : { w: w2, e: e2! };
          const nar = W1 > W2 ? { w: w2, e: e2! } : { w: w1, e: e1! };
          const st = widthStep({ W1: wide.e.width, W2: nar.e.width, h, er, z1: wide.e.r.z0Static, z2: nar.e.r.z0Static, ee1: wide.e.r.epsEffStatic, ee2: nar.e.r.epsEffStatic });
          // The fits are for an in-line step; at a bend the corner dominates and no model is at hand.
          const inLine = turn < Math.PI / 180;
          const modelled = junctions === 'modelled' && inLine && (st.cValid || st.lValid);
          sn.step = { ...st, wide: wide.w.seg.id, narrow: nar.w.seg.id, modelled };
          pushWarnings(sn.warnings, st.warnings, n.id);
          const parts = [st.lValid ? `L ${(st.Ls * 1e12).toFixed(1)} pH` : '', st.cValid ? `C ${(st.Cs * 1e15).toFixed(1)} fF` : ''].filter(Boolean).join(' and ');
          const validity = !inLine ? `a ${deg(turn)}° bend with a width change: outside the in-line step fits, not modelled`
            : st.cValid && st.lValid ? `W1/W2 = ${(wide.e.width / nar.e.width).toFixed(2)}, εr ${er}: inside both fits`
            : `W1/W2 = ${(wide.e.width / nar.e.width).toFixed(2)}, εr ${er}: ${parts ? `only ${parts} inside ${st.lValid ? 'its' : 'its'} fit` : 'outside both fits'}; the rest is left out`;
          const residual = stepResidual({ L1: st.lValid ? st.L1 : 0, L2: st.lValid ? st.L2 : 0, C: st.cValid ? st.Cs : 0, z1: wide.e.r.z0, z2: nar.e.r.z0, w: 2 * Math.PI * f0 });
          for (const [x, role] of [[wide, 'wide'], [nar, 'narrow']] as const) {
            comp(x.w, { model: 'width-step', source: STEP_CITATION, amount_m: 0, applied: modelled, node: n.id,
              note: modelled ? `width step: ${parts} in the sweep (Garg–Bahl fits); the step is not moved` : `width step: not in the sweep (${!inLine ? 'at a bend' : junctions === 'ideal' ? 'ideal junctions chosen' : 'outside the fits'})`,
              junction: { kind: 'step', role, modelled, inRange: inLine && st.cValid && st.lValid, validity, residual } });
          }
          if (!modelled && junctions === 'modelled') sn.warnings.push(warn('advisory-model', `step ${n.id}: not in the sweep (${validity})`, { source: 'garg-bahl-1978-step', subjects: [n.id], severity: 'info' }));
        }
        if (turn < 1e-6 || n.kind !== 'vertex') break;
        const W = Math.min(W1, W2);
        const style = n.bend;
        if (style.style !== 'arc' && turn > MAX_CORNER_TURN) {
          problem('bad-topology', `${n.id} turns ${deg(turn)}°, more than ${deg(MAX_CORNER_TURN)}°: a corner that folds back this far cannot be ${style.style === 'square' ? 'drawn square' : 'mitered'}; use an arc bend or two bends`, [n.id, w1.seg.id, w2.seg.id]);
          break;
        }
        sn.bend = { style, turn, width: W };
        if (style.style === 'square' && lineish && f0 > 2e9 && h >= 0.8e-3 && Math.abs(turn - Math.PI / 2) < 0.2) {
          sn.warnings.push(warn('validity', `square ${deg(turn)}° bend at ${n.id} at ${(f0 / 1e9).toFixed(2)} GHz on a ${(h * 1e3).toFixed(2)} mm board: an unmitered corner reflects noticeably here (practice: flag above 2 GHz on boards of 0.8 mm and more); consider an optimal miter or an arc`, { subjects: [n.id], source: 'common practice' }));
        }
        if (!lineish) {
          if (turn > 1e-3) sn.warnings.push(warn('fabrication', `${n.id} turns ${deg(turn)}° next to a part; the part's pads are drawn along its own axis`, { subjects: [n.id], severity: 'info' }));
          break;
        }
        try {
          if (style.style === 'arc') {
            const a = arcBend({ R: style.radius, W: Math.max(W1, W2), turnRad: turn });
            sn.bend.arc = { radius: style.radius, tangent: a.tangent, arcLength: a.arcLength };
            pushWarnings(sn.warnings, a.warnings, n.id);
            for (const w of [w1, w2]) {
              w.arcExtra += a.tangent - a.arcLength / 2;
              w.straightNeed += a.tangent;
              comp(w, { model: 'arc-bend', source: ARC_BEND_SOURCE, amount_m: a.tangent, applied: true, node: n.id,
                note: `straight copper ends R·tan(θ/2) = ${mm(a.tangent)} mm before the corner point; the arc's centreline (${mm(a.arcLength / 2)} mm on this side) counts instead, so the corner-to-corner span grows by ${mm(a.tangent - a.arcLength / 2)} mm and the path keeps its electrical length` });
            }
          } else {
            let intrusion = 0;
            if (style.style === 'miter' || style.style === 'miter-optimal') {
              const c = miterCut({ W, h, er, turnRad: turn, ...(style.style === 'miter' ? { fraction: style.fraction } : {}) });
              sn.bend.miter = c;
              pushWarnings(sn.warnings, c.warnings, n.id);
              // How far back from the corner point the cut reaches along the outer edge.
              intrusion = Math.max(0, c.leg - (W / 2) * Math.tan(turn / 2));
            }
            for (const w of [w1, w2]) {
              w.straightNeed += intrusion;
              comp(w, { model: style.style === 'square' ? 'square-bend' : 'miter-bend', source: style.style === 'square' ? 'common practice' : MITER_CITATION, amount_m: 0, applied: true, node: n.id,
                note: style.style === 'square'
                  ? 'unmitered bend: path measured through the corner point; an unmitered bend adds excess capacitance (no model applied)'
                  : `${(sn.bend.miter!.fraction * 100).toFixed(1)} % miter: path measured along the centreline through the corner point; keep equal bend counts on matched paths` });
            }
          }
        } catch (err) {
          if (err instanceof InputError) { problem('bad-value', `bend at ${n.id}: ${err.message}`, [n.id, w1.seg.id, w2.seg.id]); delete sn.bend; }
          else throw err;
        }
        break;
      }
      case 'junction': {
        const arms = segs.filter(isLine);
        if (segs.length === 3 && segs.every((w) => w.seg.kind === 'line')) {
          const r = sizeTee(n.id, segs.map((w) => ({ id: w.seg.id, dir: dirFrom(n.id, w.seg)!, end: endOf(w, n.id)!.r })), { h, f0, junctions });
          if (r.tee) sn.tee = r.tee;
          pushWarnings(sn.warnings, r.warnings, n.id);
          for (const a of r.arms) {
            const w = workById.get(a.id)!;
            comp(w, a.compensation);
            if (a.compensation.applied) { w.cut += a.compensation.amount_m; w.teeReserve += a.reserve; }
          }
        } else if (arms.length >= 3 || segs.length === 4) {
          // A cross, or three line-like arms one of which is a taper (the tee model is for uniform lines).
          const r = noJunctionModel(n.id, segs.length === 4 ? 'cross' : 'other', arms.map((w) => w.seg.id), segs.length === 4 ? undefined : 'a taper meets it (the tee model is for uniform lines)');
          if (segs.length === 4) sn.cross = { arms: segs.map((w) => w.seg.id) };
          sn.warnings.push(r.warning);
          for (const w of arms) comp(w, { ...r.compensation });
        }
        break;
      }
    }
    // Lines meeting a lumped part here: the line copper stops at the pad's edge.
    const lumped = segs.filter((w) => w.seg.kind === 'lumped');
    for (const lw of lumped) {
      const fp = lw.piece.part!.footprint;
      const axis = dirFrom(n.id, lw.seg)!;
      const across = Math.max(fp.padAcross, lw.endA?.width ?? 0);
      for (const w of segs) {
        if (!isLine(w)) continue;
        const d = dirFrom(n.id, w.seg)!;
        const e = Math.abs(dot(d, axis)) * fp.padAlong / 2 + Math.abs(crossZ(d, axis)) * across / 2;
        w.pads += e;
        comp(w, { model: 'lumped-pad', source: 'common practice', amount_m: e, applied: true, node: n.id,
          note: `the ${fp.size} pad of ${lw.seg.id} (terminal at the pad centre) carries ${mm(e)} mm of this path; the line copper stops at the pad edge` });
      }
    }
  }

  // ---- lengths and spans
  for (const w of works) {
    if (!w.ok) continue;
    const p = w.piece;
    if (w.seg.kind === 'lumped' || w.seg.kind === 'sparams') {
      p.length = 0; p.span = p.nominalLength; p.deg = 0; p.effectiveDeg = 0;
      continue;
    }
    if ((w.seg.kind === 'line' || w.seg.kind === 'taper') && w.seg.length.by === 'drawn') {
      // A drawn piece keeps the drawing: its nodes stay where they were drawn, and the electrical length it realises
      // follows from its ends (an open end adds Δl, an arc path is shorter than the corner path).
      p.span = p.nominalLength;
      p.nominalLength = p.span + w.cut - w.arcExtra;
    }
    p.length = p.nominalLength - w.cut - w.pads;
    p.span = p.nominalLength - w.cut + w.arcExtra;
    const beta = pieceBeta(p);
    p.deg = (p.length * beta * 180) / Math.PI;
    p.effectiveDeg = (p.nominalLength * beta * 180) / Math.PI;
    if (!(p.length - w.teeReserve > 0)) {
      // A modelled tee keeps its static plane shift of line inside the junction (teeReserve), so that much must remain.
      const list = p.compensations.filter((c) => c.applied && c.amount_m !== 0).map((c) => `${c.model} ${mm(c.amount_m)} mm at ${c.node}`).join(', ');
      const tee = w.teeReserve > 0 ? `, and ${mm(w.teeReserve)} mm stays inside the tee as its reference plane at low frequency` : '';
      problem('too-short', `piece ${p.id} is ${mm(p.nominalLength)} mm long but its end corrections take ${mm(w.cut + w.pads + w.teeReserve)} mm (${list}${tee}); lengthen it (e.g. add 180° to a stub) or change its ends`, [p.id]);
    } else if (p.span - w.straightNeed < -1e-9) {
      problem('too-short', `piece ${p.id} spans ${mm(p.span)} mm but the bends at its ends need ${mm(w.straightNeed)} mm of straight run; lengthen it, use a smaller arc radius or a square bend`, [p.id]);
    }
  }

  // ---- placement
  // Per strip end, the copper its applied end corrections removed (open ends, vias): the pair keeps its strips'
  // cut ends apart along the run (coupledPair.ts).
  const cutAt = (pieceId: string, node: string): number => {
    const w = workById.get(pieceId);
    if (!w) return 0;
    let c = 0;
    for (const x of w.piece.compensations) if (x.applied && x.node === node && (x.model === 'open-end' || x.model === 'via')) c += x.amount_m;
    return c;
  };
  for (const w of works) if (w.piece.pair) w.piece.pair.cuts = { near: cutAt(w.seg.id, w.seg.a), far: cutAt(w.seg.id, w.seg.b) };
  const links = pairLinks(doc.segments, (id) => nodeById.get(id)?.at, (id) => { const d = pairs.get(id); return d ? d.width + d.gap : undefined; }, cutAt);
  const placed = placeNodes(doc, workById, adj, nodeOut, dirFrom, problem, warnings, links);

  const pieces = works.map((w) => w.piece);
  // First in the list: a board too large explains the other problems it causes (loops that miss by metres).
  checkBoardSize(doc, pieces, sizedNodes, (code, message, subjects) => problems.unshift({ code, message, subjects }));
  const centrelines: Record<string, Vec2[]> = {};
  for (const w of works) {
    const pa = nodeOut.get(w.seg.a)?.pos, pb = nodeOut.get(w.seg.b)?.pos;
    if (pa && pb && Number.isFinite(pa.x) && Number.isFinite(pb.x)) centrelines[w.seg.id] = [pa, pb];
  }
  if (opts.strict && problems.length) {
    const p = problems[0]!;
    throw new InputError('impossible-layout', p.subjects[0] ? `segments.${p.subjects[0]}` : 'design', 'a layout that can be realised', p.message);
  }
  const out: SizedDesign = { name: doc.name, f0, junctions, band, pieces, nodes: sizedNodes, centrelines, anchor: placed, problems, warnings, doc };
  // Not enumerable: the options hold the cross-section tables (functions), and a sized design crosses postMessage
  // and JSON as plain data; the network reads the property directly.
  if (lineOpts) Object.defineProperty(out, 'lineOptions', { value: lineOpts, enumerable: false });
  return out;
}

/**
 * The extent of everything that would become copper or board (placed nodes, drawn nodes, outline, areas) against
 * BOARD_SIZE_LIMIT; beyond it a 'too-large' problem naming the longest pieces (or the areas) that make it so.
 */
function checkBoardSize(doc: DesignDoc, pieces: SizedPiece[], nodes: SizedNode[], problem: (code: LayoutProblem['code'], message: string, subjects: string[]) => void): void {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  const grow = (p: Vec2 | undefined, r = 0) => {
    if (!p || !Number.isFinite(p.x) || !Number.isFinite(p.y)) return;
    minX = Math.min(minX, p.x - r); maxX = Math.max(maxX, p.x + r); minY = Math.min(minY, p.y - r); maxY = Math.max(maxY, p.y + r);
  };
  const wMax = Math.max(0, ...pieces.map((p) => (Number.isFinite(p.width) ? Math.max(p.width, p.widthB ?? 0) : 0)));
  // A node no piece reaches makes no copper (it is reported as dangling); it does not size the board.
  for (const n of nodes) if (n.segments.length) { grow(n.at); grow(n.pos, wMax / 2); }
  for (const p of doc.board?.outline ?? []) grow(p);
  const bigAreas: string[] = [];
  for (const a of doc.areas ?? []) {
    for (const p of a.polygon ?? []) grow(p);
    const xs = (a.polygon ?? []).map((p) => p.x), ys = (a.polygon ?? []).map((p) => p.y);
    if (xs.length && Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) > BOARD_SIZE_LIMIT) bigAreas.push(a.id);
  }
  const dx = maxX - minX, dy = maxY - minY;
  if (!(dx > BOARD_SIZE_LIMIT || dy > BOARD_SIZE_LIMIT)) return;
  const longest = pieces.filter((p) => Number.isFinite(p.span) && p.span > 0).sort((a, b) => b.span - a.span);
  const named = longest.filter((p) => p.span >= BOARD_SIZE_LIMIT / 4).slice(0, 12);
  const list = (named.length ? named : longest.slice(0, 3));
  const why = list.length ? `; the longest pieces are ${list.map((p) => `${p.id} (${mm(p.span)} mm)`).join(', ')}` : '';
  problem('too-large', `the board would be ${mm(dx)} × ${mm(dy)} mm, more than the ${BOARD_SIZE_LIMIT * 1e3} mm a side Stripwright lays out${why}${bigAreas.length ? `; areas ${bigAreas.join(', ')} are larger than that` : ''}: check the design frequency (${(doc.frequency.f0 / 1e6).toPrecision(4)} MHz), the lengths and the outline`,
    [...list.map((p) => p.id), ...bigAreas]);
}

/** β at f0 of a line or taper piece (taper: mean over its sections), rad/m. */
export function pieceBeta(p: SizedPiece): number {
  if (p.sections && p.sections.length) {
    let L = 0, ph = 0;
    for (const x of p.sections) { L += x.length; ph += x.beta * x.length; }
    return L > 0 ? ph / L : 0;
  }
  return p.line ? p.line.beta : 0;
}

function nominalLength(spec: { by: string; deg?: number; length?: number }, r: LineResult, seg: DesignSegment, at: (id: string) => Vec2, field: string): number {
  switch (spec.by) {
    case 'degrees': return lengthForDegrees(r, spec.deg as number);
    case 'length': {
      const l = spec.length as number;
      if (typeof l !== 'number' || !(l > 0) || !Number.isFinite(l)) throw new InputError('out-of-range', `${field}.length`, 'a length above 0 m', describe(l));
      return l;
    }
    case 'drawn': return len(sub(at(seg.b), at(seg.a)));
    default: throw new InputError('bad-choice', `${field}.by`, "'degrees', 'length' or 'drawn'", describe(spec.by));
  }
}

/** Taper widths along its length (synthesised from the impedance profile) and its nominal length. */
function sizeTaper(w: Work, cache: LineCache, f0: number, fTop: number, at: (id: string) => Vec2, i: number): void {
  const seg = w.seg as Extract<DesignSegment, { kind: 'taper' }>;
  const ra = w.endA!.r, rb = w.endB!.r;
  const za = ra.z0, zb = rb.z0;
  const field = `segments[${i}]`;
  let zAt: (frac: number) => number;
  if (seg.profile === 'klopfenstein') {
    const rl = seg.rippleDb ?? DEFAULT_TAPER_RIPPLE_DB;
    const gm = 10 ** (-Math.abs(rl) / 20);
    const prof = klopfensteinProfile(za, zb, gm);
    zAt = prof.z;
  } else if (seg.profile === 'linear') {
    zAt = () => NaN; // widths interpolate linearly, see below
  } else throw new InputError('bad-choice', `${field}.profile`, "'linear' or 'klopfenstein'", describe((seg as { profile?: unknown }).profile));
  const widthAt = (frac: number): number => {
    if (seg.profile === 'linear') return ra.width + (rb.width - ra.width) * frac;
    if (frac <= 0) return ra.width;
    if (frac >= 1) return rb.width;
    return cache.forZ0(zAt(frac), f0).width;
  };
  const build = (n: number) => {
    const secs: { width: number; r: LineResult }[] = [];
    for (let k = 0; k < n; k++) {
      const wm = widthAt((k + 0.5) / n);
      secs.push({ width: wm, r: cache.forWidth(wm, f0) });
    }
    return secs;
  };
  let n = 24;
  let secs = build(n);
  const meanBeta = (s: typeof secs) => s.reduce((acc, x) => acc + (2 * Math.PI) / x.r.lambdaG, 0) / s.length;
  let L: number;
  const spec = seg.length;
  if (spec.by === 'degrees') L = ((spec.deg * Math.PI) / 180) / meanBeta(secs);
  else L = nominalLength(spec, ra, seg, at, `${field}.length`);
  // At least 20 sections per guided wavelength at the top of the band (common practice for sampling a continuous taper).
  const lgTop = Math.min(...[ra, rb].map((r) => cache.forWidth(r.width, fTop).lambdaG));
  const need = Math.ceil((20 * L) / lgTop);
  if (need > n) {
    n = Math.min(need, 400); secs = build(n);
    if (spec.by === 'degrees') L = ((spec.deg * Math.PI) / 180) / meanBeta(secs);
  }
  const sections: TaperSection[] = secs.map((s) => ({ width: s.width, length: L / n, z0: s.r.z0, beta: (2 * Math.PI) / s.r.lambdaG, lossDbPerM: s.r.alphaCdBPerM + s.r.alphaDdBPerM }));
  w.piece.sections = sections;
  w.piece.taperWidths = Array.from({ length: n + 1 }, (_, k) => widthAt(k / n));
  w.piece.nominalLength = L;
}

function placeNodes(
  doc: DesignDoc, workById: Map<string, Work>, adj: Map<string, string[]>,
  nodeOut: Map<string, SizedNode>, dirFrom: (n: string, s: DesignSegment) => Vec2 | null,
  problem: (code: LayoutProblem['code'], message: string, subjects: string[]) => void, warnings: Warning[],
  links: ReturnType<typeof pairLinks>,
): string | null {
  const anchorNode = doc.nodes.find((n) => n.kind === 'port') ?? doc.nodes[0];
  if (!anchorNode) return null;
  const parentSeg = new Map<string, string | null>();
  const placedFrom = (start: DesignNode) => {
    nodeOut.get(start.id)!.pos = { ...start.at };
    parentSeg.set(start.id, null);
    // Fixed-length pieces first, drawn ones last, so a loop closes through a drawn piece when it has one.
    const fixedQ: [string, string][] = [], drawnQ: [string, string][] = [];
    let fi = 0, di = 0;
    const enqueue = (n: string) => {
      for (const sid of adj.get(n) ?? []) {
        const w = workById.get(sid);
        if (!w || !w.ok) continue;
        const isDrawn = (w.seg.kind === 'line' || w.seg.kind === 'taper') && w.seg.length.by === 'drawn';
        (isDrawn ? drawnQ : fixedQ).push([n, sid]);
      }
    };
    // A placed end of a coupled strip places the end beside it on the other strip (the pair's pitch across).
    const reported = new Set<string>();
    const placeBeside = (n: string) => {
      for (const l of links.get(n) ?? []) {
        const target = add(nodeOut.get(n)!.pos, l.offset);
        const on = nodeOut.get(l.to)!;
        if (!parentSeg.has(l.to)) { on.pos = target; parentSeg.set(l.to, null); enqueue(l.to); placeBeside(l.to); continue; }
        const miss = len(sub(on.pos, target));
        if (miss > CLOSE_TOL && !reported.has(l.seg)) {
          reported.add(l.seg);
          problem('loop-mismatch', `the strips of pair ${l.seg} do not stay side by side: node ${l.to} is placed ${mm(miss)} mm from where the pair puts it beside ${n}; give both strips the same end corrections (e.g. open ends at opposite ends) or change the pieces around it`, [l.seg]);
        }
      }
    };
    enqueue(start.id);
    placeBeside(start.id);
    const done = new Set<string>();
    while (fi < fixedQ.length || di < drawnQ.length) {
      const [n, sid] = (fi < fixedQ.length ? fixedQ[fi++] : drawnQ[di++])!;
      if (done.has(sid)) continue;
      done.add(sid);
      const w = workById.get(sid)!;
      const o = w.seg.a === n ? w.seg.b : w.seg.a;
      const d = dirFrom(n, w.seg);
      if (!d) continue;
      const from = nodeOut.get(n)!.pos;
      const target = add(from, mul(d, w.piece.span));
      const on = nodeOut.get(o)!;
      if (!parentSeg.has(o)) {
        on.pos = target; parentSeg.set(o, sid); enqueue(o); placeBeside(o);
        continue;
      }
      // Loop closure.
      const miss = len(sub(on.pos, target));
      if (miss <= CLOSE_TOL) continue;
      const isDrawn = (w.seg.kind === 'line' || w.seg.kind === 'taper') && w.seg.length.by === 'drawn';
      if (isDrawn) {
        const actual = len(sub(on.pos, from));
        const delta = actual - w.piece.span;
        w.piece.span += delta; w.piece.nominalLength += delta; w.piece.length += delta;
        const beta = pieceBeta(w.piece);
        w.piece.deg = (w.piece.length * beta * 180) / Math.PI;
        w.piece.effectiveDeg = (w.piece.nominalLength * beta * 180) / Math.PI;
        const dirActual = unit(sub(on.pos, from));
        if (dot(dirActual, d) < Math.cos(Math.PI / 180)) {
          w.piece.warnings.push(warn('note', `${sid} closes a loop and was redrawn from its placed ends; its direction differs from the drawing by ${deg(Math.acos(Math.min(1, dot(dirActual, d))))}°`, { subjects: [sid], severity: 'info' }));
        }
        if (!(w.piece.length > 0)) problem('too-short', `piece ${sid} closes a loop but its ends are placed ${mm(actual)} mm apart, less than its end corrections`, [sid]);
        continue;
      }
      const loop = loopThrough(n, o, parentSeg, workById);
      problem('loop-mismatch', `the loop ${[...loop, sid].join(' → ')} does not close: ${sid} needs its far end ${mm(miss)} mm from where the rest of the loop puts node ${o}; adjust the lengths or make one piece of the loop 'drawn'`, [...loop, sid]);
    }
  };
  placedFrom(anchorNode);
  for (const n of doc.nodes) {
    if (parentSeg.has(n.id) || (adj.get(n.id) ?? []).length === 0) continue;
    warnings.push(warn('note', `node ${n.id} is not connected to the anchor port ${anchorNode.id}; its part of the network is placed from its drawn position`, { subjects: [n.id], severity: 'info' }));
    placedFrom(n);
  }
  return anchorNode.id;
}

/** Segments on the tree paths from a and b to their common ancestor. */
function loopThrough(a: string, b: string, parentSeg: Map<string, string | null>, workById: Map<string, Work>): string[] {
  const up = (n: string): { nodes: string[]; segs: string[] } => {
    const nodes = [n], segs: string[] = [];
    let cur = n;
    for (let guard = 0; guard < 1e6; guard++) {
      const s = parentSeg.get(cur);
      if (!s) break;
      segs.push(s);
      const w = workById.get(s)!;
      cur = w.seg.a === cur ? w.seg.b : w.seg.a;
      nodes.push(cur);
    }
    return { nodes, segs };
  };
  const pa = up(a), pb = up(b);
  const inB = new Map(pb.nodes.map((n, i) => [n, i]));
  let ia = pa.nodes.findIndex((n) => inB.has(n));
  if (ia < 0) ia = pa.nodes.length - 1;
  const ib = inB.get(pa.nodes[ia]!) ?? pb.segs.length;
  return [...pa.segs.slice(0, ia), ...pb.segs.slice(0, ib).reverse()];
}

/** The design segment id of a strip piece (the second strip's id carries a suffix). */
function pairId(id: string): string { return id.endsWith(SECOND_STRIP) ? id.slice(0, -SECOND_STRIP.length) : id; }

function pushWarnings(into: Warning[], from: Warning[], subject: string): void {
  for (const w of from) {
    if (into.some((x) => x.code === w.code && x.message === w.message)) continue;
    into.push({ ...w, subjects: w.subjects && w.subjects.length ? w.subjects : [subject] });
  }
}

export function mm(m: number): string { return (m * 1e3).toFixed(3); }
function deg(rad: number): string { return ((rad * 180) / Math.PI).toFixed(1); }
export type { SmdFootprint };
