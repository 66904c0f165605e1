/**
 * Photo mask (also toner-transfer artwork): a print-ready 1:1 sheet, page A4 (210 × 297 mm, ISO 216) or US Letter
 * (8.5 × 11 in = 215.9 × 279.4 mm), as SVG (width and height in mm with a matching viewBox) and as a one-page vector
 * PDF (mask-pdf.ts), so a viewer printing at "actual size" / 100 % reproduces it true to scale. Both are drawn from
 * one `Sheet` model built here.
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
import { ringPath } from './svg.ts';
import { sheetToPdf } from './mask-pdf.ts';
import { withEtchBias } from './bias.ts';
import type { ExportGeometry } from './layers.ts';

export type PageSize = 'a4' | 'letter';
export type Polarity = 'positive' | 'negative';

/** Page sizes, mm (ISO 216 A4; US Letter is 8.5 × 11 in by definition of the size). */
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
  /** The same sheet as a one-page vector PDF (ASCII text; see mask-pdf.ts). */
  pdf: string;
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

/** A drawing item on the sheet, in page millimetres from the top-left corner, y down. */
export type SheetItem =
  | { kind: 'fill'; id: string; colour: 'ink' | 'paper'; subpaths: PointMm[][] }
  | { kind: 'rect'; id?: string; x: number; y: number; w: number; h: number }
  | { kind: 'dot'; c: PointMm; r: number; colour: 'ink' | 'paper' }
  | { kind: 'mark'; c: PointMm; r: number; arm: number; line: number }
  | { kind: 'text'; x: number; y: number; size: number; text: string; anchor: 'start' | 'middle' };

/** The sheet as data: one model drawn by both the SVG and the PDF writer, so the two never disagree. */
export interface Sheet { w: number; h: number; title: string; items: SheetItem[] }

export function toMask(geometry: ExportGeometry, options: MaskOptions = {}): Mask {
  const pageName = options.page ?? 'a4';
  if (typeof pageName !== 'string' || !Object.hasOwn(PAGES, pageName)) throw new InputError('bad-choice', 'page', "'a4' or 'letter'", describe(pageName));
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
  const items: SheetItem[] = [];
  const copper: PointMm[][] = [];
  for (const r of [...g.groundCopper, ...g.copper]) for (const ring of [r.outer, ...r.holes]) copper.push(frame.ring(ring).map(place));
  if (polarity === 'negative') {
    // One even-odd fill: the opaque field with the copper cut out of it (clear on film, nothing printed on paper).
    const x0 = roundMm(bx - SURROUND), y0 = roundMm(by - SURROUND), x1 = roundMm(bx + W + SURROUND), y1 = roundMm(by + H + SURROUND);
    const field = [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }];
    items.push({ kind: 'fill', id: 'copper', colour: 'ink', subpaths: [field, ...copper] });
  } else {
    items.push({ kind: 'fill', id: 'copper', colour: 'ink', subpaths: copper });
  }
  if (options.drillMarks ?? true) {
    for (const hit of g.drills) {
      items.push({ kind: 'dot', c: place(frame.point(hit.at)), r: roundMm(Math.min(DRILL_DOT, toMm(hit.diameter)) / 2), colour: polarity === 'positive' ? 'paper' : 'ink' });
    }
  }
  const registration: PointMm[] = [
    { x: bx - MARK_OFFSET, y: by - MARK_OFFSET }, { x: bx + W + MARK_OFFSET, y: by - MARK_OFFSET },
    { x: bx + W + MARK_OFFSET, y: by + H + MARK_OFFSET }, { x: bx - MARK_OFFSET, y: by + H + MARK_OFFSET },
  ].map((p) => ({ x: roundMm(p.x), y: roundMm(p.y) }));
  for (const c of registration) items.push({ kind: 'mark', c, r: MARK_R, arm: MARK_R + 1, line: 0.15 });
  // Scale bar: a filled bar exactly BAR_LENGTH mm long, ticks every 10 mm hanging below it, kept inside its ends.
  const sx = roundMm((pw - BAR_LENGTH) / 2), sy = roundMm(by + H + MARK_OFFSET + MARK_R + 1 + 6);
  items.push({ kind: 'rect', id: 'scale-bar-line', x: sx, y: sy, w: BAR_LENGTH, h: BAR_H });
  for (let k = 0; k <= BAR_LENGTH; k += 10) {
    const tw = 0.2, len = k % 50 === 0 ? 3 : 1.8;
    const tx = k === 0 ? sx : k === BAR_LENGTH ? sx + BAR_LENGTH - tw : sx + k - tw / 2;
    items.push({ kind: 'rect', x: roundMm(tx), y: roundMm(sy + BAR_H), w: tw, h: len });
    if (k % 50 === 0) items.push({ kind: 'text', x: roundMm(sx + k), y: roundMm(sy + BAR_H + 6.5), size: 3, text: k === BAR_LENGTH ? `${k} mm` : String(k), anchor: 'middle' });
  }
  const state = [polarity.toUpperCase(), mirror ? 'MIRRORED' : 'NOT MIRRORED', `etch bias ${bias >= 0 ? '+' : '−'}${Math.abs(toMm(bias)).toFixed(3)} mm per edge`].join(', ');
  const title = options.title ? options.title.slice(0, 80) + ' — ' : '';
  items.push(
    { kind: 'text', x: PRINT_MARGIN, y: PRINT_MARGIN + 3, size: 3, text: `${title}Stripwright photo mask, top copper`, anchor: 'start' },
    { kind: 'text', x: PRINT_MARGIN, y: PRINT_MARGIN + 7, size: 3, text: `${state}. Board ${fmtMm(W, 3)} × ${fmtMm(H, 3)} mm.`, anchor: 'start' },
    { kind: 'text', x: PRINT_MARGIN, y: PRINT_MARGIN + 11, size: 3, text: 'Print at 100 % / actual size, no fit-to-page. The bar below must measure 100.0 mm.', anchor: 'start' },
  );
  const model: Sheet = { w: pw, h: ph, title: `Stripwright photo mask (${sheet.name}${landscape ? ' landscape' : ''}, 1:1)`, items };
  return {
    svg: sheetToSvg(model), pdf: sheetToPdf(model), warnings,
    layout: {
      page: { w: pw, h: ph, landscape },
      board: { x: bx, y: by, w: W, h: H },
      scaleBar: { x: sx, y: sy, length: BAR_LENGTH, height: BAR_H },
      registration,
    },
  };
}

