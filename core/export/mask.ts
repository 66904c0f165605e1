/**
 * Photo mask (also toner-transfer artwork): a print-ready 1:1 sheet as SVG, page A4 (210 × 297 mm, ISO 216) or US
 * Letter (8.5 × 11 in = 215.9 × 279.4 mm), width and height in mm with a matching viewBox so a browser or viewer
 * printing at "actual size" / 100 % reproduces it true to scale.
 *
 * On the sheet: the top copper (network + ground copper) in the chosen polarity, optionally mirrored; drill centres
 * as small no-copper dots so the etched copper guides the drill; four registration marks around the board; a
 * 100 mm scale bar with 10 mm ticks to check the printed scale with a ruler; and the sheet's state written out
 * ("POSITIVE, MIRRORED, bias +0.035 mm") so a film is never used the wrong way round.
 *
 * Polarity: 'positive' = copper opaque (black), the rest clear — for positive-working resist and toner transfer;
 * 'negative' = copper clear, the board area around it opaque — for negative-working resist such as dry film
 * (common practice; check your resist's data sheet).
 */
import { InputError, describe } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { fmtMm, makeFrame, roundMm, toMm, type PointMm } from './frame.ts';
import { regionPath } from './svg.ts';
import { withEtchBias } from './bias.ts';
import type { ExportGeometry } from './layers.ts';

export type PageSize = 'a4' | 'letter';
export type Polarity = 'positive' | 'negative';

/** Page sizes, mm (ISO 216 A4; ANSI/ASME Y14.1 Letter 8.5 × 11 in). */
export const PAGES: Record<PageSize, { w: number; h: number; name: string }> = {
  a4: { w: 210, h: 297, name: 'A4' },
  letter: { w: 215.9, h: 279.4, name: 'Letter' },
};

export interface MaskOptions {
  page?: PageSize;
  polarity?: Polarity;
  /** Mirror left-right (emulsion or toner facing the copper; common practice for top-side artwork). */
  mirror?: boolean;
  /** Etch bias per edge, m (positive grows copper). Needs the polygon engine when non-zero. */
  bias?: number;
  /** Mark drill centres with no-copper dots (default true). */
  drillMarks?: boolean;
  /** Free text for the sheet's title line (e.g. the design name). */
  title?: string;
}

export interface Mask {
  svg: string;
  warnings: Warning[];
  /** Where things are on the page, mm from the top-left corner (y down): for tests and for print previews. */
  layout: {
    page: { w: number; h: number; landscape: boolean };
    /** The board box on the page. */
    board: { x: number; y: number; w: number; h: number };
    /** The scale bar: left end, length, thickness. */
    scaleBar: { x: number; y: number; length: number; height: number };
    registration: PointMm[];
  };
}

/** Printer margin kept free on every side, mm (most printers cannot print the outer 3–6 mm; common practice). */
const PRINT_MARGIN = 10;
/** Opaque surround of a negative board area, mm. */
const SURROUND = 3;
/** Registration mark centre distance outside the board corner, mm, and mark radius. */
const MARK_OFFSET = 8, MARK_R = 2.5;
const TEXT_BLOCK = 16, BAR_BLOCK = 16, BAR_LENGTH = 100, BAR_H = 1;
/** Drill centre dot diameter, mm (or the hole, if smaller). */
const DRILL_DOT = 0.5;

