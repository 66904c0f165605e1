/**
 * Sized design → netlist for the nodal solver.
 *
 * Each line piece is a lossy, dispersive line whose Zc(f) and γ(f) come from the line model at every frequency
 * (the line-model interface's strip family, core/line/line-model.ts; by default microstrip: Hammerstad & Jensen 1980
 * statics with Kirschning & Jansen 1982 dispersion), over the physical length the layout gives (compensations applied).
 * Around the pieces, what the layout applied is put back as circuit elements so the model stays whole:
 *  - open end (Kirschning, Jansen & Koster 1981, Electronics Letters 17(3), applied by the layout as a Δl cut): the end
 *    capacitance C_oc from node to ground;
 *  - via to ground (Goldfarb & Pucel 1991, IEEE Microwave and Guided Wave Letters 1(6), from memory): series R(f) + jωL to ground, R with its skin effect
 *    recomputed at each frequency;
 *  - lumped parts: the ideal part between its pad centres, and each pad as a short line of the pad's width over the
 *    length the layout took off the adjoining line (common practice: a pad is a piece of wide line);
 *  - edge-launch pads: likewise a short line of the pad width between the port and its piece;
 *  - tapers: their piecewise-uniform sections in a chain;
 *  - 'sparams' parts: their Touchstone data, interpolated and stamped as an admittance matrix (sparamsPart.ts);
 *  - coupled pairs: one four-port from the even and odd modes (coupledPair.ts; Kirschning–Jansen 1984 with
 *    Getsinger 1973 dispersion and mode losses from core/line), its strips' launch pads as short lines;
 *  - ports: their reference impedance at the port node.
 * Junctions (design setting `junctions`, default 'modelled'; 'ideal' joins every arm at the junction centre):
 *  - tees (Hammerstad 1981, core/discontinuity/hammerstad1981TeeJunction.ts): each arm's line runs from its
 *    reference plane, which moves with frequency (d1, d2 at every sweep frequency from the arms' static Z0 and
 *    εeff), and the branch joins through the ideal transformer n(f); the junction susceptance is omitted. The
 *    three arm ends and the transformer form one n-port (junctionStar.ts) that takes a short piece of each arm's
 *    line; the layout already drew each arm's copper longer by its plane shift at f0;
 *  - in-line width steps (Garg & Bahl 1978): L1 – Cs – L2 at the step, each part only where its fit holds.
 * Crosses and junctions that are not a T have no model at hand: their arms join at the centre, a note says so.
 * A line folded back beside itself (a meander's legs, core/layout folds.ts): each leg's phase constant carries half of
 * the fold's coupling share at every frequency, the same share the ledger and equalize count (first order: the
 * coupling's phase; the small change of the legs' impedance it brings is not modelled). A caller's own `lineModel`
 * (the yield estimate's tabulated made boards) is used as given, without the share.
 * Mitered and square bends add nothing (project rule: the path is measured through the corner; no closed form
 * adopted).
 */
import { InputError } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';
import { lineModels as coreLineModels, type CoupledModeName, type LineModels, type LineOptions, type ModalFigures, type ModeFigures } from '../line/index.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { coupledPairYOfModes } from './coupledPair.ts';
import { lineConstantsOfMode, losslessConstantsOfMode } from './lineTwoPort.ts';
import { viaGround } from '../discontinuity/goldfarbPucel1991Via.ts';
import { prepareTee, teeJunction, teeShiftsInto, teeTurnsRatioSquared, TEE_SOURCE } from '../discontinuity/hammerstad1981TeeJunction.ts';
import { starAdmittance, starBuffers } from './junctionStar.ts';
import type { SizedDesign, SizedNode, SizedPiece } from '../layout/types.ts';
import { foldLegs, foldShareRad, type Fold } from '../layout/folds.ts';
import { GROUND, type LineModel, type NetElement, type NetPort, type Netlist } from './netlist.ts';
import { sparamsAdmittance } from './sparamsPart.ts';
import { namer } from '../design/names.ts';
import { objectId, type SweepValues } from './sweepValues.ts';

