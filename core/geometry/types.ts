/**
 * Plain geometry shared by layout, exporters and faces. Board coordinates in metres, y up, origin at the design
 * origin. Rings are closed implicitly (the last point is not repeated). Outer rings run counter-clockwise, holes
 * clockwise (positive signed area for outers).
 */
export interface Vec2 { x: number; y: number }

export type Ring = Vec2[];

/** One simple polygon with holes. */
export interface Region { outer: Ring; holes: Ring[] }

export interface Box { minX: number; minY: number; maxX: number; maxY: number }

/** A drilled hole: vias to ground, connector pins, mounting holes. */
export interface DrillHit {
  at: Vec2;
  /** Finished hole diameter, m. */
  diameter: number;
  plated: boolean;
  use: 'via' | 'pin' | 'mount';
  /** The piece or node that asked for it. */
  owner: string;
}

/**
 * Everything a fabrication exporter needs, produced by core/layout from a sized design.
 * Layers are fixed names so every exporter maps them the same way.
 */
export interface BoardGeometry {
  /** Top copper: united per net into clean simple polygons with holes. */
  copper: Region[];
  /** Copper kept as ground on the top side (ground-copper areas), already cleared around the network. */
  groundCopper: Region[];
  /** The board profile (outline); null when the design has none (then exporters use the copper extent). */
  outline: Region | null;
  /** Copper to remove for milling: board (or extent + margin) minus copper minus ground copper. */
  clearance: Region[];
  /** Keep-out areas (no copper allowed), for the record and for checks. */
  keepouts: Region[];
  drills: DrillHit[];
  /** Bounding box of everything above. */
  extent: Box;
  /** Per piece: its own copper before union, for hit-testing and highlighting in faces. */
  pieces: { id: string; regions: Region[]; centreline: Vec2[] }[];
}
