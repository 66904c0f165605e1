/**
 * Junctions in sizing: which arms of a three-way junction form a T, the tee's reference-plane shifts as length
 * corrections on its arms, and the report of junctions that have no model (crosses, Y-shaped splits).
 *
 * A T is two arms in line (within 10°) and a branch perpendicular to them (within 10°) — the geometry of the
 * Hammerstad 1981 model (core/discontinuity/hammerstad1981TeeJunction.ts). Anything else is joined at its centre and
 * reported as unmodelled: no published model is at hand for it.
 */
import type { JunctionChoice } from '../design/types.ts';
import type { Vec2 } from '../geometry/types.ts';
import type { LineAt } from '../line/index.ts';
import { teeJunction, TEE_CITATION, TEE_F_LIMIT, TEE_SOURCE, type TeeArm } from '../discontinuity/hammerstad1981TeeJunction.ts';
import { shiftResidual, transformerResidual } from '../discontinuity/junctionResidual.ts';
import { warn, type Warning } from '../util/warnings.ts';
import { dot } from './copper.ts';
import type { Compensation, SizedNode } from './types.ts';

/** Largest departure from a perfect T that still counts as one, rad. */
export const TEE_ANGLE_TOL = (10 * Math.PI) / 180;

export interface TeeArmInput { id: string; dir: Vec2; end: LineAt }

export interface SizedTee {
  tee: SizedNode['tee'] | null;
  arms: { id: string; compensation: Compensation; reserve: number }[];
  warnings: Warning[];
}

const mm = (m: number) => (m * 1e3).toFixed(3);

/** The main pair (most nearly opposite arms) and the branch, or null when the three arms do not form a T. */
export function teeRoles(dirs: Vec2[]): { main: [number, number]; branch: number } | null {
  let best: [number, number] = [0, 1], bestDot = Infinity;
  for (let i = 0; i < 3; i++) for (let j = i + 1; j < 3; j++) {
    const d = dot(dirs[i]!, dirs[j]!);
    if (d < bestDot) { bestDot = d; best = [i, j]; }
  }
  const branch = [0, 1, 2].find((k) => k !== best[0] && k !== best[1])!;
  const inLine = bestDot <= -Math.cos(TEE_ANGLE_TOL);
  const square = Math.abs(dot(dirs[branch]!, dirs[best[0]]!)) <= Math.sin(TEE_ANGLE_TOL) && Math.abs(dot(dirs[branch]!, dirs[best[1]]!)) <= Math.sin(TEE_ANGLE_TOL);
  return inLine && square ? { main: best, branch } : null;
}

export function sizeTee(node: string, arms: TeeArmInput[], o: { h: number; f0: number; junctions: JunctionChoice }): SizedTee {
  const roles = teeRoles(arms.map((a) => a.dir));
  if (!roles) {
    const r = noJunctionModel(node, 'other', arms.map((a) => a.id));
    return { tee: null, arms: arms.map((a) => ({ id: a.id, compensation: r.compensation, reserve: 0 })), warnings: [r.warning] };
  }
  const statics = (a: TeeArmInput): TeeArm => ({ z: a.end.z0Static, ee: a.end.epsEffStatic });
  const m1 = arms[roles.main[0]]!, m2 = arms[roles.main[1]]!, br = arms[roles.branch]!;
  const spec = { main: [statics(m1), statics(m2)] as [TeeArm, TeeArm], branch: statics(br), h: o.h };
  const atF0 = teeJunction({ ...spec, f: o.f0 });
  const atZero = teeJunction({ ...spec, f: 0 });
  const modelled = o.junctions === 'modelled';
  const inRange = atF0.F <= TEE_F_LIMIT;
  const validity = `T of ${spec.main[0].z.toFixed(1)}/${spec.main[1].z.toFixed(1)} Ω main arms and a ${spec.branch.z.toFixed(1)} Ω branch; (f0/fp1)² = ${atF0.F.toFixed(3)} (flagged above ${TEE_F_LIMIT}, our own limit); turns ratio n² = ${atF0.n2.toFixed(4)} on the branch; junction susceptance omitted`;
  const out: SizedTee['arms'] = [];
  const push = (a: TeeArmInput, role: 'main' | 'branch', d: number, d0: number) => {
    const beta = (2 * Math.PI) / a.end.lambdaG;
    const residual = modelled ? transformerResidual(atF0.n2) : shiftResidual(d, beta, atF0.n2);
    const from = role === 'main' ? 'the branch centreline' : 'the main-line centreline';
    out.push({
      id: a.id, reserve: Math.max(0, d0),
      compensation: {
        model: 'tee-planes', source: TEE_CITATION, amount_m: -d, applied: modelled, node,
        note: modelled
          ? `${role} arm: reference plane ${mm(d)} mm from ${from} at f0, so the copper runs that much further into the tee and the arm's electrical length counts from the plane`
          : `${role} arm: reference plane ${mm(d)} mm from ${from} at f0 (ideal junctions chosen: not applied; the arm is measured from the centre)`,
        junction: { kind: 'tee', role, modelled, inRange, validity, residual },
      },
    });
  };
  push(m1, 'main', atF0.d1[0], atZero.d1[0]);
  push(m2, 'main', atF0.d1[1], atZero.d1[1]);
  push(br, 'branch', atF0.d2, atZero.d2);
  const warnings = [...atF0.warnings];
  if (!modelled) warnings.push(warn('note', `tee ${node}: ideal junction chosen — arms joined at the centre, reference-plane shifts (${mm(atF0.d1[0])}, ${mm(atF0.d1[1])}, ${mm(atF0.d2)} mm) not applied`, { source: TEE_SOURCE, subjects: [node], severity: 'info' }));
  return {
    tee: { main: [m1.id, m2.id], branch: br.id, arms: { main: spec.main, branch: spec.branch }, atF0, modelled },
    arms: out, warnings,
  };
}

/** A junction with no model at hand: reported on each arm, joined at its centre. */
export function noJunctionModel(node: string, kind: 'cross' | 'other', armIds: string[], reason?: string): { warning: Warning; compensation: Compensation } {
  const what = reason ?? (kind === 'cross' ? 'a cross (four arms)' : 'arms not in a T (two in line, one square to them)');
  const validity = `${what}: no published model at hand; arms joined at the centre`;
  return {
    warning: warn('advisory-model', `${kind === 'cross' ? 'cross' : 'junction'} ${node}: ${validity}, so its effect is not in the sweep`, { subjects: [node, ...armIds], severity: 'info' }),
    compensation: { model: kind === 'cross' ? 'cross' : 'junction', source: 'none at hand', amount_m: 0, applied: false, node,
      note: `${validity}; the arm is measured from the centre`,
      junction: { kind, role: 'arm', modelled: false, inRange: false, validity, residual: null } },
  };
}
