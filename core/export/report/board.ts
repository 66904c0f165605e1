/**
 * The board as drawn in the report: copper (and ground copper) filled, drills as white dots, the outline stroked,
 * at 1:1 when it fits the space given and otherwise scaled down to fit; a scale bar of a round length is drawn under
 * it in both cases, so a printed page can be measured.
 */
import type { BoardGeometry, Region } from '../../geometry/types.ts';
import { COPPER, GREY, INK, line, text, type DrawItem } from './drawing.ts';
import { niceStep } from './plot.ts';

export interface BoardDrawing { items: DrawItem[]; /** page mm per board mm (1 = full size) */ scale: number; height: number }

export function drawBoard(g: BoardGeometry, x: number, y: number, w: number, hMax: number): BoardDrawing {
  const box = g.outline ? ringBox(g.outline.outer) : g.extent;
  const bw = (box.maxX - box.minX) * 1000, bh = (box.maxY - box.minY) * 1000;
  const room = hMax - 12;
  const scale = Math.min(1, w / Math.max(bw, 1e-6), room / Math.max(bh, 1e-6));
  const ox = x + (w - bw * scale) / 2;
  const P = (p: { x: number; y: number }): [number, number] => [ox + (p.x - box.minX) * 1000 * scale, y + (box.maxY - p.y) * 1000 * scale];
  const items: DrawItem[] = [];
  const fill = (regions: Region[], colour: readonly [number, number, number]) => {
    for (const r of regions) items.push({ kind: 'fill', subpaths: [r.outer, ...r.holes].map((ring) => ring.map(P)), colour });
  };
  fill(g.groundCopper, [0.86, 0.72, 0.58]);
  fill(g.copper, COPPER);
  for (const d of g.drills) {
    const [cx, cy] = P(d.at), r = (d.diameter / 2) * 1000 * scale;
    items.push({ kind: 'fill', subpaths: [Array.from({ length: 24 }, (_, k): [number, number] => [cx + r * Math.cos((k * Math.PI) / 12), cy + r * Math.sin((k * Math.PI) / 12)])], colour: [1, 1, 1] });
  }
  if (g.outline) items.push({ kind: 'stroke', points: g.outline.outer.map(P), closed: true, width: 0.25, colour: INK });
  // Scale bar: a round length near a third of the drawing's width, in board millimetres.
  const barMm = niceStep(bw / 3, 1);
  const by = y + bh * scale + 5, bx = ox;
  items.push(line(bx, by, bx + barMm * scale, by, 0.4, INK));
  items.push(line(bx, by - 1, bx, by + 1, 0.3, INK), line(bx + barMm * scale, by - 1, bx + barMm * scale, by + 1, 0.3, INK));
  items.push(text(bx + barMm * scale + 2, by + 1, 7, `${barMm} mm`, 'start', INK));
  items.push(text(x + w, by + 1, 7, scale === 1 ? 'full size (1:1) when printed at 100 %' : `scaled to fit: 1 : ${(1 / scale).toFixed(2)} (see the scale bar)`, 'end', GREY));
  return { items, scale, height: bh * scale + 9 };
}

function ringBox(ring: { x: number; y: number }[]) {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const p of ring) { minX = Math.min(minX, p.x); maxX = Math.max(maxX, p.x); minY = Math.min(minY, p.y); maxY = Math.max(maxY, p.y); }
  return { minX, minY, maxX, maxY };
}
