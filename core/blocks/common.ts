/** What the block generators share: the substrate and process of the design they make, and placing it as sized. */
import type { DesignDoc, FabProcess, SubstrateSpec } from '../design/types.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { cutWidth } from '../layout/checks.ts';
import { couplingAtGap } from '../line/index.ts';
import { InputError } from '../util/errors.ts';

export interface BlockBase {
  /** Design name (a default names the block). */
  name?: string;
  /** Laminate; every field not given takes the new-design default (glass-epoxy FR-4 1.6 mm). */
  substrate?: Partial<SubstrateSpec>;
  process?: FabProcess;
  /** Centre frequency, Hz. */
  f0: number;
  /** System impedance of the ports, Ω (default 50). */
  z0?: number;
  /** Length of the port lines, m (default 3·h, at least 2 mm). */
  feedLength?: number;
}

/** The drawn positions of a generated block moved to where sizing places them, so the sketch and the board agree. */
export function drawAsPlaced(doc: DesignDoc): void {
  const sized = sizeDesign(doc);
  if (sized.problems.length) {
    const p = sized.problems[0]!;
    throw new InputError('impossible-layout', p.subjects[0] ?? 'block', 'a block that can be laid out', p.message);
  }
  const pos = new Map(sized.nodes.map((n) => [n.id, n.pos]));
  for (const n of doc.nodes) {
    const p = pos.get(n.id);
    if (p && Number.isFinite(p.x) && Number.isFinite(p.y)) n.at = { x: round(p.x), y: round(p.y) };
  }
}

/** 1 nm: the design file's drawn positions need no more (export rounds to 1 nm too). */
function round(x: number): number { return Math.round(x * 1e9) / 1e9; }

/**
 * Refuses a gap the process cannot cut, saying the tightest coupling it can make at that impedance level.
 * `what` names the section; `z0` is its √(Z0e·Z0o); `wantDb` the coupling it needs.
 */
export function requireCuttableGap(gap: number, sub: SubstrateSpec, process: FabProcess, z0: number, wantDb: number, field: string, what: string, fix: string): void {
  const cut = cutWidth(process);
  if (gap >= cut) return;
  const best = couplingAtGap(sub.er, z0, cut / sub.h);
  throw new InputError('out-of-range', field,
    `a coupling the process can cut: its narrowest gap is ${(cut * 1e3).toFixed(3)} mm, where the tightest coupling at ${z0.toFixed(1)} Ω on this substrate is ${best ? best.couplingDb.toFixed(2) : '(beyond the model)'} dB`,
    `${what} needs ${wantDb.toFixed(2)} dB, a gap of ${(gap * 1e3).toFixed(3)} mm`, fix);
}
