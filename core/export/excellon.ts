/**
 * Excellon drill files (the NC drill format of IPC-NC-349 as CAM programs read it), metric, one file for plated and
 * one for non-plated holes, because board houses and CAM programs treat them as separate jobs.
 *
 * - Header M48 … %, with METRIC units and a tool table T<n>C<diameter mm>, one tool per finished diameter
 *   (rounded to 1 µm), smallest first;
 * - every coordinate written with a decimal point and three decimals (µm), so no leading/trailing-zero
 *   convention applies (the classic source of ×10 and ×100 position errors; common practice);
 * - body G90 (absolute), G05 (drill mode), T<n> then X…Y… hits, M30 at the end;
 * - X2 file attributes as comments `; #@! TF.…`, the convention for carrying Gerber attributes in drill files
 *   (.FileFunction Plated/NonPlated,1,2,PTH/NPTH for a two-layer board).
 */
import type { DrillHit } from '../geometry/types.ts';
import { fmtMm, makeFrame, toMm, type Frame, type FrameOptions } from './frame.ts';
import { gerberSafe, type SoftwareInfo } from './gerber.ts';
import type { ExportGeometry } from './layers.ts';

export interface ExcellonOptions extends FrameOptions, SoftwareInfo {}

export interface ExcellonFiles {
  /** Plated holes (vias, connector pins); absent when the board has none. */
  plated?: string;
  /** Non-plated holes (mounting); absent when the board has none. */
  nonPlated?: string;
}

export function toExcellon(geometry: ExportGeometry, options: ExcellonOptions = {}): ExcellonFiles {
  const frame = makeFrame(geometry, options);
  const out: ExcellonFiles = {};
  const plated = geometry.drills.filter((d) => d.plated), np = geometry.drills.filter((d) => !d.plated);
  if (plated.length > 0) out.plated = drillFile(plated, true, frame, options);
  if (np.length > 0) out.nonPlated = drillFile(np, false, frame, options);
  return out;
}

/** Three decimals (1 µm), always with a decimal point. */
function num(v: number): string {
  const s = v.toFixed(3);
  return s === '-0.000' ? '0.000' : s;
}

function drillFile(hits: DrillHit[], plated: boolean, frame: Frame, sw: SoftwareInfo): string {
  const app = gerberSafe(sw.application ?? 'Stripwright'), ver = gerberSafe(sw.version ?? 'dev');
  const diameters = [...new Set(hits.map((h) => Math.round(toMm(h.diameter) * 1000)))].sort((a, b) => a - b);
  const tool = (h: DrillHit) => diameters.indexOf(Math.round(toMm(h.diameter) * 1000)) + 1;
  const lines = [
    'M48',
    `; ${app} ${ver} drill file - ${plated ? 'plated' : 'non-plated'} holes - units mm - origin ${frame.origin === 'board' ? 'board lower-left corner' : 'design origin'}${frame.mirror ? ' - MIRRORED' : ''}`,
    ...(sw.designHash ? [`; design ${gerberSafe(sw.designHash)}`] : []),
    `; #@! TF.GenerationSoftware,${app},${app},${ver}`,
    `; #@! TF.FileFunction,${plated ? 'Plated,1,2,PTH' : 'NonPlated,1,2,NPTH'}`,
    '; #@! TF.FilePolarity,Positive',
    '; #@! TF.SameCoordinates',
    'FMAT,2',
    'METRIC,TZ',
    ...diameters.map((um, i) => `T${i + 1}C${num(um / 1000)}`),
    '%',
    'G90',
    'G05',
  ];
  for (let t = 1; t <= diameters.length; t++) {
    const own = hits.filter((h) => tool(h) === t).map((h) => frame.point(h.at))
      .sort((a, b) => a.y - b.y || a.x - b.x);
    lines.push(`T${t}`);
    for (const p of own) lines.push(`X${num(p.x)}Y${num(p.y)}`);
  }
  lines.push('M30', '');
  return lines.join('\n');
}

/** For reports and the CLI: the tool table of a set of hits, mm. */
export function drillSummary(hits: DrillHit[]): { diameterMm: string; count: number; plated: boolean }[] {
  const m = new Map<string, { diameterMm: string; count: number; plated: boolean }>();
  for (const h of hits) {
    const k = `${h.plated}|${fmtMm(toMm(h.diameter), 3)}`;
    const e = m.get(k) ?? { diameterMm: fmtMm(toMm(h.diameter), 3), count: 0, plated: h.plated };
    e.count++;
    m.set(k, e);
  }
  return [...m.values()];
}
