/**
 * DXF export (text DXF of the 2007 release, AC1021, written through dxf-writer) for CAD and CAM programs.
 *
 * Layout of the file:
 * - one closed LWPOLYLINE (group 70 bit 1 set, last vertex not repeated) per outer ring and per hole, on the
 *   layer of its kind (layers.ts), so a CAM program can tell inside from outside;
 * - drilled holes as CIRCLE entities on their own layer (centre + finished radius);
 * - $INSUNITS = 4 (millimetres) and $MEASUREMENT = 1 (metric), because DXF coordinates are unitless and a reader
 *   without $INSUNITS may assume inches (Autodesk, DXF Reference, HEADER section group codes);
 * - a leading 999 comment stating the unit, origin and mirroring in words for readers that ignore the header.
 *
 * Deterministic: dxf-writer numbers entities from a module-wide handle counter; it is reset before each drawing
 * so the same geometry always gives the same text (needed for golden files).
 */
import Drawing from 'dxf-writer';
import Handle from 'dxf-writer/src/Handle.js';
import type { Region } from '../geometry/types.ts';
import { makeFrame, roundMm, toMm, type FrameOptions, type PointMm } from './frame.ts';
import { LAYER_INFO, checkLayers, layerRegions, type ExportGeometry, type ExportLayer } from './layers.ts';

export interface DxfOptions extends FrameOptions {
  /** Layers to write; default copper, ground, outline, clearance, drills (+ keepouts, isolation when present). */
  layers?: readonly string[];
  /** Who made it from what, e.g. "design 1a2b3c4d:5k, Stripwright 0.9.0" (the pipeline's stamp; never a timestamp). */
  stamp?: string;
}

/** A 999 comment holds one line of text (DXF group codes are line pairs): line breaks become spaces. */
export const dxfCommentText = (text: string): string => text.replace(/[\r\n]+/g, ' ');

export function toDxf(geometry: ExportGeometry, options: DxfOptions = {}): string {
  const frame = makeFrame(geometry, options);
  const layers = checkLayers(options.layers, geometry);
  Handle.seed = 0;
  const d = new Drawing();
  d.setUnits('Millimeters');
  d.header('MEASUREMENT', [[70, 1]]);
  for (const layer of layers) {
    const info = LAYER_INFO[layer];
    d.addLayer(info.dxf, info.aci, 'CONTINUOUS');
    d.setActiveLayer(info.dxf);
    if (layer === 'drills') {
      for (const hit of geometry.drills) {
        const c = frame.point(hit.at);
        d.drawCircle(c.x, c.y, roundMm(toMm(hit.diameter) / 2));
      }
    } else {
      for (const region of layerRegions(geometry, layer)) drawRegion(d, frame.ring, region);
    }
  }
  const comment = [
    '999', 'Stripwright DXF export. Units: millimetres.',
    '999', `Origin: ${frame.origin === 'board' ? 'lower-left corner of the board' : 'design origin'}. Mirrored: ${frame.mirror ? 'yes (left-right)' : 'no'}.`,
    '999', `Layers: ${layers.map((l: ExportLayer) => LAYER_INFO[l].dxf).join(', ')}.`,
    ...(options.stamp ? ['999', `Made by ${dxfCommentText(options.stamp)}.`] : []),
  ].join('\n');
  return `${comment}\n${fixHandseed(d.toDxfString())}`;
}

/**
 * $HANDSEED must be the next free handle, above every handle in the file (DXF Reference, HEADER section:
 * "Next available handle"); dxf-writer 1.18.4 writes the last one used (observed in the project's own testing), so a strict reader
 * could hand out a duplicate. Handles are group codes 5 and 105, hexadecimal.
 */
export function fixHandseed(text: string): string {
  const lines = text.split('\n');
  let max = 0, seedAt = -1;
  for (let i = 0; i + 1 < lines.length; i += 2) {
    const code = lines[i].trim();
    if (code === '9' && lines[i + 1] === '$HANDSEED') { seedAt = i + 3; i += 2; continue; } // its own 5-group is no handle
    if (code === '5' || code === '105') max = Math.max(max, parseInt(lines[i + 1], 16));
  }
  if (seedAt > 0) lines[seedAt] = (max + 1).toString(16).toUpperCase();
  return lines.join('\n');
}

function drawRegion(d: Drawing, ring: (r: Region['outer']) => PointMm[], region: Region): void {
  for (const r of [region.outer, ...region.holes]) {
    d.drawPolyline(ring(r).map((p) => [p.x, p.y] as [number, number]), true);
  }
}
