/**
 * Plots of the report, drawn by the core as vectors: a frequency plot (axes, ticks with values, grid, one polyline
 * per trace, a legend) and a Smith chart (resistance and reactance circles with labels, one trace per reflection).
 * Every plot returns its items and the mapping it used, so a test can find a rendered trace and read it back.
 */
import { formatQuantity } from '../../units/index.ts';
import { GREY, INK, RULE, line, rect, text, type DrawItem, type Rgb } from './drawing.ts';

export interface PlotTrace { label: string; values: ArrayLike<number>; colour: Rgb; dash?: readonly [number, number] }

export interface PlotBox { x: number; y: number; w: number; h: number }

export interface FrequencyPlot {
  items: DrawItem[];
  /** The data window: page mm of the plotting area and the values at its edges. */
  area: PlotBox;
  xRange: [number, number];
  yRange: [number, number];
}

/** Tick step of about `span / n`: 1, 2 or 5 times a power of ten (common practice for plot axes). */
export function niceStep(span: number, n: number): number {
  const raw = span / Math.max(1, n);
  const p = Math.pow(10, Math.floor(Math.log10(raw)));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
}

/** The y window: the traces' extent widened to whole steps, never narrower than `minSpan`. */
export function valueRange(traces: readonly PlotTrace[], minSpan: number, clampLow = -Infinity): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (const t of traces) for (let k = 0; k < t.values.length; k++) {
    const v = Math.max(clampLow, t.values[k]!);
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!(hi >= lo)) { lo = 0; hi = 1; }
  if (hi - lo < minSpan) { const m = (hi + lo) / 2; lo = m - minSpan / 2; hi = m + minSpan / 2; }
  const step = niceStep(hi - lo, 6);
  return [Math.floor(lo / step) * step, Math.ceil(hi / step) * step];
}

const f3 = (v: number) => { const s = Number(v.toPrecision(6)).toString(); return s === '-0' ? '0' : s; };

export function frequencyPlot(box: PlotBox, freqs: ArrayLike<number>, traces: readonly PlotTrace[], opts: {
  yLabel: string; yRange: [number, number]; marks?: { f: number; label: string }[]; yStep?: number;
}): FrequencyPlot {
  const items: DrawItem[] = [];
  // Room for the y label above, the tick labels on the left, the frequency labels and the legend (3 a row) below.
  const rows = Math.ceil(traces.length / 3);
  const area: PlotBox = { x: box.x + 14, y: box.y + 5, w: box.w - 16, h: box.h - 11 - 4 * rows };
  const f0 = freqs[0]!, f1 = freqs[freqs.length - 1]!;
  const xr: [number, number] = f1 > f0 ? [f0, f1] : [f0 * 0.99, f0 * 1.01];
  const [y0, y1] = opts.yRange;
  const X = (f: number) => area.x + ((f - xr[0]) / (xr[1] - xr[0])) * area.w;
  const Y = (v: number) => area.y + area.h - ((Math.min(y1, Math.max(y0, v)) - y0) / (y1 - y0)) * area.h;
  const ys = opts.yStep ?? niceStep(y1 - y0, 6);
  for (let v = y0; v <= y1 + ys * 1e-6; v += ys) {
    items.push(line(area.x, Y(v), area.x + area.w, Y(v), 0.1, RULE));
    items.push(text(area.x - 1.2, Y(v) + 1, 6.5, f3(v), 'end', GREY));
  }
  const xs = niceStep(xr[1] - xr[0], 6);
  for (let f = Math.ceil(xr[0] / xs) * xs; f <= xr[1] + xs * 1e-6; f += xs) {
    items.push(line(X(f), area.y, X(f), area.y + area.h, 0.1, RULE));
    items.push(text(X(f), area.y + area.h + 3.5, 6.5, formatQuantity(f, 'frequency', { digits: 4 }), 'middle', GREY));
  }
  for (const m of opts.marks ?? []) {
    if (m.f < xr[0] || m.f > xr[1]) continue;
    items.push(line(X(m.f), area.y, X(m.f), area.y + area.h, 0.15, GREY, [0.8, 0.8]));
    items.push(text(X(m.f) + 0.8, area.y + 2.5, 6, m.label, 'start', GREY));
  }
  items.push(rect(area.x, area.y, area.w, area.h, 0.25, INK));
  items.push(text(box.x, area.y - 1.5, 7, opts.yLabel, 'start', INK));
  for (const t of traces) {
    const pts: [number, number][] = [];
    for (let k = 0; k < freqs.length; k++) pts.push([X(freqs[k]!), Y(t.values[k]!)]);
    items.push({ kind: 'stroke', points: pts, closed: false, width: 0.35, colour: t.colour, ...(t.dash ? { dash: t.dash } : {}) });
  }
  // Legend under the frequency labels.
  traces.forEach((t, k) => {
    const lx = area.x + (k % 3) * (area.w / 3), ly = area.y + area.h + 8 + 4 * Math.floor(k / 3);
    items.push({ kind: 'stroke', points: [[lx, ly - 1], [lx + 6, ly - 1]], closed: false, width: 0.5, colour: t.colour, ...(t.dash ? { dash: t.dash } : {}) });
    items.push(text(lx + 7, ly, 6.5, t.label, 'start', INK));
  });
  return { items, area, xRange: xr, yRange: [y0, y1] };
}

