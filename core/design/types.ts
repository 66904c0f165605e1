/**
 * The design document: the user's feed network as data. SI units everywhere (m, Hz, Ω, S/m, radians for angles
 * inside; degrees only where the name says `Deg`). This file holds the types; design/schema.ts is the one
 * source: the record types below are inferred from it, design/migrations.ts brings older versions up to DESIGN_VERSION.
 *
 * Topology: a graph. Nodes sit at drawn positions; segments join two nodes. A run with corners is several
 * segments joined at `vertex` nodes (each vertex becomes a bend, or a width step when the two widths differ).
 * Tees and crosses are `junction` nodes with three or four segments. Stubs are segments ending at an `open` or
 * `short` node. The drawn positions give directions and, for `drawn` lengths, the length; sizing replaces the
 * drawn length wherever the spec fixes it, and the layout places pieces from the anchor port outward.
 */
import type { SubstrateSpec } from '../substrate/types.ts';
import type { OmitEach, Out } from './infer.ts';
import type {
  areaSchema, asMadeSchema, bendSchema, designSchema, junctionChoiceSchema, lengthSchema, nodeSchema, phaseGroupSchema,
  placedBlockSchema, processSchema, segmentSchema, viaSchema, widthSchema,
} from './schema.ts';

export type { SubstrateSpec };
export type * from './targets.ts';
export type { SweepSpec } from './sweep-settings.ts';
export type { ProximityLimitSetting } from './proximity-limit.ts';
export type { MeasuredFile } from './measured.ts';

export const DESIGN_FORMAT = 'stripwright-design';

// The record types are inferred from the one schema (schema.ts) through infer.ts (`Out`: valibot's InferOutput less
// the loose objects' index signature), so the file format, its checks and these types cannot drift apart.

/** How the board is made; drives the fabrication checks and export offsets. */
export type FabProcess = Out<typeof processSchema>;

/**
 * How lines are sized for what is made (format 3). 'as-made': where the process (isolation milling) or ground copper
 * with a set clearance puts copper beside the lines, they are sized from 2-D field solutions of that cross-section
 * (core/section); 'microstrip': plain microstrip formulas. Absent = 'microstrip'. Side copper is 'stitched' to the
 * ground plane by vias (the shop check gives the via-fence pitch) or 'floating'. `cover`: solder mask or conformal
 * coat over the top (m); `fencePitch`: the via-fence pitch the maker will drill, m.
 */
export type AsMade = Out<typeof asMadeSchema>;

export type BendStyle = Out<typeof bendSchema>;

export type ViaSpec = Out<typeof viaSchema>;

/** A node: port (zRef, heading rad with 0 = +x, optional launch pads), vertex (bend), junction, open or short (via). */
export type DesignNode = Out<typeof nodeSchema>;
export type NodeSpec = OmitEach<DesignNode, 'id' | 'at' | 'label'>;

/** Width from an impedance (synthesised at f0 with dispersion) or given directly. */
export type WidthSpec = Out<typeof widthSchema>;

/** Length from an electrical length at f0, a physical length, or the drawn distance. */
export type LengthSpec = Out<typeof lengthSchema>;

export type DesignSegment = Out<typeof segmentSchema>;
export type SegmentSpec = OmitEach<DesignSegment, 'id' | 'a' | 'b' | 'label'>;

export type SmdSize = Extract<SegmentSpec, { kind: 'lumped' }>['size'];

/**
 * A coupled pair (format 3): two parallel strips of one width with an edge-to-edge gap. It has four terminals: the
 * first strip runs a → b, the second c → d, with c beside a and d beside b (the drawing says on which side).
 * `pair` gives the geometry, or the even- and odd-mode impedances to synthesise it from at f0. The length is the
 * coupled run's, by electrical degrees at f0 (on the mean of the two modes' phase constants) or physically.
 */
export type CoupledSpec = Extract<SegmentSpec, { kind: 'coupled' }>;
export type PairSpec = CoupledSpec['pair'];

/** The terminals of a segment: [a, b], or [a, b, c, d] for a coupled pair. */
export function segmentEnds(s: DesignSegment): string[] {
  return s.kind === 'coupled' ? [s.a, s.b, s.c, s.d] : [s.a, s.b];
}

export type Area = Out<typeof areaSchema>;

/**
 * Ports whose paths from `from` must match in phase. `offsetsDeg` (optional, one per `to` port) gives the wanted
 * electrical-length difference of each path to the first one, degrees at f0: [0, 90] asks the second path to be a
 * quarter-wave longer (a quadrature hybrid's coupled port). Without it all paths must be equal.
 */
export type PhaseGroup = Out<typeof phaseGroupSchema>;

/**
 * How junctions (tees, width steps) are treated: 'modelled' — the published models in sizing and the sweep (the
 * default); 'ideal' — arms joined at the junction centre, kept to compare against.
 */
export type JunctionChoice = Out<typeof junctionChoiceSchema>;

/**
 * A block placed from a spec (format 8, core/blocks): its kind, the checked spec, where its first port was placed,
 * the ids of the records it made (`members`) and a fingerprint of each as made (`made`), so hand edits inside it
 * can be listed before it is re-generated.
 */
export type PlacedBlock = Out<typeof placedBlockSchema>;

/** A value of a block parameter as stored: SI numbers, choices, lists, a complex impedance or text. */
export type BlockParamValue = PlacedBlock['spec'][string];

/**
 * The whole document, inferred from the schema like its records: targets and tolerances (format 3,
 * core/design/targets.ts), placed blocks (format 8), sweep settings (format 9, core/design/sweep-settings.ts) and
 * measured files (format 10, core/design/measured.ts) included. `substrate` keeps the type of its own module (it
 * carries model fields the file does not check). Fields this version does not know are kept on load and written
 * back on save.
 */
export type DesignDoc = Omit<Out<ReturnType<typeof designSchema>>, 'substrate' | 'format'> & {
  format: typeof DESIGN_FORMAT;
  substrate: SubstrateSpec;
  [unknown: string]: unknown;
};
