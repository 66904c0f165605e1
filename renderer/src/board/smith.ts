/**
 * The Smith chart grid and traces, as data then drawn with svg.js. Geometry of the chart (P. H. Smith, 1939):
 * the circle of constant normalised resistance r has centre (r/(1+r), 0) and radius 1/(1+r); the arc of constant
 * normalised reactance x has centre (1, 1/x) and radius 1/|x|, both in the reflection-coefficient plane.
 */
import { SVG, type Svg } from '@svgdotjs/svg.js';

export const R_CIRCLES = [0, 0.2, 0.5, 1, 2, 5];
export const X_ARCS = [0.2, 0.5, 1, 2, 5];

export function resistanceCircle(r: number): { cx: number; cy: number; radius: number } {
  return { cx: r / (1 + r), cy: 0, radius: 1 / (1 + r) };
}

export function reactanceArc(x: number): { cx: number; cy: number; radius: number } {
  return { cx: 1, cy: 1 / x, radius: 1 / Math.abs(x) };
}

/** Γ from a normalised impedance z = r + jx: Γ = (z − 1)/(z + 1). */
export function gammaOf(r: number, x: number): { re: number; im: number } {
  const d = (r + 1) * (r + 1) + x * x;
  return { re: (r * r + x * x - 1) / d, im: (2 * x) / d };
}

export interface SmithTrace { name: string; re: number[]; im: number[]; cls: string }

/** Draws the chart into `host` (replacing what was there). Γ-plane y up; the svg's y is flipped in the transform. */
export function drawSmith(host: HTMLElement, traces: SmithTrace[], marker: number | null): Svg {
  host.replaceChildren();
  const svg = SVG().addTo(host).viewbox(-1.08, -1.08, 2.16, 2.16).addClass('smith');
  const clipId = `sm-clip-${Math.random().toString(36).slice(2, 8)}`;
  const clip = svg.clip().id(clipId);
  clip.circle(2).center(0, 0);
  const g = svg.group().attr('transform', 'scale(1,-1)');
  g.circle(2).center(0, 0).addClass('sm-edge');
  const grid = g.group().attr('clip-path', `url(#${clipId})`);
  for (const r of R_CIRCLES) { const c = resistanceCircle(r); grid.circle(2 * c.radius).center(c.cx, c.cy).addClass('sm-grid'); }
  for (const x of X_ARCS) for (const s of [1, -1]) { const c = reactanceArc(s * x); grid.circle(2 * c.radius).center(c.cx, c.cy).addClass('sm-grid'); }
  grid.line(-1, 0, 1, 0).addClass('sm-grid');
  for (const t of traces) {
    if (t.re.length < 2) continue;
    g.polyline(t.re.map((re, k) => [re, t.im[k]!] as [number, number])).addClass(`sm-trace ${t.cls}`).attr('data-trace', t.name);
    if (marker !== null && marker < t.re.length) g.circle(0.04).center(t.re[marker]!, t.im[marker]!).addClass(`sm-marker ${t.cls}`);
  }
  return svg;
}
