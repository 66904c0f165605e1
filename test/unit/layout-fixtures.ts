/** Small invented designs for the layout tests (not real boards). */
import type { DesignDoc, DesignNode, DesignSegment, FabProcess, LengthSpec, SubstrateSpec, WidthSpec } from '../../core/design/types.ts';
import { newDesign } from '../../core/design/defaults.ts';

export const RO_LIKE: SubstrateSpec = { er: 3.66, h: 0.508e-3, t: 0, tanDelta: 0.0037, sigma: 5.8e7, roughness: 0 };

export function design(parts: { nodes: DesignNode[]; segments: DesignSegment[]; substrate?: SubstrateSpec; f0?: number; process?: FabProcess }): DesignDoc {
  const f0 = parts.f0 ?? 2.45e9;
  const d = newDesign({ name: 'test', f0, ...(parts.process ? { process: parts.process } : {}) });
  d.substrate = parts.substrate ?? RO_LIKE;
  d.nodes = parts.nodes;
  d.segments = parts.segments;
  // These fixtures test the sizing steps on plain microstrip (a milled design is otherwise sized as made).
  d.asMade = { sizing: 'microstrip', sideCopper: 'stitched' };
  return d;
}

export const port = (id: string, x: number, y: number, heading = 0): DesignNode => ({ id, kind: 'port', zRef: 50, heading, at: { x, y } });
export const vertex = (id: string, x: number, y: number, bend: Extract<DesignNode, { kind: 'vertex' }>['bend'] = { style: 'miter-optimal' }): DesignNode => ({ id, kind: 'vertex', bend, at: { x, y } });
export const junction = (id: string, x: number, y: number): DesignNode => ({ id, kind: 'junction', at: { x, y } });
export const open = (id: string, x: number, y: number): DesignNode => ({ id, kind: 'open', at: { x, y } });
export const line = (id: string, a: string, b: string, w: WidthSpec, length: LengthSpec): DesignSegment => ({ id, a, b, kind: 'line', width: w, length });
export const z = (z0: number) => ({ by: 'z0' as const, z0 });
export const wd = (width: number) => ({ by: 'width' as const, width });
export const degs = (deg: number) => ({ by: 'degrees' as const, deg });
export const lenOf = (length: number) => ({ by: 'length' as const, length });