export interface FromSizedOptions {
  /** Line options; default: those the sizing used (`sized.lineOptions`, the as-made cross-section tables). */
  line?: LineOptions;
  /**
   * The line model of a piece's copper of `width` (its own line, taper sections, pads and its arm of a tee); default:
   * the line model on the design's substrate, memoised per width. The yield estimate (core/yield) passes tabulated
   * models of a made board, whose pieces may sit on slightly different laminate; checks that must feed an outside
   * library the very same values pass their own.
   */
  lineModel?: (width: number, piece: SizedPiece) => LineModel;
  /**
   * The line models of the line-model interface (core/line/line-model.ts) the pieces' lines and coupled pairs are
   * asked of; default those the design was sized with (`sized.lineModels`), else the core's set.
   */
  models?: LineModels;
  /** Drop conductor and dielectric loss from every line and coupled pair (a lossless copy, for checking a design
   * against its ideal response). Lumped parts and vias keep theirs. */
  lossless?: boolean;
  /**
   * Line constants kept across revisions (sweepValues.ts), by cross-section and frequency: a drag that changes
   * lengths asks the line model nothing new. The same numbers as without it.
   */
  values?: SweepValues;
}

export interface SizedNetlist extends Netlist {
  /** Index of the port the layout started from (the usual input), or 0. */
  input: number;
  warnings: Warning[];
}

