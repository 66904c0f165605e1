/**
 * Drawing of the response plots on a 2-D canvas, framework-free: the base layer (grid, axes, f0 and band marks,
 * traces through their swept points only) and the marker layer (marker lines, a dot where each marker meets each
 * trace). The marker layer is drawn alone while a marker is dragged, so a drag never redraws the traces.
 * Arithmetic (ticks, wrapping, reading a trace at a marker) comes from lib/plot-math.ts.
 */
import { niceTicks, tickDecimals, valueAt, wrapDeg, wrapsBetween, indexBelow, type Range } from '../lib/plot-math.ts';

export interface PlotSeries {
  label: string;
  /** Own frequencies (Hz), strictly increasing; the values are in plot units (dB, degrees, ns). */
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  colour: string;
  dash: readonly number[];
  width: number;
}

export interface PlotMarker { id: number; f: number; active: boolean }

export interface PlotFrame {
  /** CSS pixels of the canvas. */
  width: number;
  height: number;
  /** Plot area inside the margins. */
  left: number; top: number; right: number; bottom: number;
  /** The frequency window (Hz) and the value range shown. */
  xr: Range;
  yr: Range;
  /** Phase plots wrap to (−180°, 180°] and break their lines at a wrap. */
  wrap: boolean;
}

export interface PlotInk { ink: string; muted: string; grid: string; band: string; f0: string; marker: string; font: string }

export const MARGIN = { left: 54, right: 12, top: 10, bottom: 30 };

export function makeFrame(width: number, height: number, xr: Range, series: PlotSeries[], wrap: boolean): PlotFrame {
  const left = MARGIN.left, top = MARGIN.top, right = Math.max(left + 10, width - MARGIN.right), bottom = Math.max(top + 10, height - MARGIN.bottom);
  return { width, height, left, top, right, bottom, xr, yr: wrap ? { lo: -180, hi: 180 } : valueRange(series, xr), wrap };
}

/** The values shown in the window, padded by 6 % (a flat trace gets ±1 unit). */
function valueRange(series: PlotSeries[], xr: Range): Range {
  let lo = Infinity, hi = -Infinity;
  for (const s of series) {
    const n = Math.min(s.x.length, s.y.length);
    const a = Math.max(0, indexBelow(s.x, xr.lo)), b = Math.min(n - 1, indexBelow(s.x, xr.hi) + 1);
    for (let k = a; k <= b; k++) { const v = s.y[k]!; if (Number.isFinite(v) && v > -300) { if (v < lo) lo = v; if (v > hi) hi = v; } }
  }
  if (!(hi >= lo)) return { lo: -1, hi: 1 };
  if (hi - lo < 1e-9 * Math.max(1, Math.abs(hi))) return { lo: lo - 1, hi: hi + 1 };
  const pad = 0.06 * (hi - lo);
  return { lo: lo - pad, hi: hi + pad };
}

export const px = (fr: PlotFrame, f: number) => fr.left + ((f - fr.xr.lo) / (fr.xr.hi - fr.xr.lo)) * (fr.right - fr.left);
export const py = (fr: PlotFrame, v: number) => fr.bottom - ((v - fr.yr.lo) / (fr.yr.hi - fr.yr.lo)) * (fr.bottom - fr.top);
export const fAt = (fr: PlotFrame, x: number) => fr.xr.lo + ((x - fr.left) / (fr.right - fr.left)) * (fr.xr.hi - fr.xr.lo);

