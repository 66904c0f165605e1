/**
 * The layers every exporter knows, with the names each file format shows. One table, so a layer is called the
 * same in DXF, SVG and the CLI's --layers flag.
 */
import { InputError, describe } from '../util/errors.ts';
import type { BoardGeometry, Region } from '../geometry/types.ts';

export type ExportLayer = 'copper' | 'ground' | 'outline' | 'clearance' | 'keepouts' | 'drills' | 'isolation';

export const EXPORT_LAYERS: readonly ExportLayer[] = ['copper', 'ground', 'outline', 'clearance', 'keepouts', 'drills', 'isolation'];

/** Geometry ready for export: the board plus, when milling outlines were asked for, the isolation paths. */
export type ExportGeometry = BoardGeometry & {
  /** Closed tool-centre outlines around all copper (see milling.ts); absent unless computed. */
  isolation?: Region[];
};

export interface LayerInfo {
  /** DXF layer name (upper case, no spaces: accepted by every DXF reader). */
  dxf: string;
  /** SVG group id. */
  svg: string;
  /** Human description for usage text and docs. */
  title: string;
  /** DXF colour index (ACI) of the layer (1 red, 2 yellow, 3 green, 4 cyan, 5 blue, 6 magenta, 7 white/black). */
  aci: number;
  /** SVG colour in the layered drawing. */
  colour: string;
}

export const LAYER_INFO: Record<ExportLayer, LayerInfo> = {
  copper: { dxf: 'COPPER', svg: 'copper', title: 'network copper (lines, bends, tees, pads)', aci: 1, colour: '#b87333' },
  ground: { dxf: 'GROUND_COPPER', svg: 'ground-copper', title: 'copper kept as top-side ground', aci: 3, colour: '#6a8f3a' },
  outline: { dxf: 'BOARD_EDGE', svg: 'board-edge', title: 'board profile (cut line)', aci: 7, colour: '#202020' },
  clearance: { dxf: 'CLEAR_AREA', svg: 'clear-area', title: 'copper to remove (board minus all copper)', aci: 5, colour: '#4f7fd9' },
  keepouts: { dxf: 'KEEPOUT', svg: 'keepout', title: 'keep-out areas (no copper)', aci: 6, colour: '#c040c0' },
  drills: { dxf: 'DRILLS', svg: 'drills', title: 'drilled holes (vias, pins, mounting)', aci: 4, colour: '#000000' },
  isolation: { dxf: 'ISOLATION_PATH', svg: 'isolation-path', title: 'tool-centre outlines offset by the tool radius', aci: 2, colour: '#d08000' },
};

/** Layers written when none are asked for. Isolation is added when the geometry carries it. */
export function defaultLayers(g: ExportGeometry): ExportLayer[] {
  const l: ExportLayer[] = ['copper', 'ground', 'outline', 'clearance', 'drills'];
  if (g.keepouts.length > 0) l.push('keepouts');
  if (g.isolation) l.push('isolation');
  return l;
}

/** Checks a layer list from a caller (e.g. the CLI's --layers) and returns it without duplicates. */
export function checkLayers(layers: readonly string[] | undefined, g: ExportGeometry, field = 'layers'): ExportLayer[] {
  if (layers === undefined) return defaultLayers(g);
  if (!Array.isArray(layers) || layers.length === 0) throw new InputError('bad-choice', field, `a non-empty list of layers among ${EXPORT_LAYERS.join(', ')}`, describe(layers));
  const out: ExportLayer[] = [];
  for (const l of layers) {
    if (!(EXPORT_LAYERS as readonly string[]).includes(l)) {
      throw new InputError('bad-choice', field, `layer names among ${EXPORT_LAYERS.join(', ')}`, describe(l));
    }
    if (l === 'isolation' && !g.isolation) {
      throw new InputError('bad-choice', field, 'isolation only together with a milling tool diameter', "'isolation'",
        'give the tool diameter (CLI: --tool 0.2mm) so the outlines can be offset by its radius');
    }
    if (!out.includes(l as ExportLayer)) out.push(l as ExportLayer);
  }
  return out;
}

/** The board profile region: the outline, or the extent rectangle when the design has none. */
export function profileRegion(g: BoardGeometry): Region {
  if (g.outline) return g.outline;
  const e = g.extent;
  return { outer: [{ x: e.minX, y: e.minY }, { x: e.maxX, y: e.minY }, { x: e.maxX, y: e.maxY }, { x: e.minX, y: e.maxY }], holes: [] };
}

/** Regions of a region layer. */
export function layerRegions(g: ExportGeometry, layer: Exclude<ExportLayer, 'drills'>): Region[] {
  switch (layer) {
    case 'copper': return g.copper;
    case 'ground': return g.groundCopper;
    case 'outline': return [profileRegion(g)];
    case 'clearance': return g.clearance;
    case 'keepouts': return g.keepouts;
    case 'isolation': return g.isolation ?? [];
  }
}
