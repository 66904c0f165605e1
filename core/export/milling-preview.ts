/**
 * A picture of a milling plan for the app's Outputs (and anyone who wants one): the design's copper, the copper left
 * after milling over it, every tool's cutting path, the rapid moves dashed, and the holes. True size in mm (y up
 * turned into SVG's y down), deterministic text. Pure: it draws the plan's own moves, so what is shown is what the
 * G-code files contain.
 */
import type { BoardGeometry, Region, Vec2 } from '../geometry/types.ts';
import type { MillingPlan, ToolProgram } from '../toolpath/index.ts';
import { flattenArc } from '../toolpath/swept.ts';

/** Colours per tool kind (isolation, drills, cutout). */
const TOOL_COLOUR: Record<string, string> = { 'v-bit': '#c0392b', 'end-mill-1': '#c0392b', drill: '#1f4e9c', cutout: '#2e7d32' };

const n = (v: number) => (Math.round(v * 1e4) / 1e4).toString();

export function millingPreviewSvg(plan: MillingPlan, g: BoardGeometry): string {
  const o = plan.origin;
  const P = (p: Vec2) => `${n((p.x - o.x) * 1e3)},${n((plan.size.height - (p.y - o.y)) * 1e3)}`;
  const ring = (r: Vec2[]) => `M${r.map(P).join('L')}Z`;
  const regions = (rs: Region[]) => rs.map((r) => [r.outer, ...r.holes].map(ring).join('')).join('');
  const pad = 2 + plan.options.cutoutTool * 1e3;
  const W = plan.size.width * 1e3, H = plan.size.height * 1e3;
  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(-pad)} ${n(-pad)} ${n(W + 2 * pad)} ${n(H + 2 * pad)}" width="${n(W + 2 * pad)}mm" height="${n(H + 2 * pad)}mm">`);
  out.push(`<path d="${ring(plan.board.outer)}" fill="#e8dcc0" stroke="#555" stroke-width="0.05"/>`);
  out.push(`<path d="${regions([...g.copper, ...g.groundCopper])}" fill="#f2c69b" fill-rule="evenodd" data-layer="design-copper"/>`);
  out.push(`<path d="${regions(plan.milled.copper)}" fill="#b8692e" fill-opacity="0.75" fill-rule="evenodd" data-layer="milled-copper"/>`);
  for (const p of plan.programs) out.push(programPaths(p, P));
  out.push('</svg>');
  return out.join('\n') + '\n';
}

function programPaths(p: ToolProgram, P: (p: Vec2) => string): string {
  const colour = p.tool.kind === 'drill' ? TOOL_COLOUR.drill : p.tool.slug === 'cutout' ? TOOL_COLOUR.cutout : TOOL_COLOUR['v-bit'];
  const cut: string[] = [], rapid: string[] = [], holes: string[] = [];
  let at = p.start;
  let pen: 'cut' | 'rapid' | null = null;
  for (const m of p.moves) {
    const kind = m.kind === 'rapid' ? 'rapid' : 'cut';
    const flatXY = m.to.x === at.x && m.to.y === at.y;
    if (!flatXY) {
      const list = kind === 'cut' ? cut : rapid;
      if (pen !== kind) list.push(`M${P(at)}`);
      if (m.kind === 'arc') list.push(...flattenArc(at, m.to, m.centre, m.clockwise, 5e-6).map((q) => `L${P(q)}`));
      else list.push(`L${P(m.to)}`);
      pen = kind;
    } else if (p.tool.kind === 'drill' && m.kind === 'line' && m.to.z < at.z && m.to.z < 0) {
      holes.push(P(m.to));
      pen = null;
    } else pen = null;
    at = m.to;
  }
  const w = Math.max(0.05, p.tool.cutWidth * 1e3);
  const uniqueHoles = [...new Set(holes)];
  return `<g data-tool="${p.tool.number}" data-slug="${p.tool.slug}">`
    + (rapid.length ? `<path d="${rapid.join('')}" fill="none" stroke="#777" stroke-width="0.06" stroke-dasharray="0.4 0.3"/>` : '')
    + (cut.length ? `<path d="${cut.join('')}" fill="none" stroke="${colour}" stroke-opacity="0.55" stroke-width="${n(w)}" stroke-linejoin="round" stroke-linecap="round"/>` : '')
    + uniqueHoles.map((c) => { const [x, y] = c.split(','); return `<circle cx="${x}" cy="${y}" r="${n(w / 2)}" fill="${colour}"/>`; }).join('')
    + '</g>';
}