/** Grid, axes with labelled ticks, the band (shaded) and f0 (a line), then every trace. */
export function drawBase(ctx: CanvasRenderingContext2D, fr: PlotFrame, series: PlotSeries[], marks: { f0: number; band: Range }, ink: PlotInk, yLabel: string): void {
  ctx.clearRect(0, 0, fr.width, fr.height);
  ctx.font = ink.font;
  ctx.lineWidth = 1;
  // The design band, shaded, with its edges dashed.
  const b0 = Math.max(fr.left, px(fr, marks.band.lo)), b1 = Math.min(fr.right, px(fr, marks.band.hi));
  if (b1 > b0) { ctx.fillStyle = ink.band; ctx.fillRect(b0, fr.top, b1 - b0, fr.bottom - fr.top); }
  const xt = niceTicks(fr.xr.lo / 1e9, fr.xr.hi / 1e9, Math.max(3, Math.floor((fr.right - fr.left) / 70)));
  const yt = fr.wrap ? [-180, -135, -90, -45, 0, 45, 90, 135, 180] : niceTicks(fr.yr.lo, fr.yr.hi, Math.max(3, Math.floor((fr.bottom - fr.top) / 34)));
  const xd = tickDecimals(xt), yd = fr.wrap ? 0 : tickDecimals(yt);
  ctx.strokeStyle = ink.grid;
  ctx.fillStyle = ink.muted;
  ctx.textAlign = 'center'; ctx.textBaseline = 'top';
  for (const t of xt) {
    const x = Math.round(px(fr, t * 1e9)) + 0.5;
    ctx.beginPath(); ctx.moveTo(x, fr.top); ctx.lineTo(x, fr.bottom); ctx.stroke();
    ctx.fillText(t.toFixed(xd), x, fr.bottom + 4);
  }
  ctx.textAlign = 'right'; ctx.textBaseline = 'middle';
  for (const t of yt) {
    const y = Math.round(py(fr, t)) + 0.5;
    if (y < fr.top - 1 || y > fr.bottom + 1) continue;
    ctx.beginPath(); ctx.moveTo(fr.left, y); ctx.lineTo(fr.right, y); ctx.stroke();
    ctx.fillText(t.toFixed(yd), fr.left - 5, y);
  }
  ctx.textAlign = 'right'; ctx.textBaseline = 'bottom';
  ctx.fillText('GHz', fr.right, fr.height - 1);
  ctx.save(); ctx.translate(11, (fr.top + fr.bottom) / 2); ctx.rotate(-Math.PI / 2); ctx.textAlign = 'center'; ctx.textBaseline = 'middle'; ctx.fillText(yLabel, 0, 0); ctx.restore();
  // Band edges and f0.
  ctx.setLineDash([3, 3]); ctx.strokeStyle = ink.f0;
  for (const e of [marks.band.lo, marks.band.hi]) { const x = px(fr, e); if (x >= fr.left && x <= fr.right) { ctx.beginPath(); ctx.moveTo(x, fr.top); ctx.lineTo(x, fr.bottom); ctx.stroke(); } }
  ctx.setLineDash([]);
  const x0 = px(fr, marks.f0);
  if (x0 >= fr.left && x0 <= fr.right) {
    ctx.beginPath(); ctx.moveTo(x0, fr.top); ctx.lineTo(x0, fr.bottom); ctx.stroke();
    ctx.fillStyle = ink.f0; ctx.textAlign = 'left'; ctx.textBaseline = 'top'; ctx.fillText('f0', x0 + 3, fr.top + 1);
  }
  ctx.strokeStyle = ink.ink;
  ctx.strokeRect(fr.left + 0.5, fr.top + 0.5, fr.right - fr.left, fr.bottom - fr.top);
  // Traces, clipped to the plot area, through their swept points only.
  ctx.save();
  ctx.beginPath(); ctx.rect(fr.left, fr.top, fr.right - fr.left, fr.bottom - fr.top); ctx.clip();
  for (const s of series) drawTrace(ctx, fr, s);
  ctx.restore();
}

function drawTrace(ctx: CanvasRenderingContext2D, fr: PlotFrame, s: PlotSeries): void {
  const n = Math.min(s.x.length, s.y.length);
  if (n === 0) return;
  const a = Math.max(0, indexBelow(s.x, fr.xr.lo)), b = Math.min(n - 1, indexBelow(s.x, fr.xr.hi) + 1);
  ctx.strokeStyle = s.colour; ctx.lineWidth = s.width; ctx.setLineDash(s.dash as number[]);
  ctx.beginPath();
  let prev = NaN;
  for (let k = a; k <= b; k++) {
    const v = fr.wrap ? wrapDeg(s.y[k]!) : s.y[k]!;
    const x = px(fr, s.x[k]!), y = py(fr, Math.max(fr.yr.lo - 1e6, Math.min(fr.yr.hi + 1e6, v)));
    if (k === a || (fr.wrap && wrapsBetween(prev, v))) ctx.moveTo(x, y); else ctx.lineTo(x, y);
    prev = v;
  }
  if (a === b) ctx.arc(px(fr, s.x[a]!), py(fr, s.y[a]!), 2, 0, 2 * Math.PI);
  ctx.stroke();
  ctx.setLineDash([]);
}

/** Marker lines with their names and a dot where each meets each trace (read between swept points). */
export function drawMarkers(ctx: CanvasRenderingContext2D, fr: PlotFrame, series: PlotSeries[], markers: PlotMarker[], ink: PlotInk, names: (id: number) => string): void {
  ctx.clearRect(0, 0, fr.width, fr.height);
  ctx.font = ink.font;
  for (const m of markers) {
    const x = px(fr, m.f);
    if (x < fr.left - 0.5 || x > fr.right + 0.5) continue;
    ctx.strokeStyle = ink.marker; ctx.lineWidth = m.active ? 2 : 1;
    ctx.beginPath(); ctx.moveTo(x, fr.top); ctx.lineTo(x, fr.bottom); ctx.stroke();
    ctx.fillStyle = ink.marker; ctx.textAlign = 'center'; ctx.textBaseline = 'bottom';
    ctx.fillText(names(m.id), x, fr.top + 12);
    for (const s of series) {
      let v = valueAt(s.x, s.y, m.f);
      if (fr.wrap) v = wrapDeg(v);
      const y = py(fr, v);
      if (y < fr.top || y > fr.bottom) continue;
      ctx.fillStyle = s.colour;
      ctx.beginPath(); ctx.arc(x, y, 3.5, 0, 2 * Math.PI); ctx.fill();
      ctx.strokeStyle = ink.ink; ctx.lineWidth = 1; ctx.stroke();
    }
  }
}
