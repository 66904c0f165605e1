/** What the block generators share: the substrate and process of the design they make, and placing it as sized. */
import type { DesignDoc, FabProcess, SubstrateSpec } from '../design/types.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { cutWidth } from '../layout/checks.ts';
import { couplingAtGap } from '../line/index.ts';
import { InputError, describe } from '../util/errors.ts';

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
export function requireCuttableGap(gap: number, sub: SubstrateSpec, fab: FabProcess, z0: number, wantDb: number, field: string, what: string, fix: string): void {
  const cut = processCutWidth(fab);
  if (gap >= cut) return;
  const best = couplingAtGap(sub.er, z0, cut / sub.h);
  throw new InputError('out-of-range', field,
    `a coupling the process can cut: its narrowest gap is ${(cut * 1e3).toFixed(3)} mm, where the tightest coupling at ${z0.toFixed(1)} Ω on this substrate is ${best ? best.couplingDb.toFixed(2) : '(beyond the model)'} dB`,
    `${what} needs ${wantDb.toFixed(2)} dB, a gap of ${(gap * 1e3).toFixed(3)} mm`, fix);
}

/** What each process kind's cut is made of (the fields cutWidth reads), with what each must be. */
/** The design file's field name of the fabrication process, kept in a constant: the dependency rule reads that word before a dot as the host's global. */
const PROCESS_FIELD = 'process';

const CUT_FIELDS: Record<string, { field: string; expected: string; ok: (v: number) => boolean }[]> = {
  'end-mill': [{ field: 'toolDiameter', expected: 'the end mill\'s diameter, a length above 0 (e.g. 0.8 mm)', ok: (v) => v > 0 }],
  'v-bit': [
    { field: 'tipWidth', expected: 'the V-bit\'s tip width, a length of 0 or more (e.g. 0.1 mm)', ok: (v) => v >= 0 },
    { field: 'depth', expected: 'the cutting depth, a length above 0 (e.g. 0.1 mm)', ok: (v) => v > 0 },
    { field: 'angleDeg', expected: 'the V-bit\'s angle in degrees, above 0 and below 180 (e.g. 30)', ok: (v) => v > 0 && v < 180 },
  ],
  etch: [
    { field: 'minFeature', expected: 'the narrowest gap the etch resolves, a length above 0 (e.g. 0.15 mm)', ok: (v) => v > 0 },
    { field: 'edgeBias', expected: 'the etch bias per edge, a length (0 when not known)', ok: () => true },
  ],
};

/**
 * The process's cut width, m, refusing a process whose fields do not give one (a hand-edited or malformed file):
 * the field, what it must be, what was found and how to fix it, instead of a NaN in a coupling message.
 */
export function processCutWidth(fab: FabProcess): number {
  const fields = CUT_FIELDS[(fab as { kind?: unknown }).kind as string];
  if (!fields) {
    throw new InputError('bad-choice', `${PROCESS_FIELD}.kind`, `a process kind: ${Object.keys(CUT_FIELDS).join(', ')}`, describe((fab as { kind?: unknown }).kind), 'choose the process again in the Process panel (or give --min-gap or --end-mill)');
  }
  for (const f of fields) {
    const v = (fab as unknown as Record<string, unknown>)[f.field];
    if (typeof v !== 'number' || !Number.isFinite(v) || !f.ok(v)) {
      throw new InputError('invalid-number', `${PROCESS_FIELD}.${f.field}`, `${f.expected} for a ${fab.kind} process`, describe(v), `set the ${fab.kind} process's ${f.field} in the Process panel (or give --min-gap or --end-mill), then make the block again`);
    }
  }
  const cut = cutWidth(fab);
  if (!(Number.isFinite(cut) && cut > 0)) throw new InputError('out-of-range', PROCESS_FIELD, `a ${fab.kind} process that cuts a gap wider than 0`, `a cut of ${describe(cut)} m`, 'check the tool size and depth in the Process panel');
  return cut;
}
