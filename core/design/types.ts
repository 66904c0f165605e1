/**
 * The design document: the user's feed network as data. SI units everywhere (m, Hz, Ω, S/m, radians for angles
 * inside; degrees only where the name says `Deg`). This file holds the types; design/schema.ts validates a parsed
 * file against them, design/migrations.ts brings older versions up to DESIGN_VERSION.
 *
 * Topology: a graph. Nodes sit at drawn positions; segments join two nodes. A run with corners is several
 * segments joined at `vertex` nodes (each vertex becomes a bend, or a width step when the two widths differ).
 * Tees and crosses are `junction` nodes with three or four segments. Stubs are segments ending at an `open` or
 * `short` node. The drawn positions give directions and, for `drawn` lengths, the length; sizing replaces the
 * drawn length wherever the spec fixes it, and the layout places pieces from the anchor port outward.
 */
import type { Vec2 } from '../geometry/types.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import type { Target, Tolerance } from './targets.ts';
import type { SweepSpec } from './sweep-settings.ts';

export type { SubstrateSpec };
export type * from './targets.ts';
export type { SweepSpec } from './sweep-settings.ts';
export type { MeasuredFile } from './measured.ts';

export const DESIGN_FORMAT = 'stripwright-design';

/** How the board is made; drives the fabrication checks and export offsets. */
export type FabProcess =
  | { kind: 'end-mill'; toolDiameter: number; depth: number }
  | { kind: 'v-bit'; tipWidth: number; angleDeg: number; depth: number }
  | { kind: 'etch'; edgeBias: number; minFeature: number };

/**
 * How lines are sized for what is made (format 3). 'as-made': where the process (isolation milling) or ground copper
 * with a set clearance puts copper beside the lines, they are sized from 2-D field solutions of that cross-section
 * (core/section); 'microstrip': plain microstrip formulas. Absent = 'microstrip'. Side copper is 'stitched' to the
 * ground plane by vias (the shop check gives the via-fence pitch) or 'floating'. `cover`: solder mask or conformal
 * coat over the top (m); `fencePitch`: the via-fence pitch the maker will drill, m.
 */
export interface AsMade {
  sizing: 'as-made' | 'microstrip';
  sideCopper: 'stitched' | 'floating';
  cover?: { er: number; thickness: number };
  fencePitch?: number;
}

export type BendStyle =
  | { style: 'miter-optimal' }
  | { style: 'miter'; fraction: number }
  | { style: 'arc'; radius: number }
  | { style: 'square' };

export interface ViaSpec { drill: number; pad: number; count: number; plating?: number }

export type NodeSpec =
  | { kind: 'port'; zRef: number; /** heading the line leaves the port at, rad, 0 = +x */ heading: number; launch?: { padWidth: number; padLength: number; pinDrill?: number } }
  | { kind: 'vertex'; bend: BendStyle }
  | { kind: 'junction' }
  | { kind: 'open' }
  | { kind: 'short'; via: ViaSpec };

export type DesignNode = { id: string; at: Vec2; label?: string } & NodeSpec;

/** Width from an impedance (synthesised at f0 with dispersion) or given directly. */
export type WidthSpec = { by: 'z0'; z0: number } | { by: 'width'; width: number };

/** Length from an electrical length at f0, a physical length, or the drawn distance. */
export type LengthSpec = { by: 'degrees'; deg: number } | { by: 'length'; length: number } | { by: 'drawn' };

export type SmdSize = '0402' | '0603' | '0805' | '1206';

export type SegmentSpec =
  | { kind: 'line'; width: WidthSpec; length: LengthSpec }
  | { kind: 'taper'; profile: 'linear' | 'klopfenstein'; from: WidthSpec; to: WidthSpec; length: LengthSpec; rippleDb?: number }
  | { kind: 'lumped'; part: 'resistor' | 'capacitor' | 'inductor'; value: number; size: SmdSize; /** line width at its pads */ width: WidthSpec }
  | { kind: 'sparams'; /** Touchstone text kept in the design (1 or 2 ports) */ touchstone: string; name: string; width: WidthSpec; length: { by: 'length'; length: number } }
  | CoupledSpec;

