/**
 * Redraws the example designs (assets/examples/*.json) at their sized positions: each file is loaded (migrated to
 * the current format), sized with its own settings, and every node's drawn position set to where the sizing placed
 * it (to 1 nm), so the drawing shows the lengths the models give and loops stay closed. A rectangular board outline
 * keeps its margins: each edge moves with the nodes' extent on that side. Piece specifications and notes are edited
 * by hand; this only redraws.
 *
 *   npx tsx scripts/resize-examples.ts [name.json …]     (default: every example)
 *
 * Review the diff afterwards (git diff assets/examples).
 */
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, serializeDesign, sizeDesign, type DesignDoc, type Vec2 } from '../core/index.ts';

const DIR = join(import.meta.dirname, '..', 'assets', 'examples');
const nm = (x: number) => Math.round(x * 1e9) / 1e9;

function extent(points: Vec2[]) {
  return { x0: Math.min(...points.map((p) => p.x)), x1: Math.max(...points.map((p) => p.x)), y0: Math.min(...points.map((p) => p.y)), y1: Math.max(...points.map((p) => p.y)) };
}

function redraw(doc: DesignDoc): DesignDoc {
  const sized = sizeDesign(doc);
  if (sized.problems.length) throw new Error(`${doc.name}: ${sized.problems.map((p) => p.message).join('; ')}`);
  const pos = new Map(sized.nodes.map((n) => [n.id, n.pos]));
  const before = extent(doc.nodes.map((n) => n.at));
  const nodes = doc.nodes.map((n) => {
    const p = pos.get(n.id);
    return p && Number.isFinite(p.x) ? { ...n, at: { x: nm(p.x), y: nm(p.y) } } : n;
  });
  const after = extent(nodes.map((n) => n.at));
  let board = doc.board;
  if (board && board.outline.length === 4) {
    const o = extent(board.outline);
    const e = { x0: nm(o.x0 + after.x0 - before.x0), x1: nm(o.x1 + after.x1 - before.x1), y0: nm(o.y0 + after.y0 - before.y0), y1: nm(o.y1 + after.y1 - before.y1) };
    board = { outline: [{ x: e.x0, y: e.y0 }, { x: e.x1, y: e.y0 }, { x: e.x1, y: e.y1 }, { x: e.x0, y: e.y1 }] };
  }
  return { ...doc, nodes, board };
}

const names = process.argv.slice(2).length ? process.argv.slice(2) : readdirSync(DIR).filter((f) => f.endsWith('.json'));
for (const name of names) {
  const file = join(DIR, name);
  const parsed = parseDesign(readFileSync(file, 'utf8'));
  if (!parsed.ok) throw new Error(`${name}: ${parsed.errors.map((e) => e.message).join('; ')}`);
  // Twice: a drawn piece between moved nodes takes its new drawn length, which can move what is placed after it.
  const doc = redraw(redraw(parsed.doc));
  writeFileSync(file, serializeDesign(doc));
  process.stdout.write(`${name}: redrawn\n`);
}
