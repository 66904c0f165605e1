/**
 * The drawing of a Wilkinson split's two arms and their resistor, shared by the `wilkinson` block and the corporate
 * feed's Wilkinson splits (the design equations are in splitters.ts: Wilkinson 1960; Pozar, Microwave Engineering,
 * 4th ed., 2012, §7.3). Plain geometry of our own:
 * - In the split's own frame (u along its axis, from the input junction; v across, outward), each arm is two legs
 *   meeting at a bend; both arms end on one line across the axis, `span` apart (the resistor's pad pitch), so the
 *   resistor bridges them square. Each arm's bend lies where its two legs are equally long (on the ellipse of its
 *   length about the junction and its end), so arms of unequal length (an unequal split) still end side by side,
 *   and the second leg is half the arm: long enough for the bends at its ends.
 * - The lines leaving the arm ends head outward at 45°: their copper comes nearest the axis at their end edges,
 *   span/2 − (w/2)·sin 45° from it. The resistor footprint is the smallest chip size whose pitch keeps the process's
 *   cut between those edges (and between the arms' end edges), and the pads' reach of half the arm widths plus
 *   0.5 mm (common practice for hand soldering). The gap between the resistor's own pads is the one place the
 *   lines come closer than that: it is the part's (its land pattern), and only has to be cut, so the chip is one
 *   whose pad gap is at least the process's cut (the shop check finds an uncut pad gap as a gap between the arm ends).
 */
import type { Vec2 } from '../../geometry/types.ts';
import { smdFootprint } from '../../design/footprints.ts';
import { InputError } from '../../util/errors.ts';

const SQ = Math.SQRT1_2;
/** Chip sizes from the smallest still soldered by hand to the largest the land table has (common practice). */
const SIZES = ['0603', '0805', '1206'] as const;
export type ResistorSize = (typeof SIZES)[number];

/**
 * Clearance kept beyond the process's cut between copper edges near the resistor: 10 % of the cut and 20 µm, so
 * rounding of the drawn positions never lands a gap on the cut itself (a choice of ours).
 */
export function keptGap(cut: number): number { return cut * 1.1 + 20e-6; }

/**
 * The resistor for a split: the smallest chip whose pitch both reaches the arms (half their widths plus 0.5 mm) and
 * keeps `cut` between the arms' end edges and between the leaving lines' (45° outward), and whose pads' own gap the
 * process cuts. Null when even the largest does not (the lines at the resistor are too wide for this process).
 */
export function resistorSpan(arms: [number, number], leaving: [number, number], cut: number): { size: ResistorSize; pitch: number } | null {
  const g = keptGap(cut);
  const need = Math.max((arms[0] + arms[1]) / 2 + 0.5e-3, (SQ / 2) * (arms[0] + arms[1]) + g, (SQ / 2) * (leaving[0] + leaving[1]) + g);
  // The gap between the chip's own pads must be cut too (copper left there would short the resistor).
  for (const size of SIZES) { const f = smdFootprint(size); if (f.pitch >= need && f.pitch - f.padAlong >= g) return { size, pitch: f.pitch }; }
  return null;
}

/** Refusal when no chip fits: the widths, the gap, and what would make it. */
export function noResistorFits(field: string, arms: [number, number], leaving: [number, number], cut: number): InputError {
  const widest = Math.max(...arms, ...leaving);
  const pitch = smdFootprint('1206').pitch;
  const most = (pitch - keptGap(cut)) / (SQ / 2);
  return new InputError('out-of-range', field,
    `lines at the isolation resistor that a 1206 chip (${(pitch * 1e3).toFixed(1)} mm pitch) can bridge while keeping the process's ${(cut * 1e3).toFixed(3)} mm cut between them: two leaving lines together at most ${(most * 1e3).toFixed(2)} mm wide`,
    `lines of ${leaving.map((w) => (w * 1e3).toFixed(2)).join(' and ')} mm leaving the arms (arms ${arms.map((w) => (w * 1e3).toFixed(2)).join(' and ')} mm; widest ${(widest * 1e3).toFixed(2)} mm)`, 'use a thinner laminate (narrower lines for the same impedance), a gentler split, or a finer process');
}

export interface ArmPlan {
  /** The bend between the two legs and the arm's end, in the split's frame (u along, v outward), m. */
  bend: { u: number; v: number };
  end: { u: number; v: number };
  /** Electrical lengths of the two legs, degrees at f0 (together 90°). */
  deg: [number, number];
}

/**
 * Both arms of a split with quarter-wave lengths `lengths` (m, as drawn) ending `span` apart. The ends sit at
 * u = U, chosen so the shorter arm's legs meet at a right angle.
 */
export function armPlans(lengths: [number, number], span: number): [ArmPlan, ArmPlan] {
  const short = Math.min(...lengths);
  const chord = Math.max(short * SQ, span); // legs at 45° to the chord for the shorter arm
  const U = Math.sqrt(Math.max(chord * chord - (span * span) / 4, (short * short) / 16));
  const plan = (L: number): ArmPlan => {
    const e = { u: U, v: span / 2 };
    const c = Math.hypot(e.u, e.v);
    // The bend on the perpendicular bisector of junction–end, outward, with both legs L/2.
    const off = Math.sqrt(Math.max(0, (L / 2) ** 2 - (c / 2) ** 2));
    const nu = -e.v / c, nv = e.u / c; // unit normal to the chord, pointing outward (v > 0)
    return { bend: { u: e.u / 2 + nu * off, v: e.v / 2 + nv * off }, end: e, deg: [45, 45] };
  };
  return [plan(lengths[0]), plan(lengths[1])];
}

/** Maps a point of the split's frame to the drawing: origin, unit axis and the unit outward direction of one arm. */
export function toWorld(origin: Vec2, axis: Vec2, outward: Vec2, p: { u: number; v: number }): Vec2 {
  return { x: origin.x + axis.x * p.u + outward.x * p.v, y: origin.y + axis.y * p.u + outward.y * p.v };
}

/** Direction leaving an arm end 45° outward from the axis. */
export function leavingDir(axis: Vec2, outward: Vec2): Vec2 {
  return { x: SQ * (axis.x + outward.x), y: SQ * (axis.y + outward.y) };
}