export function netlistFromSized(sized: SizedDesign, given: FromSizedOptions = {}): SizedNetlist {
  // The sweep uses the lines the sizing used (a design sized as made carries its cross-section tables).
  const opts: FromSizedOptions = given.line || !sized.lineOptions ? given : { ...given, line: sized.lineOptions };
  if (sized.problems.length) {
    const p = sized.problems[0];
    throw new InputError('impossible-layout', p.subjects[0] ?? 'design', 'a design whose every piece can be sized', p.message,
      sized.problems.length > 1 ? `and ${sized.problems.length - 1} more problem(s)` : undefined);
  }
  const sub = sized.doc.substrate;
  const lineSet = modelsOf(sized, opts);
  const strip = lineSet.strip();
  const warnings: Warning[] = [];
  const elements: NetElement[] = [];
  const nodes = new Map(sized.nodes.map((n) => [n.id, n]));
  const pieces = new Map(sized.pieces.map((p) => [p.id, p]));
  const pads: PadContext = {
    nodes,
    padAcross: (node) => Math.max(0, ...(nodes.get(node)?.segments ?? []).map((id) => pieces.get(id)?.part?.footprint.padAcross ?? 0)),
  };

  // One memo per width: the sweep asks every piece at one frequency before the next, and pieces share widths.
  // Each model carries a key naming all its numbers depend on, so a sweep may keep its values across revisions.
  const sectionKey = `${objectId(lineSet)}|${JSON.stringify(sub)}|${lineOptionsKey(opts.line)}|${opts.lossless ? 'lossless' : 'lossy'}`;
  const models = new Map<number, LineModel>();
  const values = opts.values;
  const defaultModelFor = (width: number): LineModel => {
    let m = models.get(width);
    if (!m) {
      let lastF = NaN, last: ReturnType<LineModel> | null = null;
      const key = `${sectionKey}|w=${width}`;
      const compute = (f: number) => {
        const mode = strip.evaluate({ kind: 'microstrip', substrate: sub, width, options: opts.line }, f).modes.single;
        return opts.lossless ? losslessConstantsOfMode(mode) : lineConstantsOfMode(mode, f);
      };
      m = Object.assign((f: number) => {
        if (f !== lastF || !last) {
          last = values ? values.line(key, f, () => compute(f)) : compute(f);
          lastF = f;
        }
        return last;
      }, { key });
      models.set(width, m);
    }
    return m;
  };

  // The network node a piece's end attaches to; a width step or a tee moves the ends apart.
  const terminal = new Map<string, string>();
  const endNode = (piece: string, node: string) => terminal.get(`${piece}@${node}`) ?? node;
  // Line taken off a piece's network length by the junction n-ports at its ends, m.
  const trimmed = new Map<string, number>();

  for (const n of sized.nodes) {
    if (!n.step || !n.step.modelled) continue;
    const st = n.step;
    const w = `${n.id}~wide`, c = `${n.id}~step`, nn = `${n.id}~narrow`;
    terminal.set(`${st.wide}@${n.id}`, w);
    terminal.set(`${st.narrow}@${n.id}`, nn);
    elements.push({ kind: 'inductor', id: `${n.id}:step-L1`, a: w, b: c, value: st.lValid ? st.L1 : 0 });
    if (st.cValid) elements.push({ kind: 'capacitor', id: `${n.id}:step-Cs`, a: c, b: GROUND, value: st.Cs });
    elements.push({ kind: 'inductor', id: `${n.id}:step-L2`, a: c, b: nn, value: st.lValid ? st.L2 : 0 });
    // The step's nominal node still exists for anything else attached there (nothing, at a vertex): join it.
    elements.push({ kind: 'line', id: `${n.id}:step-join`, a: n.id, b: c, length: 0, model: defaultModelFor(1e-3) });
  }

  const pieceModel = (p: SizedPiece): LineModel => (opts.lineModel ? opts.lineModel(p.width, p) : defaultModelFor(p.width));
  teeElements(sized, pieces, pieceModel, terminal, trimmed, elements, warnings, sub.h);
  const pairKey = `${objectId(lineSet)}|${JSON.stringify(sub)}|${opts.lossless ? 'lossless' : 'lossy'}`;

  // A caller's own line models are used as given (no fold share): their folds need not be found.
  const legs = opts.lineModel ? new Map<string, Fold[]>() : foldLegs(sized);
  for (const p of sized.pieces) {
    const a = endNode(p.id, p.a), b = endNode(p.id, p.b);
    const custom = opts.lineModel;
    const modelFor = custom ? (w: number) => custom(w, p) : defaultModelFor;
    switch (p.kind) {
      case 'line': {
        const [a1, b1] = padsAround(p, a, b, pads, elements, modelFor);
        const length = Math.max(0, p.length - (trimmed.get(p.id) ?? 0));
        const folds = legs.get(p.id);
        elements.push({ kind: 'line', id: p.id, a: a1, b: b1, length, model: folds && length > 0 && !custom ? withFoldShare(modelFor(p.width), sub, folds, length) : modelFor(p.width) });
        break;
      }
      case 'taper': {
        const secs = p.sections ?? [];
        if (secs.length === 0) throw new InputError('impossible-layout', p.id, 'a taper with sections from the layout', 'none');
        const [a1, b1] = padsAround(p, a, b, pads, elements, modelFor);
        // The layout's sections sum to the nominal length; scale them to the modelled length (end cuts applied).
        const total = secs.reduce((s, x) => s + x.length, 0);
        const k = total > 0 ? p.length / total : 1;
        secs.forEach((s, i) => {
          elements.push({ kind: 'line', id: `${p.id}#${i}`, a: i === 0 ? a1 : `${p.id}#${i - 1}`, b: i === secs.length - 1 ? b1 : `${p.id}#${i}`, length: s.length * k, model: modelFor(s.width) });
        });
        break;
      }
      case 'lumped': {
        const part = p.part;
        if (!part) throw new InputError('impossible-layout', p.id, 'a lumped part with its value', 'none');
        elements.push({ kind: part.part, id: p.id, a, b, value: part.value });
        break;
      }
      case 'coupled': {
        // The pair is one four-port, emitted with its first strip (coupledPair.ts); the second strip adds nothing.
        const pair = p.pair;
        if (!pair) throw new InputError('impossible-layout', p.id, 'a coupled strip with its pair data', 'none');
        if (pair.strip !== 1) break;
        const p2 = pieces.get(pair.partner);
        if (!p2) throw new InputError('impossible-layout', p.id, `the second strip ${pair.partner} of the pair`, 'none');
        let [a1, b1] = padsAround(p, a, b, pads, elements, modelFor);
        let [c1, d1] = padsAround(p2, endNode(p2.id, p2.a), endNode(p2.id, p2.b), pads, elements, modelFor);
        // The strips overlap where neither is cut; the strip cut less at an end runs on alone there as a plain line.
        const { overlap, alone: runs } = pairRuns(p, p2);
        const alone = (from: string, extra: number, tag: string): string => {
          if (extra <= 1e-12) return from;
          const inner = `${p.id}~${tag}`;
          elements.push({ kind: 'line', id: `${p.id}:${tag}`, a: from, b: inner, length: extra, model: modelFor(pair.width) });
          return inner;
        };
        a1 = alone(a1, runs.a, 'alone-a'); b1 = alone(b1, runs.b, 'alone-b');
        c1 = alone(c1, runs.c, 'alone-c'); d1 = alone(d1, runs.d, 'alone-d');
        const disp = opts.line?.dispersion === 'none' ? 0 : 1;
        elements.push({ kind: 'nport', id: p.id, nodes: [a1, b1, c1, d1], y: pairModel(lineSet, sub, pair.width, pair.gap, overlap, disp, opts.lossless === true), key: `pair|${pairKey}|${pair.width}|${pair.gap}|${overlap}|${disp}` });
        break;
      }
      case 'sparams': {
        const sp = p.sparams;
        if (!sp) throw new InputError('impossible-layout', p.id, 'an S-parameter block with its data', 'none');
        const blk = sparamsAdmittance(sp.touchstone, sp.name, `segments.${p.id}.touchstone`);
        elements.push({ kind: 'nport', id: p.id, nodes: blk.ports === 1 ? [a] : [a, b], y: blk.y });
        if (blk.ports === 1) warnings.push(warn('note', `${p.id}: a 1-port data block terminates node ${p.a}; its other end ${p.b} is left open`, { subjects: [p.id], severity: 'info' }));
        break;
      }
    }
  }

  const ports: NetPort[] = [];
  const name = namer(sized.doc);
  for (const n of sized.nodes) {
    if (n.kind === 'port' && n.port) ports.push({ name: n.id, node: n.id, zRef: n.port.zRef, ...(name(n.id) !== n.id ? { label: name(n.id) } : {}) });
    if (n.kind === 'open' && n.open && n.open.capacitance > 0) {
      elements.push({ kind: 'capacitor', id: `${n.id}:open-end`, a: onlyTerminal(n, endNode), b: GROUND, value: n.open.capacitance });
    }
    if (n.kind === 'short') {
      if (!n.via) throw new InputError('impossible-layout', n.id, 'a short with its via data from the layout', 'none');
      const v = n.via, h = sub.h, rho = 1 / sub.sigma;
      elements.push({
        kind: 'series-rl', id: `${n.id}:via`, a: onlyTerminal(n, endNode), b: GROUND, l: v.L,
        r: (f) => viaGround({ h, drill: v.drill, count: v.count, f, rho, ...(v.plating !== undefined ? { plating: v.plating } : {}) }).R,
      });
    }
    // What the sizing found no model for (crosses, junctions not in a T, steps at bends or outside their fits).
    for (const w of n.warnings) if (w.code === 'advisory-model') warnings.push(w);
    if (n.tee && !n.tee.modelled) warnings.push(warn('note', `tee ${n.id}: ideal junction (chosen for comparison); arms are joined at the junction centre`, { source: TEE_SOURCE, subjects: [n.id], severity: 'info' }));
  }
  if (ports.length === 0) throw new InputError('singular-network', 'nodes', 'at least one port node in the design', 'none', 'add a port where the network is fed');
  // The input is the one the user chose for the first phase group (path ledger), else the anchor port.
  const chosen = sized.doc.phaseGroups?.[0]?.from;
  const byGroup = chosen === undefined ? -1 : ports.findIndex((p) => p.node === chosen);
  const input = byGroup >= 0 ? byGroup : Math.max(0, ports.findIndex((p) => p.node === sized.anchor));
  // S-parameters number from the input (port 1), then the other ports in the order they were drawn: choosing another
  // input in the path ledger renumbers them, so S21 always reads "from the input to the first output".
  const numbered = [ports[input]!, ...ports.filter((_, k) => k !== input)];
  return { elements, ports: numbered, input: 0, warnings };
}

