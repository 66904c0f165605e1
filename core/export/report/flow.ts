/**
 * A small flowing page layout for the report: headings, wrapped paragraphs, tables that continue on the next page
 * with their header repeated, and fixed-height blocks (plots, the board). A4 portrait, 15 mm margins.
 */
import { GREY, INK, RULE, line, text, type DrawItem, type Measure, type ReportPage } from './drawing.ts';

export const PAGE = { width: 210, height: 297, margin: 15 } as const;
const LINE_MM = 0.3528 * 1.35; // per pt of font size: 1 pt = 0.3528 mm, lines at 1.35 × the size (common practice)

export interface Column { title: string; /** share of the text width */ share: number; align?: 'start' | 'end' }

export class Flow {
  readonly pages: ReportPage[] = [];
  private y = PAGE.margin;
  readonly left = PAGE.margin;
  readonly width = PAGE.width - 2 * PAGE.margin;
  private readonly bottom = PAGE.height - PAGE.margin - 6;

  constructor(private readonly measure: Measure, private readonly footer: string) { this.newPage(); }

  private get page(): ReportPage { return this.pages[this.pages.length - 1]!; }

  newPage(): void {
    const n = this.pages.length + 1;
    this.pages.push({ width: PAGE.width, height: PAGE.height, items: [
      line(PAGE.margin, PAGE.height - PAGE.margin - 2, PAGE.width - PAGE.margin, PAGE.height - PAGE.margin - 2, 0.1, RULE),
      text(PAGE.margin, PAGE.height - PAGE.margin + 2, 6.5, this.footer, 'start', GREY),
      text(PAGE.width - PAGE.margin, PAGE.height - PAGE.margin + 2, 6.5, `page ${n}`, 'end', GREY),
    ] });
    this.y = PAGE.margin;
  }

  /** Starts a new page unless `h` mm still fit. */
  room(h: number): void { if (this.y + h > this.bottom) this.newPage(); }

  gap(h: number): void { this.y += h; }

  heading(s: string, size = 13): void {
    this.room(size * LINE_MM * 2 + 12);
    this.y += size * LINE_MM * 0.6;
    this.page.items.push(text(this.left, this.y + size * 0.3528, size, s, 'start', INK));
    this.y += size * LINE_MM + 1;
  }

  /** Words wrapped to the text width. */
  paragraph(s: string, size = 8.5, colour = INK): void {
    for (const l of this.wrap(s, size, this.width)) {
      this.room(size * LINE_MM);
      this.page.items.push(text(this.left, this.y + size * 0.3528, size, l, 'start', colour));
      this.y += size * LINE_MM;
    }
    this.y += 1;
  }

  bullet(s: string, size = 8.5): void {
    const lines = this.wrap(s, size, this.width - 4);
    lines.forEach((l, k) => {
      this.room(size * LINE_MM);
      if (k === 0) this.page.items.push(text(this.left, this.y + size * 0.3528, size, '•', 'start', INK));
      this.page.items.push(text(this.left + 4, this.y + size * 0.3528, size, l, 'start', INK));
      this.y += size * LINE_MM;
    });
  }

  wrap(s: string, size: number, width: number): string[] {
    const out: string[] = [];
    for (const para of s.split('\n')) {
      let cur = '';
      for (const w of para.split(/\s+/).filter(Boolean)) {
        const next = cur ? `${cur} ${w}` : w;
        if (cur && this.measure(next, size) > width) { out.push(cur); cur = w; } else cur = next;
      }
      out.push(cur);
    }
    return out;
  }

  /** A table; cells wrap within their column, rows never split, the header repeats on a new page. */
  table(cols: Column[], rows: string[][], size = 7.5): void {
    const total = cols.reduce((s, c) => s + c.share, 0);
    const widths = cols.map((c) => (c.share / total) * this.width);
    const lh = size * LINE_MM;
    const drawRow = (cells: string[], head: boolean) => {
      const wrapped = cells.map((c, i) => this.wrap(c, size, widths[i]! - 1.5));
      const h = Math.max(...wrapped.map((w) => w.length)) * lh + 1;
      return { wrapped, h, head };
    };
    const header = drawRow(cols.map((c) => c.title), true);
    const put = (r: { wrapped: string[][]; h: number; head: boolean }) => {
      let x = this.left;
      r.wrapped.forEach((ls, i) => {
        const c = cols[i]!;
        ls.forEach((l, k) => {
          const tx = c.align === 'end' ? x + widths[i]! - 1.5 : x;
          this.page.items.push(text(tx, this.y + (k + 1) * lh - 0.6, size, l, c.align ?? 'start', r.head ? GREY : INK));
        });
        x += widths[i]!;
      });
      this.y += r.h;
      this.page.items.push(line(this.left, this.y - 0.3, this.left + this.width, this.y - 0.3, r.head ? 0.2 : 0.08, r.head ? INK : RULE));
    };
    this.room(header.h + lh * 2);
    put(header);
    for (const cells of rows) {
      const r = drawRow(cells, false);
      if (this.y + r.h > this.bottom) { this.newPage(); put(header); }
      put(r);
    }
    this.y += 2;
  }

  /** A block of fixed height drawn by `draw(x, y, width)` at the cursor. */
  block(h: number, draw: (x: number, y: number, w: number) => DrawItem[]): void {
    this.room(h);
    this.page.items.push(...draw(this.left, this.y, this.width));
    this.y += h;
  }

  /** Space left on this page, mm. */
  get remaining(): number { return this.bottom - this.y; }
}
