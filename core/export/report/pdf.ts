/**
 * Writes report pages as a PDF with pdf-lib (npm), the font embedded as a subset through @pdf-lib/fontkit so Ω, ε,
 * Γ, ° and − print as themselves. The same pages give the same bytes: no creation or modification date is written
 * (pdf-lib's `updateMetadata: false`), and the subset's name tag comes from pdf-lib's own fixed-seed generator. The
 * design hash and the app version go into the document information (Subject, Keywords, Producer).
 *
 * Geometry: items are in page millimetres with y down; PDF user space is points with y up (ISO 32000-1 §8.3.2.3,
 * from memory), so every point is (x·k, H − y·k) with k = 72/25.4. Fills use the even-odd rule (`f*`) so board
 * holes stay open whatever their ring order.
 */
import {
  PDFDocument, PDFOperator, PDFOperatorNames, pushGraphicsState, popGraphicsState, setLineWidth, setStrokingRgbColor,
  setFillingRgbColor, moveTo, lineTo, closePath, stroke, setDashPattern, setLineJoin, setLineCap, LineJoinStyle, LineCapStyle,
  beginText, endText, setFontAndSize, moveText, showText, PDFHexString,
  type PDFFont, type PDFPage, type PDFName, type PDFOperator as Op,
} from 'pdf-lib';
import fontkit from '@pdf-lib/fontkit';
import { PT_PER_MM, type DrawItem, type Measure, type ReportPage } from './drawing.ts';

export interface PdfInfo { title: string; subject: string; keywords: string[]; producer: string; creator: string }

/** A document with the font ready, so the layout can measure text with the metrics that will print. */
export async function openPdf(font: Uint8Array): Promise<{ doc: PDFDocument; font: Glyphs; measure: Measure }> {
  const doc = await PDFDocument.create({ updateMetadata: false });
  doc.registerFontkit(fontkit);
  const f = new Glyphs(await doc.embedFont(font, { subset: true }));
  return { doc, font: f, measure: (s, size) => f.width(s, size) / PT_PER_MM };
}

/**
 * Text through the embedded font one character at a time: pdf-lib's `drawText` shapes every string with fontkit
 * (about 1 ms a call), which made a report take seconds. Each character's glyph code and advance are looked up once
 * and strings are put together from them (no kerning — the widths used for layout are the same sums, so text
 * still lands where the layout measured it).
 */
class Glyphs {
  private readonly codes = new Map<string, string>();
  private readonly advances = new Map<string, number>();
  constructor(readonly font: PDFFont) {}
  private code(ch: string): string {
    let c = this.codes.get(ch);
    if (c === undefined) { c = this.font.encodeText(ch).asString(); this.codes.set(ch, c); }
    return c;
  }
  /** Width in pt at `size` pt. */
  width(s: string, size: number): number {
    let w = 0;
    for (const ch of s) {
      let a = this.advances.get(ch);
      if (a === undefined) { a = this.font.widthOfTextAtSize(ch, 1000); this.advances.set(ch, a); }
      w += a;
    }
    return (w * size) / 1000;
  }
  hex(s: string): PDFHexString {
    let h = '';
    for (const ch of s) h += this.code(ch);
    return PDFHexString.of(h);
  }
}

export async function writePdf(doc: PDFDocument, font: Glyphs, pages: ReportPage[], info: PdfInfo): Promise<Uint8Array> {
  doc.setTitle(info.title);
  doc.setSubject(info.subject);
  doc.setKeywords(info.keywords);
  doc.setProducer(info.producer);
  doc.setCreator(info.creator);
  for (const p of pages) {
    const page = doc.addPage([p.width * PT_PER_MM, p.height * PT_PER_MM]);
    const key = page.node.newFontDictionary('F', font.font.ref);
    for (const item of p.items) draw(page, font, key, p.height, item);
  }
  return doc.save({ useObjectStreams: false });
}

const r4 = (v: number) => Math.round(v * 1e4) / 1e4;

function draw(page: PDFPage, font: Glyphs, key: PDFName, heightMm: number, it: DrawItem): void {
  const X = (x: number) => r4(x * PT_PER_MM), Y = (y: number) => r4((heightMm - y) * PT_PER_MM);
  switch (it.kind) {
    case 'text': {
      const w = font.width(it.text, it.size);
      const x = r4(X(it.x) - (it.anchor === 'middle' ? w / 2 : it.anchor === 'end' ? w : 0));
      page.pushOperators(pushGraphicsState(), beginText(), setFillingRgbColor(...it.colour), setFontAndSize(key, it.size),
        moveText(x, Y(it.y)), showText(font.hex(it.text)), endText(), popGraphicsState());
      return;
    }
    case 'stroke': {
      if (it.points.length < 2) return;
      const ops: Op[] = [pushGraphicsState(), setLineWidth(r4(it.width * PT_PER_MM)), setStrokingRgbColor(...it.colour),
        setLineJoin(LineJoinStyle.Round), setLineCap(LineCapStyle.Round)];
      if (it.dash) ops.push(setDashPattern([r4(it.dash[0] * PT_PER_MM), r4(it.dash[1] * PT_PER_MM)], 0));
      it.points.forEach(([x, y], k) => ops.push(k === 0 ? moveTo(X(x), Y(y)) : lineTo(X(x), Y(y))));
      if (it.closed) ops.push(closePath());
      ops.push(stroke(), popGraphicsState());
      page.pushOperators(...ops);
      return;
    }
    case 'fill': {
      const ops: Op[] = [pushGraphicsState(), setFillingRgbColor(...it.colour)];
      for (const sp of it.subpaths) {
        sp.forEach(([x, y], k) => ops.push(k === 0 ? moveTo(X(x), Y(y)) : lineTo(X(x), Y(y))));
        ops.push(closePath());
      }
      ops.push(PDFOperator.of(PDFOperatorNames.FillEvenOdd), popGraphicsState());
      page.pushOperators(...ops);
      return;
    }
  }
}