/** A leg's line model with half of each of its folds' coupling share added to β over the leg's length. */
function withFoldShare(base: LineModel, sub: SubstrateSpec, folds: readonly Fold[], length: number): LineModel {
  const model = (f: number) => {
    const c = base(f);
    let extra = 0;
    for (const fold of folds) extra += foldShareRad(sub, fold, f) / 2;
    return { zc: c.zc, gamma: { re: c.gamma.re, im: c.gamma.im + extra / length } };
  };
  return base.key === undefined ? model : Object.assign(model, { key: `${base.key}|folds=${JSON.stringify(folds)}|${length}` });
}

/** The line options as text for keys: the models chosen and the cross-section source's own key. */
function lineOptionsKey(o: LineOptions | undefined): string {
  return `${o?.dispersion ?? ''}|${o?.conductorLoss ?? ''}|${o?.crossSection?.key ?? ''}`;
}

/**
 * The line model's own warnings at the top of a sweep, once per copper width: validity ranges of the published
 * fits and the higher-order-mode / surface-wave thresholds (the validity ranges printed with Hammerstad & Jensen 1980 and Kirschning & Jansen 1982; the usual TE1/surface-wave cut-off estimates, Pozar, Microwave Engineering 4th ed., §3.6 (surface waves on a grounded dielectric sheet), from memory), so a sweep that runs past where
 * the quasi-TEM model holds says so. Warnings are deduplicated by message and name the pieces.
 */
