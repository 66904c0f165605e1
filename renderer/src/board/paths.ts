/**
 * SVG path text of copper regions in board millimetres (the board's world layer is drawn in mm). Pure, so the
 * worker can prepare it off the main thread.
 */
import type { Region, Vec2 } from '../../../core/index.ts';

const mm = (v: number) => v * 1000;

function ringPath(r: Vec2[]): string {
  if (r.length === 0) return '';
  let d = `M${mm(r[0]!.x)} ${mm(r[0]!.y)}`;
  for (let i = 1; i < r.length; i++) d += `L${mm(r[i]!.x)} ${mm(r[i]!.y)}`;
  return d + 'Z';
}

export function regionsPath(regions: Region[]): string {
  let d = '';
  for (const g of regions) { d += ringPath(g.outer); for (const h of g.holes) d += ringPath(h); }
  return d;
}