export interface SmithTrace { label: string; re: ArrayLike<number>; im: ArrayLike<number>; colour: Rgb }

/**
 * A Smith chart of centre (cx, cy) and radius R (mm): Γ = u + jv drawn at (cx + R·u, cy − R·v). Resistance circles
 * r = 0.2, 0.5, 1, 2, 5 (centre r/(1+r), radius 1/(1+r)) and reactance arcs x = ±0.2, ±0.5, ±1, ±2, ±5 (centre
 * (1, 1/x), radius 1/|x|, kept inside |Γ| ≤ 1) — the usual chart construction (P. H. Smith, Electronics, Jan. 1939).
 */
export function smithChart(cx: number, cy: number, R: number, traces: readonly SmithTrace[]): DrawItem[] {
  const items: DrawItem[] = [];
  const P = (u: number, v: number): [number, number] => [cx + R * u, cy - R * v];
  const circle = (uc: number, vc: number, r: number, keep: (u: number, v: number) => boolean) => {
    let run: [number, number][] = [];
    const flush = () => { if (run.length > 1) items.push({ kind: 'stroke', points: run, closed: false, width: 0.12, colour: RULE }); run = []; };
    for (let k = 0; k <= 240; k++) {
      const a = (2 * Math.PI * k) / 240;
      const u = uc + r * Math.cos(a), v = vc + r * Math.sin(a);
      if (keep(u, v)) run.push(P(u, v)); else flush();
    }
    flush();
  };
  const inside = (u: number, v: number) => u * u + v * v <= 1 + 1e-9;
  for (const r of [0.2, 0.5, 1, 2, 5]) {
    circle(r / (1 + r), 0, 1 / (1 + r), () => true);
    const [x, y] = P((r - 1) / (r + 1), 0);
    items.push(text(x + 0.4, y - 0.6, 5, f3(r), 'start', GREY));
  }
  for (const x of [0.2, 0.5, 1, 2, 5]) {
    for (const s of [1, -1]) {
      circle(1, s / x, 1 / x, inside);
      // Label where the arc meets the unit circle: Γ = ((x² − 1) + 2jx)/(x² + 1) for z = jx.
      const u = (x * x - 1) / (x * x + 1), v = (s * 2 * x) / (x * x + 1);
      const [px, py] = P(u * 1.07, v * 1.07);
      items.push(text(px, py + 1, 5, `${s > 0 ? '+' : '−'}j${f3(x)}`, 'middle', GREY));
    }
  }
  items.push(line(...P(-1, 0), ...P(1, 0), 0.12, RULE));
  circle(0, 0, 1, () => true);
  items.push({ kind: 'stroke', points: Array.from({ length: 241 }, (_, k) => P(Math.cos((2 * Math.PI * k) / 240), Math.sin((2 * Math.PI * k) / 240))), closed: true, width: 0.3, colour: INK });
  for (const t of traces) {
    const pts: [number, number][] = [];
    for (let k = 0; k < t.re.length; k++) pts.push(P(t.re[k]!, t.im[k]!));
    items.push({ kind: 'stroke', points: pts, closed: false, width: 0.35, colour: t.colour });
  }
  let ly = cy + R + 6;
  for (const t of traces) {
    items.push({ kind: 'stroke', points: [[cx - R, ly - 1], [cx - R + 6, ly - 1]], closed: false, width: 0.5, colour: t.colour });
    items.push(text(cx - R + 7, ly, 6.5, t.label, 'start', INK));
    ly += 3.5;
  }
  return items;
}
