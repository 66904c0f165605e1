/**
 * The photo-mask sheet as a one-page vector PDF, written directly (ISO 32000-1:2008, "Document management —
 * Portable document format — Part 1: PDF 1.7"; clause numbers below are from memory): catalog, page tree, one page whose MediaBox is the paper size in
 * points (1 pt = 1/72 in, §8.3.2.3), the standard Helvetica font (one of the 14 standard Type 1 fonts, §9.6.2.2,
 * so nothing is embedded), an uncompressed content stream, and a cross-reference table with byte offsets (§7.5.4).
 *
 * Geometry: the content stream starts with `cm` = [72/25.4, 0, 0, −72/25.4, 0, H] so the sheet's page millimetres
 * (y down) are drawn as they are; fills use the even-odd rule (`f*`, §8.5.3.3) like the SVG. Circles are four cubic
 * Béziers with the usual constant k = 4/3·(√2 − 1) ≈ 0.5523 (radial error ≈ 0.027 % of r — common practice).
 * The file is ASCII only (non-ASCII text goes through WinAnsiEncoding octal escapes), so string length = bytes
 * and the offsets are exact. No dates or IDs: the same sheet gives the same file.
 */
import type { PointMm } from './frame.ts';
import type { Sheet, SheetItem } from './mask.ts';

const PT_PER_MM = 72 / 25.4;
const K = (4 / 3) * (Math.SQRT2 - 1);

/** Number text for a content stream: up to 4 decimals of mm (0.1 µm), no exponent, no "-0". */
function n(v: number): string {
  const s = (Math.round(v * 1e4) / 1e4).toFixed(4).replace(/0+$/, '').replace(/\.$/, '');
  return s === '-0' ? '0' : s;
}

/** WinAnsiEncoding (ISO 32000-1 Annex D; codes from memory) for the characters the sheet uses; others become '?'. */
const WIN_ANSI: Record<string, number> = { '×': 0xd7, '—': 0x97, '–': 0x96, 'µ': 0xb5, '°': 0xb0, '±': 0xb1, 'é': 0xe9, 'ü': 0xfc, 'ö': 0xf6, 'ä': 0xe4 };

function pdfString(s: string): string {
  let out = '(';
  for (const ch of s.replace(/−/g, '-')) {
    const c = ch.codePointAt(0)!;
    if (ch === '(' || ch === ')' || ch === '\\') out += '\\' + ch;
    else if (c >= 0x20 && c < 0x7f) out += ch;
    else {
      const b = WIN_ANSI[ch];
      out += b !== undefined ? '\\' + b.toString(8).padStart(3, '0') : '?';
    }
  }
  return out + ')';
}

/**
 * Advance widths of Helvetica, 1/1000 em, for centring the scale labels: digits 556, space 278, 'm' 833
 * (values from memory of the standard Helvetica AFM metrics; other characters assumed 556).
 */
function helveticaWidth(s: string, size: number): number {
  let w = 0;
  for (const ch of s) w += ch === ' ' ? 278 : ch === 'm' ? 833 : 556;
  return (w / 1000) * size;
}

function circle(c: PointMm, r: number): string {
  const k = K * r;
  return [
    `${n(c.x + r)} ${n(c.y)} m`,
    `${n(c.x + r)} ${n(c.y + k)} ${n(c.x + k)} ${n(c.y + r)} ${n(c.x)} ${n(c.y + r)} c`,
    `${n(c.x - k)} ${n(c.y + r)} ${n(c.x - r)} ${n(c.y + k)} ${n(c.x - r)} ${n(c.y)} c`,
    `${n(c.x - r)} ${n(c.y - k)} ${n(c.x - k)} ${n(c.y - r)} ${n(c.x)} ${n(c.y - r)} c`,
    `${n(c.x + k)} ${n(c.y - r)} ${n(c.x + r)} ${n(c.y - k)} ${n(c.x + r)} ${n(c.y)} c`,
    'h',
  ].join('\n');
}

function item(i: SheetItem): string {
  const grey = (c: 'ink' | 'paper') => (c === 'ink' ? '0 g' : '1 g');
  switch (i.kind) {
    case 'fill': {
      if (i.subpaths.length === 0) return '';
      const path = i.subpaths.map((sp) => sp.map((p, k) => `${n(p.x)} ${n(p.y)} ${k === 0 ? 'm' : 'l'}`).join('\n') + '\nh').join('\n');
      return `${grey(i.colour)}\n${path}\nf*`;
    }
    case 'rect': return `0 g\n${n(i.x)} ${n(i.y)} ${n(i.w)} ${n(i.h)} re\nf`;
    case 'dot': return `${grey(i.colour)}\n${circle(i.c, i.r)}\nf`;
    case 'mark': return [`0 G ${n(i.line)} w`, circle(i.c, i.r),
      `${n(i.c.x - i.arm)} ${n(i.c.y)} m ${n(i.c.x + i.arm)} ${n(i.c.y)} l`,
      `${n(i.c.x)} ${n(i.c.y - i.arm)} m ${n(i.c.x)} ${n(i.c.y + i.arm)} l`, 'S'].join('\n');
    case 'text': {
      const x = i.anchor === 'middle' ? i.x - helveticaWidth(i.text, i.size) / 2 : i.x;
      // The page matrix flips y; the text matrix flips it back so glyphs stand upright.
      return `0 g\nBT\n/F1 1 Tf\n${n(i.size)} 0 0 ${n(-i.size)} ${n(x)} ${n(i.y)} Tm\n${pdfString(i.text)} Tj\nET`;
    }
  }
}

export function sheetToPdf(sheet: Sheet): string {
  const wPt = sheet.w * PT_PER_MM, hPt = sheet.h * PT_PER_MM;
  const content = [
    `${n(PT_PER_MM)} 0 0 ${n(-PT_PER_MM)} 0 ${n(hPt)} cm`,
    ...sheet.items.map(item).filter((s) => s !== ''),
  ].join('\n') + '\n';
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    `<< /Type /Page /Parent 2 0 R /MediaBox [0 0 ${n(wPt)} ${n(hPt)}] /Resources << /Font << /F1 4 0 R >> >> /Contents 5 0 R >>`,
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica /Encoding /WinAnsiEncoding >>',
    `<< /Length ${content.length} >>\nstream\n${content}endstream`,
    `<< /Title ${pdfString(sheet.title)} /Producer (Stripwright) >>`,
  ];
  let out = '%PDF-1.4\n';
  const offsets: number[] = [];
  objects.forEach((body, k) => {
    offsets.push(out.length);
    out += `${k + 1} 0 obj\n${body}\nendobj\n`;
  });
  const xref = out.length;
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  for (const o of offsets) out += `${String(o).padStart(10, '0')} 00000 n \n`;
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R /Info 6 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return out;
}