export function toMask(geometry: ExportGeometry, options: MaskOptions = {}): Mask {
  const pageName = options.page ?? 'a4';
  if (!(pageName in PAGES)) throw new InputError('bad-choice', 'page', "'a4' or 'letter'", describe(pageName));
  const polarity = options.polarity ?? 'positive';
  if (polarity !== 'positive' && polarity !== 'negative') throw new InputError('bad-choice', 'polarity', "'positive' or 'negative'", describe(polarity));
  const mirror = options.mirror ?? false;
  const bias = options.bias ?? 0;
  const { geometry: g, warnings } = bias !== 0 ? withEtchBias(geometry, bias) : { geometry, warnings: [] as Warning[] };
  // The frame box is the unbiased board, so a bias never moves the board on the page.
  const base = makeFrame(geometry, { origin: 'board', mirror });
  const frame = makeFrame(g, { origin: 'board', mirror });
  const W = base.width, H = base.height;
  const needW = W + 2 * (MARK_OFFSET + MARK_R + 1);
  const needH = TEXT_BLOCK + H + 2 * (MARK_OFFSET + MARK_R + 1) + BAR_BLOCK;
  const sheet = PAGES[pageName];
  let pw = sheet.w, ph = sheet.h, landscape = false;
  const fits = (w: number, h: number) => needW <= w - 2 * PRINT_MARGIN && needH <= h - 2 * PRINT_MARGIN && BAR_LENGTH <= w - 2 * PRINT_MARGIN;
  if (!fits(pw, ph)) {
    if (fits(ph, pw)) { [pw, ph] = [ph, pw]; landscape = true; }
    else {
      const maxW = roundMm(Math.max(sheet.w, sheet.h) - 2 * PRINT_MARGIN - (needW - W));
      const maxH = roundMm(Math.min(sheet.w, sheet.h) - 2 * PRINT_MARGIN - (needH - H));
      throw new InputError('impossible-layout', 'page', `a board that fits a ${sheet.name} sheet with marks and scale bar (up to about ${fmtMm(maxW, 1)} × ${fmtMm(maxH, 1)} mm landscape)`,
        `a board of ${fmtMm(W, 1)} × ${fmtMm(H, 1)} mm`, pageName === 'a4' ? 'try --page letter, or export DXF/Gerber, which have no page limit' : 'try --page a4, or export DXF/Gerber, which have no page limit');
    }
  }
  const bx = roundMm((pw - W) / 2), by = roundMm(PRINT_MARGIN + TEXT_BLOCK + MARK_OFFSET + MARK_R + 1);
  const place = (p: PointMm): PointMm => ({ x: roundMm(p.x - base.box.minX + bx), y: roundMm(base.box.maxY - p.y + by) });
  const ink = '#000000', paper = '#ffffff';
  const copperColour = polarity === 'positive' ? ink : paper;
  const fieldColour = polarity === 'positive' ? paper : ink;
  const copper = [...g.groundCopper, ...g.copper].map((r) => regionPath(frame, place, r)).join(' ');
  const body: string[] = [];
  if (polarity === 'negative') {
    // One even-odd path: the opaque field with the copper cut out of it (clear on film, nothing printed on paper).
    const x0 = roundMm(bx - SURROUND), y0 = roundMm(by - SURROUND), x1 = roundMm(bx + W + SURROUND), y1 = roundMm(by + H + SURROUND);
    const field = `M${fmtMm(x0)} ${fmtMm(y0)} L${fmtMm(x1)} ${fmtMm(y0)} L${fmtMm(x1)} ${fmtMm(y1)} L${fmtMm(x0)} ${fmtMm(y1)} Z`;
    body.push(`<g id="copper" data-polarity="negative"><path fill="${ink}" fill-rule="evenodd" d="${field}${copper ? ' ' + copper : ''}"/></g>`);
  } else {
    body.push(`<g id="copper" data-polarity="positive"><path fill="${copperColour}" fill-rule="evenodd" d="${copper}"/></g>`);
  }
  if (options.drillMarks ?? true) {
    const dots = g.drills.map((hit) => {
      const c = place(frame.point(hit.at));
      const r = roundMm(Math.min(DRILL_DOT, toMm(hit.diameter)) / 2);
      return `<circle cx="${fmtMm(c.x)}" cy="${fmtMm(c.y)}" r="${fmtMm(r)}"/>`;
    });
    if (dots.length) body.push(`<g id="drill-centres" fill="${fieldColour}">`, ...dots, '</g>');
  }
  const registration: PointMm[] = [
    { x: bx - MARK_OFFSET, y: by - MARK_OFFSET }, { x: bx + W + MARK_OFFSET, y: by - MARK_OFFSET },
    { x: bx + W + MARK_OFFSET, y: by + H + MARK_OFFSET }, { x: bx - MARK_OFFSET, y: by + H + MARK_OFFSET },
  ].map((p) => ({ x: roundMm(p.x), y: roundMm(p.y) }));
  body.push(`<g id="registration" fill="none" stroke="${ink}" stroke-width="0.15">`);
  for (const m of registration) {
    const l = MARK_R + 1;
    body.push(`<circle cx="${fmtMm(m.x)}" cy="${fmtMm(m.y)}" r="${MARK_R}"/><path d="M${fmtMm(m.x - l)} ${fmtMm(m.y)} L${fmtMm(m.x + l)} ${fmtMm(m.y)} M${fmtMm(m.x)} ${fmtMm(m.y - l)} L${fmtMm(m.x)} ${fmtMm(m.y + l)}"/>`);
  }
  body.push('</g>');
  // Scale bar: a filled bar exactly BAR_LENGTH mm long, ticks every 10 mm hanging below it, kept inside its ends.
  const sx = roundMm((pw - BAR_LENGTH) / 2), sy = roundMm(by + H + MARK_OFFSET + MARK_R + 1 + 6);
  const ticks: string[] = [];
  for (let k = 0; k <= BAR_LENGTH; k += 10) {
    const tw = 0.2, len = k % 50 === 0 ? 3 : 1.8;
    const tx = k === 0 ? sx : k === BAR_LENGTH ? sx + BAR_LENGTH - tw : sx + k - tw / 2;
    ticks.push(`<rect x="${fmtMm(roundMm(tx))}" y="${fmtMm(roundMm(sy + BAR_H))}" width="${tw}" height="${len}"/>`);
    if (k % 50 === 0) ticks.push(`<text x="${fmtMm(roundMm(sx + k))}" y="${fmtMm(roundMm(sy + BAR_H + 6.5))}" text-anchor="middle">${k === BAR_LENGTH ? `${k} mm` : k}</text>`);
  }
  body.push(`<g id="scale-bar" fill="${ink}" font-family="sans-serif" font-size="3">`,
    `<rect id="scale-bar-line" x="${fmtMm(sx)}" y="${fmtMm(sy)}" width="${BAR_LENGTH}" height="${BAR_H}"/>`, ...ticks, '</g>');
  const state = [polarity.toUpperCase(), mirror ? 'MIRRORED' : 'NOT MIRRORED', `etch bias ${bias >= 0 ? '+' : '−'}${Math.abs(toMm(bias)).toFixed(3)} mm per edge`].join(', ');
  const title = options.title ? escapeXml(options.title.slice(0, 80)) + ' — ' : '';
  body.push(`<g id="notes" fill="${ink}" font-family="sans-serif" font-size="3">`,
    `<text x="${PRINT_MARGIN}" y="${PRINT_MARGIN + 3}">${title}Stripwright photo mask, top copper</text>`,
    `<text x="${PRINT_MARGIN}" y="${PRINT_MARGIN + 7}">${state}. Board ${fmtMm(W, 3)} × ${fmtMm(H, 3)} mm.</text>`,
    `<text x="${PRINT_MARGIN}" y="${PRINT_MARGIN + 11}">Print at 100 % / actual size, no fit-to-page. The bar below must measure 100.0 mm.</text>`,
    '</g>');
  const svg = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" width="${fmtMm(pw)}mm" height="${fmtMm(ph)}mm" viewBox="0 0 ${fmtMm(pw)} ${fmtMm(ph)}">`,
    `<title>Stripwright photo mask (${sheet.name}${landscape ? ' landscape' : ''}, 1:1)</title>`,
    `<rect id="paper" x="0" y="0" width="${fmtMm(pw)}" height="${fmtMm(ph)}" fill="${paper}"/>`,
    ...body,
    '</svg>',
    '',
  ].join('\n');
  return {
    svg, warnings,
    layout: {
      page: { w: pw, h: ph, landscape },
      board: { x: bx, y: by, w: W, h: H },
      scaleBar: { x: sx, y: sy, length: BAR_LENGTH, height: BAR_H },
      registration,
    },
  };
}

function escapeXml(s: string): string {
  return s.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' }[c] as string));
}
