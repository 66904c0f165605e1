/**
 * The shape of a meander laid on a straight run: the run keeps its two ends and its direction at both of them; in
 * between, the line leaves the run sideways and comes back, adding length. Our own construction (plain geometry):
 *
 * - 'serpentine': `bumps` rectangular bumps of height H on one side, legs square to the run at a centre-to-centre
 *   pitch p (edge gap p − W), joined alternately at the top and along the run; each bump adds 2·H. One bump is the
 *   'trombone' (a U).
 * - 'dogleg': for small additions a single shallow trapezoid (ramps of horizontal reach r up to height H, top of
 *   length p): it adds 2·(√(r² + H²) − r), so any small amount fits without legs shorter than the bends.
 *
 * Lengths here are centreline lengths through the corner points; what the sized copper realises (miters take some
 * away) is measured afterwards from the sized design, so this module only has to be monotone in H.
 */
import type { Vec2 } from '../../geometry/types.ts';

export type MeanderShape =
  | { kind: 'serpentine'; bumps: number; height: number; pitch: number }
  | { kind: 'dogleg'; reach: number; height: number; top: number };

export interface MeanderPlacement {
  /** Start and end of the run (the chosen piece's two nodes). */
  a: Vec2;
  b: Vec2;
  /** +1: to the left of a → b; −1: to the right. */
  side: 1 | -1;
  shape: MeanderShape;
  /** Straight run kept before the meander, from a, m (default: the meander centred on the run). */
  lead?: number;
}

/** Along-the-run length the shape takes, m. */
export function meanderSpan(shape: MeanderShape): number {
  return shape.kind === 'serpentine' ? (2 * shape.bumps - 1) * shape.pitch : 2 * shape.reach + shape.top;
}

/** Centreline length the shape adds over the straight run, m (through its corner points). */
export function meanderExtra(shape: MeanderShape): number {
  if (shape.kind === 'serpentine') return 2 * shape.bumps * shape.height;
  return 2 * (Math.hypot(shape.reach, shape.height) - shape.reach);
}

/** Dogleg height that adds `extra` with ramps of horizontal reach `reach`: from 2(√(r² + H²) − r) = E. */
export function doglegHeight(extra: number, reach: number): number {
  return Math.sqrt((extra * extra) / 4 + extra * reach);
}

/**
 * The corner points of the meander from a to b, ends excluded, `lead` from a (default centred on the run). Every point lies on the run or
 * at the shape's height beside it.
 */
export function meanderCorners(m: MeanderPlacement): Vec2[] {
  const dx = m.b.x - m.a.x, dy = m.b.y - m.a.y, L = Math.hypot(dx, dy);
  const ux = dx / L, uy = dy / L;
  const nx = -uy * m.side, ny = ux * m.side;
  const lead = m.lead ?? (L - meanderSpan(m.shape)) / 2;
  const at = (s: number, h: number): Vec2 => ({ x: m.a.x + ux * s + nx * h, y: m.a.y + uy * s + ny * h });
  const out: Vec2[] = [];
  const sh = m.shape;
  if (sh.kind === 'serpentine') {
    for (let i = 0; i < sh.bumps; i++) {
      const s0 = lead + 2 * i * sh.pitch;
      out.push(at(s0, 0), at(s0, sh.height), at(s0 + sh.pitch, sh.height), at(s0 + sh.pitch, 0));
    }
  } else {
    out.push(at(lead, 0), at(lead + sh.reach, sh.height), at(lead + sh.reach + sh.top, sh.height), at(lead + 2 * sh.reach + sh.top, 0));
  }
  return out;
}

