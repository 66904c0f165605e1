/**
 * The Smith chart grid and traces, as data then drawn with svg.js. Geometry of the chart (P. H. Smith, 1939):
 * the circle of constant normalised resistance r has centre (r/(1+r), 0) and radius 1/(1+r); the arc of constant
 * normalised reactance x has centre (1, 1/x) and radius 1/|x|, both in the reflection-coefficient plane.
 * Each circle is labelled: r where it meets the real axis (Γ = (r − 1)/(r + 1)), x where its arc meets the rim.
 */
import { SVG, type G, type Svg } from '@svgdotjs/svg.js';

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

export interface SmithDrawing {
  svg: Svg;
  /** Layer for marker dots and the hover dot, in Γ coordinates (y up). */
  marks: G;
  /** Layer of the reflection traces (setSmithTraces). */
  traces: G;
  /** Γ under a client point. */
  toGamma(clientX: number, clientY: number): { re: number; im: number };
}

const VIEW = 1.22;

/**
 * Draws the chart's grid and labels into `host` (replacing what was there), once: a new response changes only the
 * traces (setSmithTraces). Γ-plane y up; the svg's y is flipped in the transform. Circles are placed by their cx/cy
 * attributes (svg.js's center() would ask the browser for a bounding box, a layout, per circle).
 */
export function drawSmith(host: HTMLElement, traces: SmithTrace[] = []): SmithDrawing {
  host.replaceChildren();
  const svg = SVG().addTo(host).viewbox(-VIEW, -VIEW, 2 * VIEW, 2 * VIEW).addClass('smith');
  const clipId = `sm-clip-${Math.random().toString(36).slice(2, 8)}`;
  const clip = svg.clip().id(clipId);
  clip.circle(2).attr({ cx: 0, cy: 0 });
  const g = svg.group().attr('transform', 'scale(1,-1)');
  g.circle(2).attr({ cx: 0, cy: 0 }).addClass('sm-edge');
  const grid = g.group().attr('clip-path', `url(#${clipId})`);
  for (const r of R_CIRCLES) { const c = resistanceCircle(r); grid.circle(2 * c.radius).attr({ cx: c.cx, cy: c.cy }).addClass('sm-grid'); }
  for (const x of X_ARCS) for (const s of [1, -1]) { const c = reactanceArc(s * x); grid.circle(2 * c.radius).attr({ cx: c.cx, cy: c.cy }).addClass('sm-grid'); }
  grid.line(-1, 0, 1, 0).addClass('sm-grid');
  // Labels in an unflipped group (text must not be mirrored): y is negated by hand.
  const labels = svg.group().addClass('sm-labels');
  for (const r of R_CIRCLES.slice(1)) {
    const re = (r - 1) / (r + 1);
    labels.plain(String(r)).attr({ x: re + 0.015, y: -0.03, 'text-anchor': 'start' }).addClass('sm-label');
  }
  for (const x of X_ARCS) for (const s of [1, -1]) {
    const p = gammaOf(0, s * x), k = 1.08;
    labels.plain(`${s > 0 ? '+' : '−'}j${x}`).attr({ x: p.re * k, y: -p.im * k + 0.03, 'text-anchor': p.re > 0.1 ? 'start' : p.re < -0.1 ? 'end' : 'middle' }).addClass('sm-label');
  }
  const traceLayer = g.group();
  const marks = g.group();
  const node = svg.node;
  const drawing: SmithDrawing = {
    svg, marks, traces: traceLayer,
    toGamma(cx, cy) {
      const b = node.getBoundingClientRect();
      const s = Math.min(b.width, b.height), ox = b.left + (b.width - s) / 2, oy = b.top + (b.height - s) / 2;
      return { re: -VIEW + ((cx - ox) / s) * 2 * VIEW, im: VIEW - ((cy - oy) / s) * 2 * VIEW };
    },
  };
  setSmithTraces(drawing, traces);
  return drawing;
}

/** The reflection traces of a new response, in place of the old ones (the grid stays). */
export function setSmithTraces(d: SmithDrawing, traces: SmithTrace[]): void {
  d.traces.clear();
  for (const t of traces) {
    if (t.re.length < 2) continue;
    let pts = '';
    for (let k = 0; k < t.re.length; k++) pts += `${k ? ' ' : ''}${t.re[k]},${t.im[k]}`;
    const el = d.traces.polyline().addClass(`sm-trace ${t.cls}`).attr('data-trace', t.name);
    el.node.setAttribute('points', pts);
  }
}
