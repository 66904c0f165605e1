/**
 * Placing a generated block where sizing puts it, so the drawing and the board agree, and closing the loops that
 * cannot close by symmetry: a part across a loop (a Wilkinson resistor) is drawn between where sizing put its two
 * ends, so its span closes the loop exactly.
 */
import type { DesignDoc, DesignSegment, Target } from '../design/types.ts';
import { tracePaths } from '../layout/paths.ts';
import { netlistFromSized } from '../network/fromSized.ts';
import { solveNetwork } from '../network/sweep.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { InputError } from '../util/errors.ts';

/** Sizes `doc` and moves every node to its placed position (1 nm); refuses when sizing reports a problem. */
export function placeAsSized(doc: DesignDoc, kind: string): void {
  const sized = sizeDesign(doc);
  if (sized.problems.length) {
    const p = sized.problems[0]!;
    throw new InputError('impossible-layout', `${kind}`, 'a block that can be laid out', p.message, 'change the parameters named in the message (a longer feed or a wider pitch often helps)');
  }
  const pos = new Map(sized.nodes.map((n) => [n.id, n.pos]));
  for (const n of doc.nodes) {
    const p = pos.get(n.id);
    if (p && Number.isFinite(p.x) && Number.isFinite(p.y)) n.at = { x: nm(p.x), y: nm(p.y) };
  }
}

/** Adds loop-closing parts after the tree is placed: their drawn span is the distance sizing left between their ends. */
export function closeWith(doc: DesignDoc, kind: string, parts: DesignSegment[]): void {
  placeAsSized(doc, kind);
  // The parts' ends were bends of the tree; with the part they join three pieces.
  const ends = new Set(parts.flatMap((p) => [p.a, p.b]));
  doc.nodes = doc.nodes.map((n) => (ends.has(n.id) && n.kind === 'vertex' ? { id: n.id, kind: 'junction', at: n.at, ...(n.label ? { label: n.label } : {}) } : n));
  doc.segments.push(...parts);
  placeAsSized(doc, kind);
}

const nm = (x: number) => Math.round(x * 1e9) / 1e9;

/** A part across a loop and the two arms whose leg split (degrees moved from the second leg to the first) sets its span. */
export interface SpanFit { part: DesignSegment; arms: [[string, string], [string, string]]; span: number }

/**
 * Moves electrical length between the two legs of each arm (their sum, so the arm's phase, is kept) until the arm
 * ends sit exactly the part's span apart, then adds the parts (closeWith). A secant iteration per part; parts in
 * different subtrees do not disturb each other.
 */
export function fitSpans(doc: DesignDoc, kind: string, fits: SpanFit[]): void {
  fitOnce(doc, kind, fits);
  // The arms' copper stops at the resistor pads, which shortens them electrically (sizing's 'lumped-pad'
  // compensation): give each arm's second leg those degrees back, then fit the spans again.
  const sized = sizeDesign(doc);
  const extra = new Map<string, number>();
  for (const f of fits) for (const [, l2] of f.arms) {
    const p = sized.pieces.find((x) => x.id === l2);
    const pad = p ? p.compensations.filter((c) => c.model === 'lumped-pad' && c.applied).reduce((a, c) => a + c.amount_m, 0) : 0;
    if (p && pad > 0 && p.nominalLength > 0) extra.set(l2, (pad * p.effectiveDeg) / p.nominalLength);
  }
  if (!extra.size) return;
  const partIds = new Set(fits.map((f) => f.part.id));
  const ends = new Set(fits.flatMap((f) => [f.part.a, f.part.b]));
  doc.segments = doc.segments.filter((x) => !partIds.has(x.id));
  doc.nodes = doc.nodes.map((n) => (ends.has(n.id) && n.kind === 'junction' ? { id: n.id, kind: 'vertex', bend: { style: 'miter-optimal' }, at: n.at, ...(n.label ? { label: n.label } : {}) } : n));
  for (const x of doc.segments) {
    const e = extra.get(x.id);
    if (e !== undefined && x.kind === 'line' && x.length.by === 'degrees') x.length = { by: 'degrees', deg: x.length.deg + e };
  }
  fitOnce(doc, kind, fits);
}

function fitOnce(doc: DesignDoc, kind: string, fits: SpanFit[]): void {
  const seg = (id: string) => doc.segments.find((s) => s.id === id)!;
  const move = (f: SpanFit, by: number) => {
    for (const [l1, l2] of f.arms) {
      const a = seg(l1), b = seg(l2);
      if (a.kind !== 'line' || b.kind !== 'line' || a.length.by !== 'degrees' || b.length.by !== 'degrees') continue;
      a.length = { by: 'degrees', deg: a.length.deg + by };
      b.length = { by: 'degrees', deg: b.length.deg - by };
    }
  };
  const miss = () => {
    const sized = sizeDesign(doc);
    if (sized.problems.length) throw new InputError('impossible-layout', kind, 'a block that can be laid out', sized.problems[0]!.message, 'change the parameters named in the message');
    const pos = new Map(sized.nodes.map((n) => [n.id, n.pos]));
    return fits.map((f) => { const p = pos.get(f.part.a)!, q = pos.get(f.part.b)!; return Math.hypot(p.x - q.x, p.y - q.y) - f.span; });
  };
  let prevS = fits.map(() => 0), prevM = miss();
  // First step: a few degrees per millimetre of miss (any start works; the secant refines it).
  let s = prevM.map((m) => -m * 1e3 * 4);
  fits.forEach((f, i) => move(f, s[i]!));
  for (let it = 0; it < 8; it++) {
    const m = miss();
    if (m.every((x) => Math.abs(x) < 2e-8)) break;
    const next = s.map((si, i) => {
      const d = m[i]! - prevM[i]!;
      return Math.abs(d) < 1e-15 ? si : si - (m[i]! * (si - prevS[i]!)) / d;
    });
    fits.forEach((f, i) => move(f, next[i]! - s[i]!));
    prevS = s; prevM = m; s = next;
  }
  closeWith(doc, kind, fits.map((f) => f.part));
}

