/**
 * Gerber RS-274X with X2 attributes: one file for the top copper, one for the bottom copper (the microstrip ground
 * plane) and one for the board profile.
 *
 * Follows Ucamco, "The Gerber Layer Format Specification" (revision 2022.02):
 * - header before any coordinate: %FSLAX46Y46*% (leading zeros omitted, absolute, 4 integer and 6 decimal digits,
 *   so integers count nanometres of millimetres) and %MOMM*%, each once;
 * - X2 file attributes %TF.GenerationSoftware%, %TF.FileFunction% (Copper,L1,Top / Copper,L2,Bot / Profile,NP) and
 *   %TF.FilePolarity,Positive% and %TF.SameCoordinates% (all files of one export share one frame); the aperture attribute %TA.AperFunction% is set before the objects it
 *   describes (Conductor for copper regions, Profile for the profile draw), and %TD*% clears it at the end;
 * - copper as regions: G36, a D02 move to the first vertex, G01 D01 segments back to the first vertex (closed
 *   contour), G37; holes in copper are regions drawn with clear polarity %LPC*% right after the region they
 *   pierce, then %LPD*% again. Regions are written largest outer contour first, so an island standing in
 *   another region's hole (the network inside a ground-copper window) comes after that hole has been cleared;
 * - only straight segments (G01): the geometry is polygonal, so there is no arc mode to leave on by mistake;
 * - every coordinate written in full (X and Y), and M02* ends the file.
 */
import type { Region } from '../geometry/types.ts';
import { InputError, describe } from '../util/errors.ts';
import { fmtMm, makeFrame, signedArea2, type Frame, type FrameOptions, type PointMm } from './frame.ts';
import { profileRegion, type ExportGeometry } from './layers.ts';

export interface SoftwareInfo {
  /** Written in .GenerationSoftware and file comments; defaults to Stripwright with version 'dev'. */
  application?: string;
  version?: string;
  /**
   * The design's content hash (core/pipeline revisionOf), written as a comment so a file can be traced to the design
   * that made it. Never a timestamp: the same design and options give the same bytes.
   */
  designHash?: string;
}

export interface GerberOptions extends FrameOptions, SoftwareInfo {
  /** Profile aperture diameter, m (default 0.1 mm, a thin line as is common practice for profile layers). */
  profileLine?: number;
}

export interface GerberFiles {
  /** Top copper: network copper and ground copper, as regions. */
  copper: string;
  /**
   * Bottom copper: the microstrip ground plane, one region over the whole board profile (its cut-outs cleared).
   * A board house needs it for a two-layer job; an in-house mill leaves the bottom foil as it is.
   */
  bottom: string;
  /** Board profile (cut line), non-plated. */
  profile: string;
}

/** Text allowed in a Gerber attribute field or G04 comment: no '*', '%' or ','. */
export function gerberSafe(s: string): string {
  return s.replace(/[*%,\r\n]/g, ' ').trim() || '-';
}

/** Integer coordinate in the 4.6 format: millimetres × 10^6 (nanometres). */
export function coord(v: number): string {
  return String(Math.round(v * 1e6));
}

function xy(p: PointMm): string {
  return `X${coord(p.x)}Y${coord(p.y)}`;
}

function header(fileFunction: string, what: string, frame: Frame, sw: SoftwareInfo): string[] {
  const app = gerberSafe(sw.application ?? 'Stripwright'), ver = gerberSafe(sw.version ?? 'dev');
  return [
    `G04 ${app} ${ver} - ${what} - units mm - format 4.6 - origin ${frame.origin === 'board' ? 'board lower-left corner' : 'design origin'}${frame.mirror ? ' - MIRRORED' : ''}*`,
    ...(sw.designHash ? [`G04 design ${gerberSafe(sw.designHash)}*`] : []),
    `%TF.GenerationSoftware,${app},${app},${ver}*%`,
    `%TF.FileFunction,${fileFunction}*%`,
    '%TF.FilePolarity,Positive*%',
    '%TF.SameCoordinates*%',
    '%FSLAX46Y46*%',
    '%MOMM*%',
    '%LPD*%',
    'G01*',
  ];
}

function contour(pts: PointMm[]): string[] {
  const out = [`${xy(pts[0])}D02*`];
  for (let i = 1; i < pts.length; i++) out.push(`${xy(pts[i])}D01*`);
  out.push(`${xy(pts[0])}D01*`);
  return out;
}

/** Copper and profile Gerber files of the board. */
export function toGerber(geometry: ExportGeometry, options: GerberOptions = {}): GerberFiles {
  const frame = makeFrame(geometry, options);
  return { copper: gerberCopper(geometry, frame, options), bottom: gerberBottom(geometry, frame, options), profile: gerberProfile(geometry, frame, options) };
}

function gerberCopper(g: ExportGeometry, frame: Frame, sw: SoftwareInfo): string {
  const regions: { ring: PointMm[]; holes: PointMm[][]; size: number }[] = [...g.groundCopper, ...g.copper].map((r: Region) => {
    const ring = frame.ring(r.outer);
    return { ring, holes: r.holes.map(frame.ring), size: Math.abs(signedArea2(ring)) };
  });
  // Largest outer contour first (stable for equal sizes): see the doc comment on islands in holes.
  const order = regions.map((r, i) => ({ r, i })).sort((a, b) => b.r.size - a.r.size || a.i - b.i).map((x) => x.r);
  const lines = header('Copper,L1,Top', 'top copper', frame, sw);
  lines.push('%TA.AperFunction,Conductor*%');
  for (const r of order) {
    lines.push('G36*', ...contour(r.ring), 'G37*');
    if (r.holes.length > 0) {
      lines.push('%LPC*%');
      for (const h of r.holes) lines.push('G36*', ...contour(h), 'G37*');
      lines.push('%LPD*%');
    }
  }
  lines.push('%TD*%', 'M02*', '');
  return lines.join('\n');
}

function gerberBottom(g: ExportGeometry, frame: Frame, sw: SoftwareInfo): string {
  const region = profileRegion(g);
  const lines = header('Copper,L2,Bot', 'bottom copper (ground plane)', frame, sw);
  lines.push('%TA.AperFunction,Conductor*%', 'G36*', ...contour(frame.ring(region.outer)), 'G37*');
  if (region.holes.length > 0) {
    lines.push('%LPC*%');
    for (const h of region.holes) lines.push('G36*', ...contour(frame.ring(h)), 'G37*');
    lines.push('%LPD*%');
  }
  lines.push('%TD*%', 'M02*', '');
  return lines.join('\n');
}

function gerberProfile(g: ExportGeometry, frame: Frame, opts: GerberOptions): string {
  const d = opts.profileLine ?? 1e-4;
  if (typeof d !== 'number' || !Number.isFinite(d) || d <= 0 || d > 1e-3) {
    throw new InputError('out-of-range', 'profileLine', 'a profile line width above 0 and up to 1 mm', describe(d));
  }
  const region = profileRegion(g);
  const lines = header('Profile,NP', 'board profile', frame, opts);
  lines.push('%TA.AperFunction,Profile*%', `%ADD10C,${fmtMm(d * 1000, 6)}*%`, '%TD*%', 'D10*');
  for (const ring of [region.outer, ...region.holes]) lines.push(...contour(frame.ring(ring)));
  lines.push('M02*', '');
  return lines.join('\n');
}