const COLOUR = { ink: '#000000', paper: '#ffffff' } as const;

/** The sheet as SVG: width/height in mm with a matching viewBox, one group per kind of item. */
export function sheetToSvg(sheet: Sheet): string {
  const n = (v: number) => fmtMm(v);
  const fills = sheet.items.filter((i) => i.kind === 'fill');
  const dots = sheet.items.filter((i) => i.kind === 'dot');
  const marks = sheet.items.filter((i) => i.kind === 'mark');
  const rects = sheet.items.filter((i) => i.kind === 'rect');
  const texts = sheet.items.filter((i) => i.kind === 'text');
  const out = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(sheet.w)}mm" height="${n(sheet.h)}mm" viewBox="0 0 ${n(sheet.w)} ${n(sheet.h)}">`,
    `<title>${escapeXml(sheet.title)}</title>`,
    `<rect id="paper" x="0" y="0" width="${n(sheet.w)}" height="${n(sheet.h)}" fill="${COLOUR.paper}"/>`,
  ];
  for (const f of fills) out.push(`<g id="${f.id}"><path fill="${COLOUR[f.colour]}" fill-rule="evenodd" d="${f.subpaths.map(ringPath).join(' ')}"/></g>`);
  if (dots.length) {
    out.push('<g id="drill-centres">');
    for (const d of dots) out.push(`<circle cx="${n(d.c.x)}" cy="${n(d.c.y)}" r="${n(d.r)}" fill="${COLOUR[d.colour]}"/>`);
    out.push('</g>');
  }
  out.push(`<g id="registration" fill="none" stroke="${COLOUR.ink}" stroke-width="${marks[0]?.line ?? 0.15}">`);
  for (const m of marks) {
    out.push(`<circle cx="${n(m.c.x)}" cy="${n(m.c.y)}" r="${n(m.r)}"/><path d="M${n(m.c.x - m.arm)} ${n(m.c.y)} L${n(m.c.x + m.arm)} ${n(m.c.y)} M${n(m.c.x)} ${n(m.c.y - m.arm)} L${n(m.c.x)} ${n(m.c.y + m.arm)}"/>`);
  }
  out.push('</g>', `<g id="scale-bar" fill="${COLOUR.ink}">`);
  for (const r of rects) out.push(`<rect${r.id ? ` id="${r.id}"` : ''} x="${n(r.x)}" y="${n(r.y)}" width="${n(r.w)}" height="${n(r.h)}"/>`);
  out.push('</g>', `<g id="notes" fill="${COLOUR.ink}" font-family="sans-serif">`);
  for (const t of texts) out.push(`<text x="${n(t.x)}" y="${n(t.y)}" font-size="${n(t.size)}"${t.anchor === 'middle' ? ' text-anchor="middle"' : ''}>${escapeXml(t.text)}</text>`);
  out.push('</g>', '</svg>', '');
  return out.join('\n');
}

function escapeXml(s: string): string {
  return s.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' }[c] as string));
}
