/**
 * The extent of everything that would become copper or board (placed nodes, drawn nodes, outline, areas) against
 * BOARD_SIZE_LIMIT; beyond it a 'too-large' problem naming the longest pieces (or the areas) that make it so.
 */
import type { DesignDoc } from '../../design/types.ts';
import type { Vec2 } from '../../geometry/types.ts';
import type { SizedNode, SizedPiece } from '../types.ts';
import { mm, type Problem } from './context.ts';

/**
 * Largest side of a board this app lays out, m (our choice): far above any blank made in-house, and small enough that
 * the polygon engine's work stays bounded. A design beyond it (a quarter wave at 1 MHz is tens of metres) is refused
 * here, during sizing, before any geometry is built.
 */
export const BOARD_SIZE_LIMIT = 1;

export function checkBoardSize(doc: DesignDoc, pieces: SizedPiece[], nodes: SizedNode[], problem: Problem): void {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  const grow = (p: Vec2 | undefined, r = 0) => {
    if (!p || !Number.isFinite(p.x) || !Number.isFinite(p.y)) return;
    minX = Math.min(minX, p.x - r); maxX = Math.max(maxX, p.x + r); minY = Math.min(minY, p.y - r); maxY = Math.max(maxY, p.y + r);
  };
  let wMax = 0;
  for (const p of pieces) if (Number.isFinite(p.width)) wMax = Math.max(wMax, p.width, p.widthB ?? 0);
  // A node no piece reaches makes no copper (it is reported as dangling); it does not size the board.
  for (const n of nodes) if (n.segments.length) { grow(n.at); grow(n.pos, wMax / 2); }
  for (const p of doc.board?.outline ?? []) grow(p);
  const bigAreas: string[] = [];
  for (const a of doc.areas ?? []) {
    for (const p of a.polygon ?? []) grow(p);
    const xs = (a.polygon ?? []).map((p) => p.x), ys = (a.polygon ?? []).map((p) => p.y);
    if (xs.length && Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) > BOARD_SIZE_LIMIT) bigAreas.push(a.id);
  }
  const dx = maxX - minX, dy = maxY - minY;
  if (!(dx > BOARD_SIZE_LIMIT || dy > BOARD_SIZE_LIMIT)) return;
  const longest = pieces.filter((p) => Number.isFinite(p.span) && p.span > 0).sort((a, b) => b.span - a.span);
  const named = longest.filter((p) => p.span >= BOARD_SIZE_LIMIT / 4).slice(0, 12);
  const list = (named.length ? named : longest.slice(0, 3));
  const why = list.length ? `; the longest pieces are ${list.map((p) => `${p.id} (${mm(p.span)} mm)`).join(', ')}` : '';
  problem('too-large', `the board would be ${mm(dx)} × ${mm(dy)} mm, more than the ${BOARD_SIZE_LIMIT * 1e3} mm a side Stripwright lays out${why}${bigAreas.length ? `; areas ${bigAreas.join(', ')} are larger than that` : ''}: check the design frequency (${(doc.frequency.f0 / 1e6).toPrecision(4)} MHz), the lengths and the outline`,
    [...list.map((p) => p.id), ...bigAreas]);
}