export function sweepRangeWarnings(sized: SizedDesign, fStop: number, opts: FromSizedOptions = {}): Warning[] {
  const byWidth = new Map<number, string[]>();
  for (const p of sized.pieces) {
    if (p.kind !== 'line' && p.kind !== 'taper' && p.kind !== 'coupled') continue;
    const widths = p.kind === 'taper' && p.sections ? p.sections.map((x) => x.width) : [p.width];
    for (const w of widths) { const l = byWidth.get(w) ?? []; if (!l.includes(p.id)) l.push(p.id); byWidth.set(w, l); }
  }
  const out = new Map<string, Warning>();
  const models = modelsOf(sized, opts);
  for (const [w, ids] of byWidth) {
    let ws: Warning[];
    try { ws = models.strip().evaluate({ kind: 'microstrip', substrate: sized.doc.substrate, width: w, options: opts.line }, fStop).warnings; } catch (e) {
      if (e instanceof InputError) {
        ws = [{ code: 'higher-order-mode', severity: 'error', message: `at ${fStop / 1e9} GHz the line model refuses width ${(w * 1e3).toFixed(3)} mm: ${e.message}` }];
      } else throw e;
    }
    for (const x of ws) {
      if (x.severity === 'info') continue;
      const prev = out.get(x.message);
      const subjects = [...(prev?.subjects ?? []), ...ids];
      out.set(x.message, { ...x, subjects, message: x.message });
    }
  }
  return [...out.values()].map((x) => ({ ...x, message: `${x.message} (top of the sweep, ${fStop / 1e9} GHz; pieces ${(x.subjects ?? []).slice(0, 6).join(', ')}${(x.subjects ?? []).length > 6 ? ', …' : ''})` }));
}

/**
 * Where a pair's strips run together and alone: they overlap where neither is cut (nominal length less the larger cut
 * at each end); the strip cut less at an end runs on alone there as a plain line of its width (terminals a, b of the
 * first strip, c, d of the second). One place for the network and for the build report (`build --json`).
 */
export function pairRuns(p: SizedPiece, p2: SizedPiece): { overlap: number; alone: { a: number; b: number; c: number; d: number } } {
  const c1s = p.pair?.cuts ?? { near: 0, far: 0 }, c2s = p2.pair?.cuts ?? { near: 0, far: 0 };
  const near = Math.max(c1s.near, c2s.near), far = Math.max(c1s.far, c2s.far);
  const overlap = p.nominalLength - near - far;
  if (!(overlap > 0)) throw new InputError('impossible-layout', p.id, 'a coupled pair whose strips still overlap after their end corrections', `${(overlap * 1e3).toFixed(3)} mm of overlap`);
  return { overlap, alone: { a: near - c1s.near, b: far - c1s.far, c: near - c2s.near, d: far - c2s.far } };
}

