/**
 * What the board draws, as plain data: built by the editor state from the design and the core's geometry, drawn
 * by the board controller. Board coordinates in metres, y up.
 */
import type { Region, Vec2 } from '../../../core/index.ts';

export type SceneNodeKind = 'port' | 'vertex' | 'junction' | 'open' | 'short';

export interface SceneNode { id: string; at: Vec2; kind: SceneNodeKind; label?: string; heading?: number }

export interface SceneSegment {
  id: string;
  kind: 'line' | 'taper' | 'lumped' | 'sparams' | 'coupled';
  /** Drawn end points (the sketch). */
  a: Vec2;
  b: Vec2;
  /** The sized centreline from the core's geometry, when known. */
  centreline?: Vec2[];
  /** Copper width at the ends, m, when sized (for hit-testing and labels). */
  width?: number;
  /** A lumped part: its body (m, along and across the line) and its value as text, drawn on the board. */
  part?: { name: string; value: string; size: string; body: { along: number; across: number } };
}

export interface ScenePiece {
  id: string;
  /** The piece's true copper. */
  regions: Region[];
  /** SVG path text of the regions in mm, when prepared beforehand; with `by`, the text of the copper before it. */
  d?: string;
  /** The live layout translated this copper by `by` (m) since `d` was drawn (core LiveOutline): drawn as `d` moved. */
  by?: Vec2;
}

export interface Scene {
  nodes: SceneNode[];
  segments: SceneSegment[];
  /** True copper of each piece (before union), keyed by the piece id. */
  pieces: ScenePiece[];
  outline: Vec2[] | null;
  /** Ground-copper and keep-out areas as drawn, and the ground copper left after clearing (from the last check). */
  areas: { id: string; kind: 'ground-copper' | 'keep-out'; polygon: Vec2[] }[];
  ground: Region[];
  /** The ground copper is from an earlier revision (a check is on its way): drawn faded. */
  groundStale?: boolean;
  drills: { at: Vec2; diameter: number }[];
  /** Copper left after milling (the milling plan of Outputs), drawn over the design while the view asks for it. */
  milled?: Region[];
  /** The milled copper is from an earlier revision: drawn faded. */
  milledStale?: boolean;
}

export const EMPTY_SCENE: Scene = { nodes: [], segments: [], pieces: [], outline: null, areas: [], ground: [], drills: [] };

/** Selected and marked ids, drawn as overlays. */
export interface Marks {
  selected: ReadonlySet<string>; flagged: ReadonlySet<string>; hovered: string | null;
  /** Runs the shop check found side by side closer than the proximity limit (drawn with a dashed warning edge). */
  near?: ReadonlySet<string>;
}
