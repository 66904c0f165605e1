/**
 * Toolpaths: what a milling machine does, in board metres (x, y as in the design; z up, z = 0 on top of the copper,
 * negative into the board). Produced by core/toolpath from the board geometry, written as G-code by core/export.
 */
import type { Vec2 } from '../geometry/types.ts';

export interface Vec3 { x: number; y: number; z: number }

/** What a tool does: the kinds of work, in the order a job is run. */
export type OperationKind = 'isolation' | 'clearing' | 'drilling' | 'hole-milling' | 'cutout';

export interface Tool {
  /** Tool number, 1-based, in the order the files should be run. */
  number: number;
  kind: 'v-bit' | 'end-mill' | 'drill';
  /** Nominal diameter, m (a V-bit: its width at the cutting depth). */
  diameter: number;
  /** Width of the cut it makes at the copper surface, m. */
  cutWidth: number;
  /** V-bit only: tip width, m, and included angle, degrees. */
  tipWidth?: number;
  angleDeg?: number;
  /** Readable description for file headers and panels (ASCII only: it goes into G-code comments). */
  label: string;
  /** Short name for the file name, e.g. 'isolation', 'drill-0.80mm', 'cutout'. */
  slug: string;
}

/**
 * One machine move. `rapid`: G0 (no cutting); `line`: G1 at the move's feed; `arc`: G2 (clockwise) or G3 in the XY
 * plane about `centre`, ending at `to` (z may change: a helix). Every move starts where the previous one ended.
 */
export type Move =
  | { kind: 'rapid'; to: Vec3 }
  | { kind: 'line'; to: Vec3; feed: number }
  | { kind: 'arc'; to: Vec3; centre: Vec2; clockwise: boolean; feed: number };

/** The program of one tool: its moves from the safe height back to the safe height. */
export interface ToolProgram {
  tool: Tool;
  operations: OperationKind[];
  spindleRpm: number;
  /** The first position is (first x, first y, safe height); the tool is at the safe height before and after. */
  start: Vec3;
  moves: Move[];
  /** Estimated run time, s (see estimate.ts). */
  seconds: number;
  /** Cutting length, m. */
  cutLength: number;
  /** Travel length (rapid moves), m. */
  travelLength: number;
}

/** A closed or open tool-centre path at one depth, before ordering and linking. */
export interface CutPath {
  points: Vec2[];
  closed: boolean;
  /** Depth below the copper surface, m (positive). */
  depth: number;
  op: OperationKind;
}