/** A pair's even and odd mode figures at `f` as the sweep takes them (the sized design's line models, Getsinger dispersion unless `dispersion` is 'none'). */
export function pairModesAt(sized: SizedDesign, p: SizedPiece, f: number, opts: FromSizedOptions = {}): ModalFigures<CoupledModeName> {
  const pair = p.pair;
  if (!pair) throw new InputError('impossible-layout', p.id, 'a coupled strip with its pair data', 'none');
  const section = { kind: 'coupled-microstrip', substrate: sized.doc.substrate, width: pair.width, gap: pair.gap, options: { dispersion: opts.line?.dispersion === 'none' ? 'none' : 'getsinger' } } as const;
  return modelsOf(sized, opts).evaluate(section, f) as ModalFigures<CoupledModeName>;
}

/** What the sweep takes of a coupled pair (its first strip `p`): runs, and mode figures at the design band's edges and f0. */
export interface PairNetworkFigures {
  partner: string; width: number; gap: number; overlap: number; alone: { a: number; b: number; c: number; d: number };
  modes: { f: number; even: PairModeFigures; odd: PairModeFigures }[];
}
export interface PairModeFigures { z0: number; epsEff: number; alphaC: number; alphaD: number }

/**
 * The pair's figures as the sweep uses them, for the build report: an outside rebuild of the network (a reference
 * test) takes them from there, so it checks the network and not the line model. Modes at the band's start, f0 and
 * its stop (smooth in f: a rebuild may interpolate between them). Undefined for a second strip or a plain piece.
 */
export function pairNetworkFigures(sized: SizedDesign, p: SizedPiece): PairNetworkFigures | undefined {
  if (p.kind !== 'coupled' || !p.pair || p.pair.strip !== 1) return undefined;
  const p2 = sized.pieces.find((x) => x.id === p.pair!.partner);
  if (!p2) return undefined;
  const { overlap, alone } = pairRuns(p, p2);
  const band = sized.doc.frequency.band;
  const fs = [...new Set([Math.min(band.start, sized.f0), sized.f0, Math.max(band.stop, sized.f0)])];
  const pick = (m: ModeFigures): PairModeFigures => ({ z0: m.z0, epsEff: m.epsEff, alphaC: m.alphaC, alphaD: m.alphaD });
  const modes = fs.map((f) => { const r = pairModesAt(sized, p, f); return { f, even: pick(r.modes.even), odd: pick(r.modes.odd) }; });
  return { partner: p.pair.partner, width: p.pair.width, gap: p.pair.gap, overlap, alone, modes };
}

/** A coupled pair's four-port at each frequency: even and odd modes from the line-model interface, then coupledPairY. */
function pairModel(models: LineModels, sub: SubstrateSpec, width: number, gap: number, length: number, disp: 0 | 1, lossless: boolean): (f: number) => Float64Array {
  const section = { kind: 'coupled-microstrip', substrate: sub, width, gap, options: { dispersion: disp === 1 ? 'getsinger' : 'none' } } as const;
  return (f) => coupledPairYOfModes(models.evaluate(section, f) as ModalFigures<CoupledModeName>, length, lossless);
}

/** The line models a netlist asks: the caller's, else those the design was sized with, else the core's. */
function modelsOf(sized: SizedDesign, opts: FromSizedOptions): LineModels {
  return opts.models ?? sized.lineModels ?? coreLineModels;
}

function onlyTerminal(n: SizedNode, endNode: (piece: string, node: string) => string): string {
  return n.segments.length === 1 ? endNode(n.segments[0], n.id) : n.id;
}

/**
 * Pads the layout cut off a line's ends (lumped-part pads, edge-launch pads) come back as short lines of the pad
 * width between the node and the line. Returns the line's own end nodes.
 */
function padsAround(p: SizedPiece, a: string, b: string, ctx: PadContext, out: NetElement[], modelFor: (w: number) => LineModel): [string, string] {
  const ends: [string, string] = [a, b];
  for (const [k, node] of [[0, p.a], [1, p.b]] as const) {
    const cuts = p.compensations.filter((c) => c.applied && c.node === node && (c.model === 'lumped-pad' || c.model === 'launch-pad') && c.amount_m > 0);
    let prev = ends[k];
    cuts.forEach((c, i) => {
      const width = Math.max(p.width, c.model === 'launch-pad' ? (ctx.nodes.get(node)?.port?.launch?.padWidth ?? 0) : ctx.padAcross(node));
      const inner = `${p.id}@${node}~pad${i}`;
      out.push({ kind: 'line', id: `${p.id}:${c.model}@${node}#${i}`, a: prev, b: inner, length: c.amount_m, model: modelFor(width) });
      prev = inner;
    });
    ends[k] = prev;
  }
  return ends;
}

