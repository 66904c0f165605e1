/**
 * Sizing tables of a laminate and process: the field solution at TABLE_POINTS widths (log-spaced over W/h
 * TABLE_U_MIN–TABLE_U_MAX, and no narrower than 1.5 t), interpolated in ln W by natural cubic splines of ln Z0, εeff and ln ∂L/∂n, served to the
 * line layer as a CrossSectionSource (core/line/cross-section.ts). Built once per cross-section template and kept
 * in a small memo (the faces re-size on every edit; the worker builds a table on first use and reuses it).
 */
import { InputError } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';
import type { CrossSectionSource, CrossSectionStatics } from '../line/cross-section.ts';
import { solveSection } from './quasi-static-fd.ts';
import type { SectionSpec } from './types.ts';

/**
 * Solves per table. 16 log-spaced widths over W/h 0.05–20 interpolate the solver to within 0.06 % in Z0 and 0.03 % in
 * εeff of a 30-width table (plain microstrip and an end-milled line, measured when the count was chosen; the test in
 * test/unit/section-sizing.test.ts holds it to 0.1 % against direct solves), well inside the solver's own estimate.
 */
export const TABLE_POINTS = 16;
export const TABLE_U_MIN = 0.05;
export const TABLE_U_MAX = 20;

/** A cross-section without its width: what a laminate and process put around every line. */
export type SectionTemplate = Omit<SectionSpec, 'width' | 'spacing'>;

/** Natural cubic spline through (x[i], y[i]), x increasing: returns the second derivatives. */
function splineSecond(x: number[], y: number[]): number[] {
  const n = x.length;
  const m = new Array<number>(n).fill(0);
  const c = new Array<number>(n).fill(0), d = new Array<number>(n).fill(0);
  for (let i = 1; i < n - 1; i++) {
    const h0 = x[i]! - x[i - 1]!, h1 = x[i + 1]! - x[i]!;
    const a = h0, b = 2 * (h0 + h1), cc = h1;
    const r = 6 * ((y[i + 1]! - y[i]!) / h1 - (y[i]! - y[i - 1]!) / h0);
    const den = b - a * c[i - 1]!;
    c[i] = cc / den; d[i] = (r - a * d[i - 1]!) / den;
  }
  for (let i = n - 2; i >= 1; i--) m[i] = d[i]! - c[i]! * m[i + 1]!;
  return m;
}

function splineAt(x: number[], y: number[], m: number[], t: number): number {
  let lo = 0, hi = x.length - 1;
  while (hi - lo > 1) { const mid = (lo + hi) >> 1; if (x[mid]! > t) hi = mid; else lo = mid; }
  const h = x[hi]! - x[lo]!;
  const a = (x[hi]! - t) / h, b = (t - x[lo]!) / h;
  return a * y[lo]! + b * y[hi]! + ((a * a * a - a) * m[lo]! + (b * b * b - b) * m[hi]!) * (h * h) / 6;
}

export interface SectionTable extends CrossSectionSource {
  readonly template: SectionTemplate;
  /** The solved widths (m) with their static values, for the docs and the tests. */
  readonly points: { width: number; z0: number; epsEff: number; dLdn: number; z0Error: number }[];
}

function keyOf(t: SectionTemplate): string {
  return `section:${JSON.stringify([t.er, t.h, t.t, t.etchAngleDeg ?? 90, t.side ?? null, t.trench ?? null, t.cover ?? null, t.lid ?? null])}`;
}

/** Words for the piece sheet. */
export function describeTemplate(t: SectionTemplate): string {
  const mm = (x: number) => `${Number((x * 1e3).toPrecision(3))} mm`;
  const parts: string[] = [];
  if (t.side) parts.push(`${t.side.connection} side copper at ${mm(t.side.gap)}`);
  if (t.trench && t.trench.depth > 0) parts.push(`${mm(t.trench.depth)} trench`);
  if (t.cover && t.cover.thickness > 0) parts.push(`${mm(t.cover.thickness)} cover εr ${t.cover.er}`);
  if (t.lid !== undefined) parts.push(`lid at ${mm(t.lid)}`);
  return `2-D field solution${parts.length ? `: ${parts.join(', ')}` : ''}`;
}

/** Builds the table (`points` solves, TABLE_POINTS unless asked otherwise). */
export function buildSectionTable(template: SectionTemplate, points = TABLE_POINTS): SectionTable {
  const h = template.h;
  // Strips narrower than 1.5× their thickness are not lines anyone mills; they would only cost the finest grids.
  const wMin = Math.max(TABLE_U_MIN * h, 1.5 * template.t), wMax = TABLE_U_MAX * h;
  const xs: number[] = [], lz: number[] = [], ee: number[] = [], ld: number[] = [];
  const solved: SectionTable['points'] = [];
  const warnings: Warning[] = [];
  let worst = 0;
  for (let i = 0; i < points; i++) {
    const width = wMin * (wMax / wMin) ** (i / (points - 1));
    const r = solveSection({ ...template, width }, { loss: template.t > 0 });
    const m = r.modes[0]!;
    xs.push(Math.log(width)); lz.push(Math.log(m.z0)); ee.push(m.epsEff); ld.push(m.dLdn > 0 ? Math.log(m.dLdn) : 0);
    solved.push({ width, z0: m.z0, epsEff: m.epsEff, dLdn: m.dLdn, z0Error: m.error.z0 });
    worst = Math.max(worst, m.error.z0);
    for (const w of r.warnings) if (w.severity !== 'info' && !warnings.some((x) => x.message === w.message)) warnings.push(w);
  }
  const mz = splineSecond(xs, lz), me = splineSecond(xs, ee), ml = splineSecond(xs, ld);
  const hasLoss = template.t > 0;
  const label = describeTemplate(template);
  if (worst > 0.005) warnings.push(warn('validity', `the cross-section tables are uncertain by up to ${(worst * 100).toFixed(2)} % in Z0`, { source: 'section-solver' }));
  return {
    key: keyOf(template), label, template, points: solved,
    widthRange: { min: wMin, max: wMax },
    staticAt(width: number): CrossSectionStatics {
      if (!(width >= wMin * (1 - 1e-9) && width <= wMax * (1 + 1e-9))) {
        throw new InputError('out-of-range', 'width', `a width from ${Number((wMin * 1e3).toPrecision(3))} mm to ${Number((wMax * 1e3).toPrecision(3))} mm, the range of the cross-section tables`, `${width} m`);
      }
      const x = Math.min(xs[xs.length - 1]!, Math.max(xs[0]!, Math.log(width)));
      return {
        z0: Math.exp(splineAt(xs, lz, mz, x)), epsEff: splineAt(xs, ee, me, x),
        dLdn: hasLoss ? Math.exp(splineAt(xs, ld, ml, x)) : 0, z0Error: worst, warnings,
      };
    },
  };
}

const memo = new Map<string, SectionTable>();
const MEMO_LIMIT = 8;

/** The table for `template`, built on first use and remembered (the last MEMO_LIMIT templates). */
export function sectionTable(template: SectionTemplate): SectionTable {
  const key = keyOf(template);
  let t = memo.get(key);
  if (t) { memo.delete(key); memo.set(key, t); return t; }
  t = buildSectionTable(template);
  memo.set(key, t);
  if (memo.size > MEMO_LIMIT) memo.delete(memo.keys().next().value!);
  return t;
}