/**
 * A coupled pair (format 3): two parallel strips of one width with an edge-to-edge gap. It has four terminals: the
 * first strip runs a → b, the second c → d, with c beside a and d beside b (the drawing says on which side).
 * `pair` gives the geometry, or the even- and odd-mode impedances to synthesise it from at f0. The length is the
 * coupled run's, by electrical degrees at f0 (on the mean of the two modes' phase constants) or physically.
 */
export type PairSpec = { by: 'geometry'; width: number; gap: number } | { by: 'modes'; z0Even: number; z0Odd: number };
export type CoupledSpec = { kind: 'coupled'; c: string; d: string; pair: PairSpec; length: { by: 'degrees'; deg: number } | { by: 'length'; length: number } };

export type DesignSegment = { id: string; a: string; b: string; label?: string } & SegmentSpec;

/** The terminals of a segment: [a, b], or [a, b, c, d] for a coupled pair. */
export function segmentEnds(s: DesignSegment): string[] {
  return s.kind === 'coupled' ? [s.a, s.b, s.c, s.d] : [s.a, s.b];
}

export interface Area { id: string; kind: 'keep-out' | 'ground-copper'; polygon: Vec2[]; /** clearance kept from the network, m */ clearance?: number }

/**
 * Ports whose paths from `from` must match in phase. `offsetsDeg` (optional, one per `to` port) gives the wanted
 * electrical-length difference of each path to the first one, degrees at f0: [0, 90] asks the second path to be a
 * quarter-wave longer (a quadrature hybrid's coupled port). Without it all paths must be equal.
 */
export interface PhaseGroup { id: string; name: string; from: string; to: string[]; toleranceDeg: number; offsetsDeg?: number[] }

/**
 * How junctions (tees, width steps) are treated: 'modelled' — the published models in sizing and the sweep (the
 * default); 'ideal' — arms joined at the junction centre, kept to compare against.
 */
export type JunctionChoice = 'modelled' | 'ideal';

/** A value of a block parameter as stored: SI numbers, choices, lists, a complex impedance or text. */
export type BlockParamValue = number | string | boolean | number[] | { re: number; im: number };

/**
 * A block placed from a spec (format 8, core/blocks): its kind, the checked spec, where its first port was placed,
 * the ids of the records it made (`members`) and a fingerprint of each as made (`made`), so hand edits inside it
 * can be listed before it is re-generated.
 */
export interface PlacedBlock {
  id: string;
  kind: string;
  spec: Record<string, BlockParamValue>;
  at: Vec2;
  members: string[];
  made: Record<string, string>;
}

export interface DesignDoc {
  format: typeof DESIGN_FORMAT;
  version: number;
  /** App that last wrote it, e.g. 'stripwright 0.1.0'. */
  app?: string;
  name: string;
  notes?: string;
  substrate: SubstrateSpec;
  frequency: { f0: number; band: { start: number; stop: number } };
  process: FabProcess;
  asMade?: AsMade;
  nodes: DesignNode[];
  segments: DesignSegment[];
  board: { outline: Vec2[] } | null;
  areas: Area[];
  phaseGroups: PhaseGroup[];
  /** Requirements on the response (format 3; core/design/targets.ts). */
  targets: Target[];
  /** How the made board may differ from the drawing (format 3; core/design/targets.ts). */
  tolerances: Tolerance[];
  /** Junction models (format 4); absent counts as 'modelled'. */
  junctions?: JunctionChoice;
  /** Blocks placed from a spec (format 8): each keeps its spec so it can be re-opened and re-generated. */
  blocks?: PlacedBlock[];
  /** The design's own sweep (format 9; core/design/sweep-settings.ts); absent = the band widened to f0, 201 points. */
  sweep?: SweepSpec;
  /** Measured Touchstone files of the whole board with their port maps (format 10; core/design/measured.ts). */
  measured?: import('./measured.ts').MeasuredFile[];
  /** Drawing preferences kept with the design (the snap grid); never affect the physics. Display units are the app's (format 7). */
  view?: { grid?: number };
  /** Fields this version does not know are kept here on load and written back on save. */
  [unknown: string]: unknown;
}