interface PadContext {
  nodes: Map<string, SizedNode>;
  /** Width across the path of the widest part pad at a node (0 when none), m. */
  padAcross: (node: string) => number;
}

/**
 * Each modelled tee as one n-port (junctionStar.ts) over its three arm ends. Arm k keeps a_k = s_k + m_k of its
 * piece's line: s_k its largest (static, f → 0) plane shift, m_k a margin of min(W, a quarter of what the piece
 * has left), so the n-port's arm line a_k − d_k(f) stays ≥ m_k > 0 at every frequency (d1 and d2 only shrink as f
 * rises). The piece's own line element is shortened by a_k.
 */
function teeElements(
  sized: SizedDesign, pieces: Map<string, SizedPiece>, pieceModel: (p: SizedPiece) => LineModel, terminal: Map<string, string>,
  trimmed: Map<string, number>, elements: NetElement[], warnings: Warning[], h: number,
): void {
  const tees = sized.nodes.filter((n) => n.tee && n.tee.modelled);
  const statics = new Map<string, number[]>();
  const reserve = new Map<string, number>();
  for (const n of tees) {
    const t = n.tee!;
    const z = teeJunction({ main: t.arms.main, branch: t.arms.branch, h, f: 0 });
    const s = [Math.max(0, z.d1[0]), Math.max(0, z.d1[1]), Math.max(0, z.d2)];
    statics.set(n.id, s);
    [t.main[0], t.main[1], t.branch].forEach((id, k) => reserve.set(id, (reserve.get(id) ?? 0) + s[k]!));
  }
  for (const n of tees) {
    const t = n.tee!;
    const ids = [t.main[0], t.main[1], t.branch];
    const s = statics.get(n.id)!;
    const keep = ids.map((id, k) => {
      const p = pieces.get(id)!;
      const left = p.length - (reserve.get(id) ?? 0);
      if (!(left > 0)) throw new InputError('impossible-layout', id, 'a piece longer than the reference-plane shifts of the tees at its ends', `${(p.length * 1e3).toFixed(3)} mm`, 'lengthen it or choose ideal junctions');
      return s[k]! + Math.min(p.width, 0.25 * left);
    });
    const nodes = ids.map((id, k) => {
      const inner = `${id}@${n.id}~tee`;
      terminal.set(`${id}@${n.id}`, inner);
      trimmed.set(id, (trimmed.get(id) ?? 0) + keep[k]!);
      return inner;
    });
    const arms = ids.map((id) => ({ model: pieceModel(pieces.get(id)!) }));
    const armKeys = arms.map((a) => a.model.key);
    // Everything y(f) below reads: the arms' lines, the kept lengths and the junction's own figures.
    const key = armKeys.every((k) => k !== undefined) ? `tee|${JSON.stringify(t.arms)}|${h}|${keep.join(',')}|${armKeys.join('§')}` : undefined;
    const where = `nodes.${n.id}`;
    const planes = new Float64Array(4);
    const prep = prepareTee(t.arms.main, t.arms.branch, h);
    const state = { lengths: [0, 0, 0], n: [1, 1, 1] };
    const buf = starBuffers(3);
    elements.push({
      kind: 'nport', id: `${n.id}:tee`, nodes, ...(key !== undefined ? { key } : {}),
      y: (f) => {
        teeShiftsInto(prep, f, planes);
        state.lengths[0] = keep[0]! - planes[0]!; state.lengths[1] = keep[1]! - planes[1]!; state.lengths[2] = keep[2]! - planes[2]!;
        state.n[2] = Math.sqrt(teeTurnsRatioSquared(planes[3]!, f, where));
        return starAdmittance(arms, state, f, buf);
      },
    });
    warnings.push(warn('note', `tee ${n.id}: Hammerstad 1981 reference planes and branch transformer at every frequency; junction susceptance omitted`, { source: TEE_SOURCE, subjects: [n.id], severity: 'info' }));
  }
}
