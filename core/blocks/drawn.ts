/**
 * Placing a generated block where sizing puts it, so the drawing and the board agree, and closing the loops that
 * cannot close by symmetry: a part across a loop (a Wilkinson resistor) is drawn between where sizing put its two
 * ends, so its span closes the loop exactly.
 */
import type { DesignDoc, DesignSegment, Target } from '../design/types.ts';
import { tracePaths } from '../layout/paths.ts';
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