/**
 * Targets on the level of each output: the ideal split less the line loss of its path at f0 (the path report of
 * core/layout/paths.ts, from the same line model as the sweep), within −0.3/+0.2 dB.
 */
export function levelTargets(doc: DesignDoc, from: string, outs: string[], idealDb: number[], band: { start: number; stop: number }): Target[] {
  const rep = tracePaths(sizeDesign(doc), from, outs, { sensitivities: false });
  return outs.map((o, i) => {
    const loss = rep.paths.find((p) => p.to === o)?.lossDb ?? 0;
    const want = idealDb[i]! - loss;
    return { id: `level-${o}`, name: `${o} level (ideal less ${loss.toFixed(2)} dB of line loss)`, figure: 'transmission', ports: [from, o], band, limit: { min: +(want - 0.3).toFixed(2), max: +(want + 0.2).toFixed(2) } };
  });
}

/**
 * Lengthens the port line of every path but the longest by the phase it lacks at f0 (the path report of
 * core/layout/paths.ts, with the junction and bend models the sweep uses), so the paths match by construction.
 * `lineOf(port)` names the port line; it must be a line given by length or degrees. Returns the largest addition, m.
 */
export function matchPaths(doc: DesignDoc, kind: string, from: string, outs: string[], lineOf: (port: string) => string): number {
  let most = 0;
  for (let pass = 0; pass < 2; pass++) {
    const sized = sizeDesign(doc);
    const report = tracePaths(sized, from, outs, { sensitivities: false });
    const top = Math.max(...report.paths.map((p) => p.degAtF0));
    for (const p of report.paths) {
      const lack = top - p.degAtF0;
      if (lack < 1e-9) continue;
      const seg = doc.segments.find((x) => x.id === lineOf(p.to));
      const piece = sized.pieces.find((x) => x.id === lineOf(p.to));
      if (!seg || !piece || seg.kind !== 'line' || seg.length.by === 'drawn' || !(piece.nominalLength > 0)) continue;
      const degPerM = piece.effectiveDeg / piece.nominalLength;
      const now = seg.length.by === 'degrees' ? seg.length.deg : seg.length.length * degPerM;
      seg.length = { by: 'degrees', deg: Math.round((now + lack) * 1e9) / 1e9 };
      most = Math.max(most, lack / degPerM);
    }
    placeAsSized(doc, kind);
  }
  return most;
}

/**
 * Like matchPaths, but with the swept transmission phases at f0 (lossless copy, the sweep's own junction models),
 * for blocks whose paths meet junctions the path report cannot see into (the arm ends of an unequal Wilkinson).
 */
export function matchPhases(doc: DesignDoc, kind: string, from: string, outs: string[], lineOf: (port: string) => string): void {
  for (let pass = 0; pass < 3; pass++) {
    const sized = sizeDesign(doc);
    const r = solveNetwork(netlistFromSized(sized, { lossless: true }), new Float64Array([doc.frequency.f0]));
    const P = r.ports.length, j = r.ports.findIndex((p) => p.name === from);
    const ph = outs.map((o) => { const i = r.ports.findIndex((p) => p.name === o), t = 2 * (i * P + j); return (Math.atan2(r.s[t + 1]!, r.s[t]!) * 180) / Math.PI; });
    const wrap = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;
    // The most delayed output (smallest phase) sets the reference; the others lengthen by what they lead.
    const ref = ph.reduce((a, b) => (wrap(b - a) < 0 ? b : a));
    let moved = false;
    outs.forEach((o, k) => {
      const lead = wrap(ph[k]! - ref);
      if (lead < 1e-4) return;
      const seg = doc.segments.find((x) => x.id === lineOf(o));
      const piece = sized.pieces.find((x) => x.id === lineOf(o));
      if (!seg || !piece || seg.kind !== 'line' || seg.length.by === 'drawn' || !(piece.nominalLength > 0)) return;
      const now = seg.length.by === 'degrees' ? seg.length.deg : (seg.length.length * piece.effectiveDeg) / piece.nominalLength;
      seg.length = { by: 'degrees', deg: Math.round((now + lead) * 1e9) / 1e9 };
      moved = true;
    });
    placeAsSized(doc, kind);
    if (!moved) break;
  }
}
