/**
 * SVG export: a drawing at true size for vector editors, laser and CAM programs that take SVG.
 *
 * - `width`/`height` in millimetres with a matching `viewBox`, so one user unit is 1 mm whatever the viewer's
 *   pixels per inch (CSS Values and Units: 1 in = 96 px = 25.4 mm; W3C SVG 1.1, units and the viewBox attribute);
 *   no transforms: y is flipped once, here, by writing y_svg = top − y (SVG y points down, the board's up);
 * - one `<g>` per layer with a readable id (layers.ts), marked as a layer for editors that read
 *   `inkscape:groupmode="layer"`;
 * - copper as filled closed paths with `fill-rule="evenodd"` (holes are their own subpaths), or outline-only
 *   with a hairline stroke; never relies on stroke width for copper.
 */
import type { Region } from '../geometry/types.ts';
import { InputError, describe } from '../util/errors.ts';
import { fmtMm, makeFrame, roundMm, toMm, type Frame, type PointMm } from './frame.ts';
import { LAYER_INFO, checkLayers, layerRegions, type ExportGeometry, type ExportLayer } from './layers.ts';

export interface SvgOptions {
  /** Mirror left-right (for toner transfer or bottom-side views). */
  mirror?: boolean;
  /** Layers to draw (see layers.ts); default copper, ground, outline, clearance, drills. */
  layers?: readonly string[];
  /** 'filled' (default): copper filled; 'outline': every ring as a hairline, nothing filled. */
  style?: 'filled' | 'outline';
  /** Empty space around the board, mm (default 2). */
  marginMm?: number;
  /** Who made it from what, e.g. "design 1a2b3c4d:5k, Stripwright 0.9.0" (the pipeline's stamp; no timestamp). */
  stamp?: string;
}

/** Paint order: areas first, then copper, then lines and holes on top. */
const PAINT_ORDER: ExportLayer[] = ['clearance', 'ground', 'copper', 'keepouts', 'isolation', 'outline', 'drills'];
/** Hairline stroke width, mm. */
const HAIRLINE = 0.02;

export function toSvg(geometry: ExportGeometry, options: SvgOptions = {}): string {
  const frame = makeFrame(geometry, { origin: 'board', mirror: options.mirror ?? false });
  const layers = checkLayers(options.layers, geometry);
  const style = options.style ?? 'filled';
  if (style !== 'filled' && style !== 'outline') throw new InputError('bad-choice', 'style', "'filled' or 'outline'", describe(style));
  const margin = options.marginMm ?? 2;
  if (typeof margin !== 'number' || !Number.isFinite(margin) || margin < 0 || margin > 100) {
    throw new InputError('out-of-range', 'marginMm', 'a margin between 0 and 100 mm', describe(margin));
  }
  const W = roundMm(frame.width + 2 * margin), H = roundMm(frame.height + 2 * margin);
  const place = placer(frame, margin);
  const body: string[] = [];
  for (const layer of PAINT_ORDER) {
    if (!layers.includes(layer)) continue;
    body.push(layerGroup(geometry, frame, layer, style, place));
  }
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" xmlns:inkscape="http://www.inkscape.org/namespaces/inkscape" width="${fmtMm(W)}mm" height="${fmtMm(H)}mm" viewBox="0 0 ${fmtMm(W)} ${fmtMm(H)}">`,
    `<title>Stripwright board ${fmtMm(frame.width, 3)} × ${fmtMm(frame.height, 3)} mm</title>`,
    `<desc>True size: 1 user unit = 1 mm. Board lower-left corner at (${fmtMm(margin)}, ${fmtMm(roundMm(H - margin))}) in SVG coordinates (y down). Mirrored: ${frame.mirror ? 'yes' : 'no'}.${options.stamp ? ` Made by ${escapeText(options.stamp)}.` : ''}</desc>`,
    ...body,
    '</svg>',
    '',
  ].join('\n');
}

/** Maps board mm (y up) to SVG user units (mm, y down) inside the margin. */
export function placer(frame: Frame, margin: number): (p: PointMm) => PointMm {
  return (p) => ({ x: roundMm(p.x - frame.box.minX + margin), y: roundMm(frame.box.maxY - p.y + margin) });
}

/** Path data of one region: outer and holes as separate closed subpaths (even-odd fill makes the holes). */
export function regionPath(frame: Frame, place: (p: PointMm) => PointMm, region: Region): string {
  return [region.outer, ...region.holes].map((ring) => ringPath(frame.ring(ring).map(place))).join(' ');
}

export function ringPath(pts: PointMm[]): string {
  return pts.map((p, i) => `${i === 0 ? 'M' : 'L'}${fmtMm(p.x)} ${fmtMm(p.y)}`).join(' ') + ' Z';
}

function layerGroup(g: ExportGeometry, frame: Frame, layer: ExportLayer, style: 'filled' | 'outline', place: (p: PointMm) => PointMm): string {
  const info = LAYER_INFO[layer];
  const open = (attrs: string) => `<g id="${info.svg}" inkscape:groupmode="layer" inkscape:label="${info.svg}" ${attrs}>`;
  const stroked = style === 'outline' || layer === 'outline' || layer === 'isolation' || layer === 'keepouts';
  const attrs = stroked
    ? `fill="none" stroke="${info.colour}" stroke-width="${HAIRLINE}" stroke-linejoin="round"`
    : `fill="${info.colour}" fill-rule="evenodd" stroke="none"${layer === 'clearance' ? ' fill-opacity="0.25"' : ''}`;
  const items: string[] = [];
  if (layer === 'drills') {
    for (const hit of g.drills) {
      const c = place(frame.point(hit.at));
      items.push(`<circle cx="${fmtMm(c.x)}" cy="${fmtMm(c.y)}" r="${fmtMm(roundMm(toMm(hit.diameter) / 2))}" data-use="${hit.use}" data-plated="${hit.plated}"/>`);
    }
  } else {
    for (const region of layerRegions(g, layer)) items.push(`<path d="${regionPath(frame, place, region)}"/>`);
  }
  return [open(attrs), ...items, '</g>'].join('\n');
}

/** Text safe inside an SVG element. */
function escapeText(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}
