/**
 * One source for the design file: the record types are inferred from the valibot schema (core/design/types.ts from
 * schema.ts), and the command field lists are derived from it (command-args.ts). The type checks here fail
 * `npm run typecheck` (which covers test/) if an inferred type stops matching the shape the code was written
 * against, kept below as it was hand-written before (project's own types, frozen); the run-time checks cover the
 * derived field lists.
 */
import { describe, expect, it } from 'vitest';
import type {
  AsMade, Area, BendStyle, CoupledSpec, DesignDoc, DesignNode, DesignSegment, FabProcess, JunctionChoice, LengthSpec, NodeSpec,
  PairSpec, PhaseGroup, SegmentSpec, SmdSize, ViaSpec, Vec2, WidthSpec,
} from '../../core/index.ts';
import { NODE_SPEC_KEYS, SEGMENT_SPEC_KEYS } from '../../core/design/command-args.ts';
import { runCommand, newDesign } from '../../core/index.ts';

/** A and B accept exactly the same values (each assignable to the other). */
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;

namespace Frozen {
  export type FabProcess =
    | { kind: 'end-mill'; toolDiameter: number; depth: number }
    | { kind: 'v-bit'; tipWidth: number; angleDeg: number; depth: number }
    | { kind: 'etch'; edgeBias: number; minFeature: number };
  export interface AsMade { sizing: 'as-made' | 'microstrip'; sideCopper: 'stitched' | 'floating'; cover?: { er: number; thickness: number }; fencePitch?: number }
  export type BendStyle = { style: 'miter-optimal' } | { style: 'miter'; fraction: number } | { style: 'arc'; radius: number } | { style: 'square' };
  export interface ViaSpec { drill: number; pad: number; count: number; plating?: number }
  export type NodeSpec =
    | { kind: 'port'; zRef: number; heading: number; launch?: { padWidth: number; padLength: number; pinDrill?: number } }
    | { kind: 'vertex'; bend: BendStyle }
    | { kind: 'junction' }
    | { kind: 'open' }
    | { kind: 'short'; via: ViaSpec };
  export type DesignNode = { id: string; at: Vec2; label?: string } & NodeSpec;
  export type WidthSpec = { by: 'z0'; z0: number } | { by: 'width'; width: number };
  export type LengthSpec = { by: 'degrees'; deg: number } | { by: 'length'; length: number } | { by: 'drawn' };
  export type SmdSize = '0402' | '0603' | '0805' | '1206';
  export type PairSpec = { by: 'geometry'; width: number; gap: number } | { by: 'modes'; z0Even: number; z0Odd: number };
  export type CoupledSpec = { kind: 'coupled'; c: string; d: string; pair: PairSpec; length: { by: 'degrees'; deg: number } | { by: 'length'; length: number } };
  export type SegmentSpec =
    | { kind: 'line'; width: WidthSpec; length: LengthSpec }
    | { kind: 'taper'; profile: 'linear' | 'klopfenstein'; from: WidthSpec; to: WidthSpec; length: LengthSpec; rippleDb?: number }
    | { kind: 'lumped'; part: 'resistor' | 'capacitor' | 'inductor'; value: number; size: SmdSize; width: WidthSpec }
    | { kind: 'sparams'; touchstone: string; name: string; width: WidthSpec; length: { by: 'length'; length: number } }
    | CoupledSpec;
  export type DesignSegment = { id: string; a: string; b: string; label?: string } & SegmentSpec;
  export interface Area { id: string; kind: 'keep-out' | 'ground-copper'; polygon: Vec2[]; clearance?: number }
  export interface PhaseGroup { id: string; name: string; from: string; to: string[]; toleranceDeg: number; offsetsDeg?: number[] }
  export type JunctionChoice = 'modelled' | 'ideal';
}

const sameTypes: true[] = [
  true as Same<FabProcess, Frozen.FabProcess>,
  true as Same<AsMade, Frozen.AsMade>,
  true as Same<BendStyle, Frozen.BendStyle>,
  true as Same<ViaSpec, Frozen.ViaSpec>,
  true as Same<NodeSpec, Frozen.NodeSpec>,
  true as Same<DesignNode, Frozen.DesignNode>,
  true as Same<WidthSpec, Frozen.WidthSpec>,
  true as Same<LengthSpec, Frozen.LengthSpec>,
  true as Same<SmdSize, Frozen.SmdSize>,
  true as Same<PairSpec, Frozen.PairSpec>,
  true as Same<CoupledSpec, Frozen.CoupledSpec>,
  true as Same<SegmentSpec, Frozen.SegmentSpec>,
  true as Same<DesignSegment, Frozen.DesignSegment>,
  true as Same<Area, Frozen.Area>,
  true as Same<PhaseGroup, Frozen.PhaseGroup>,
  true as Same<JunctionChoice, Frozen.JunctionChoice>,
  true as Same<DesignDoc['nodes'][number], Frozen.DesignNode>,
  true as Same<DesignDoc['process'], Frozen.FabProcess>,
];

describe('design types and field lists from the one schema', () => {
  it('the inferred record types equal the shapes the code was written against (checked by the type-check)', () => {
    expect(sameTypes.every((x) => x === true)).toBe(true);
  });
  it('the spec field lists hold every kind-specific field of the schema, and none that every record has', () => {
    expect([...NODE_SPEC_KEYS].sort()).toEqual(['bend', 'heading', 'kind', 'launch', 'via', 'zRef']);
    for (const k of ['kind', 'width', 'length', 'profile', 'from', 'to', 'rippleDb', 'part', 'value', 'size', 'touchstone', 'name', 'c', 'd', 'pair']) {
      expect(SEGMENT_SPEC_KEYS.has(k)).toBe(true);
    }
    for (const k of ['id', 'a', 'b', 'at', 'label']) { expect(SEGMENT_SPEC_KEYS.has(k)).toBe(false); expect(NODE_SPEC_KEYS.has(k)).toBe(false); }
  });
  it('changing a node kind drops the old kind\'s fields (the derived list at work)', () => {
    let doc = newDesign();
    doc = runCommand(doc, 'node.add', { id: 'p', at: { x: 0, y: 0 }, spec: { kind: 'port', zRef: 50, heading: 0 } });
    doc = runCommand(doc, 'node.setSpec', { id: 'p', spec: { kind: 'vertex', bend: { style: 'square' } } });
    const n = doc.nodes.find((x) => x.id === 'p')! as Record<string, unknown>;
    expect(n.kind).toBe('vertex');
    expect('zRef' in n || 'heading' in n).toBe(false);
  });
});
