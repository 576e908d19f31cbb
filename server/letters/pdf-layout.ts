/**
 * Layout primitives for the letter on top of pdfkit: page geometry, headings,
 * paragraphs, label–value rows and tables that break across pages with their header.
 */
import { join } from 'node:path';
import PDFDocument from 'pdfkit';
import { COLOURS, FONT_FILES, fontDir, type FontRole } from './pdf-theme';

/** A pdfkit document. */
export type Doc = InstanceType<typeof PDFDocument>;

/** A4 with 2 cm side margins; the bottom margin leaves room for the footer. */
export const PAGE = { size: 'A4' as const, margins: { top: 62, bottom: 70, left: 58, right: 58 } };

/** One table column: heading, share of the width, and how its cells are drawn. */
export interface Column {
  heading: string;
  width: number;
  font?: FontRole;
  align?: 'left' | 'right';
}

/** One table cell: main text, optional second line in small muted italics, optional colour. */
export interface Cell {
  text: string;
  note?: string | null;
  colour?: string;
  font?: FontRole;
}

/** Creates a document with the letter's fonts registered under their role names. */
export function createDoc(info: Record<string, string | Date>): Doc {
  const doc = new PDFDocument({ size: PAGE.size, margins: PAGE.margins, bufferPages: true, autoFirstPage: true, info: info as PDFKit.DocumentInfo, lang: 'en-GB', displayTitle: true });
  const dir = fontDir();
  for (const [role, file] of Object.entries(FONT_FILES)) doc.registerFont(role, join(dir, file));
  doc.font('body').fontSize(9.5).fillColor(COLOURS.ink);
  return doc;
}

/** Stateful writer that flows letter content down the pages. */
export class LetterWriter {
  constructor(readonly doc: Doc) {}

  /** Left edge of the text column. */
  get left(): number {
    return this.doc.page.margins.left;
  }

  /** Width of the text column. */
  get width(): number {
    return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right;
  }

  /** Lowest y content may reach on this page. */
  get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }

  /** Starts a new page when fewer than `height` points remain. */
  ensureSpace(height: number): void {
    if (this.doc.y + height > this.bottom) {
      this.doc.addPage();
      this.doc.x = this.left;
    }
  }

  /** Sets font, size and colour in one call. */
  use(font: FontRole, size: number, colour: string = COLOURS.ink): Doc {
    return this.doc.font(font).fontSize(size).fillColor(colour);
  }

  /** Height a string takes in a given font, size and width. */
  measure(text: string, font: FontRole, size: number, width: number, lineGap = 1.5): number {
    this.doc.font(font).fontSize(size);
    return this.doc.heightOfString(text, { width, lineGap });
  }

  /** Numbered section heading with a hairline, kept with at least `keep` points of what follows. */
  heading(text: string, keep = 60): void {
    this.ensureSpace(28 + keep);
    this.doc.moveDown(0.9);
    const y = this.doc.y;
    this.use('bold', 11, COLOURS.accent).text(text, this.left, y, { width: this.width });
    const ruleY = this.doc.y + 2;
    this.doc.moveTo(this.left, ruleY).lineTo(this.left + this.width, ruleY).lineWidth(0.6).strokeColor(COLOURS.rule).stroke();
    this.doc.y = ruleY + 7;
  }

  /** Small bold sub-heading. */
  subheading(text: string, keep = 30): void {
    this.ensureSpace(16 + keep);
    this.doc.moveDown(0.35);
    this.use('bold', 9.5, COLOURS.ink).text(text, this.left, this.doc.y, { width: this.width });
    this.doc.y += 2.5;
  }

  /** Body paragraph. */
  paragraph(text: string, opts: { font?: FontRole; size?: number; colour?: string; gapAfter?: number } = {}): void {
    const size = opts.size ?? 9.5;
    const font = opts.font ?? 'body';
    const h = this.measure(text, font, size, this.width);
    this.ensureSpace(Math.min(h, 40));
    this.use(font, size, opts.colour ?? COLOURS.ink).text(text, this.left, this.doc.y, { width: this.width, lineGap: 1.5 });
    this.doc.y += opts.gapAfter ?? 4;
  }

  /** Bulleted or numbered list. */
  list(items: string[], opts: { numbered?: boolean; size?: number } = {}): void {
    const size = opts.size ?? 9.5;
    const indent = opts.numbered && items.length >= 10 ? 22 : 16;
    items.forEach((item, i) => {
      const h = this.measure(item, 'body', size, this.width - indent);
      this.ensureSpace(h + 2);
      const y = this.doc.y;
      this.use('body', size, COLOURS.muted).text(opts.numbered ? `${i + 1}.` : '•', this.left, y, { width: indent - 2, lineBreak: false });
      this.use('body', size, COLOURS.ink).text(item, this.left + indent, y, { width: this.width - indent, lineGap: 1.5 });
      this.doc.y += 2.5;
    });
  }

  /** Label–value rows: a muted label column and a value column. */
  definitions(rows: { label: string; value: string; font?: FontRole; size?: number }[], labelWidth = 128): void {
    const valueWidth = this.width - labelWidth;
    for (const row of rows) {
      const size = row.size ?? 9.5;
      const h = Math.max(this.measure(row.label, 'body', 8.5, labelWidth - 8), this.measure(row.value, row.font ?? 'body', size, valueWidth));
      this.ensureSpace(h + 3);
      const y = this.doc.y;
      this.use('body', 8.5, COLOURS.muted).text(row.label, this.left, y + 0.8, { width: labelWidth - 8, lineGap: 1.5 });
      this.use(row.font ?? 'body', size, COLOURS.ink).text(row.value, this.left + labelWidth, y, { width: valueWidth, lineGap: 1.5 });
      this.doc.y = y + h + 3.5;
    }
  }

  /** Table with a header row repeated on each page it spans. */
  table(columns: Column[], rows: Cell[][], opts: { size?: number } = {}): void {
    const size = opts.size ?? 8.5;
    const padX = 4;
    const padY = 3.5;
    const total = columns.reduce((s, c) => s + c.width, 0);
    const widths = columns.map((c) => (c.width / total) * this.width);
    const xs = widths.map((_, i) => this.left + widths.slice(0, i).reduce((s, w) => s + w, 0));

    const rowHeight = (cells: Cell[]): number =>
      Math.max(
        ...cells.map((cell, i) => {
          const w = widths[i] - 2 * padX;
          let h = this.measure(cell.text, cell.font ?? columns[i].font ?? 'condensed', size, w, 1);
          if (cell.note) h += 1.5 + this.measure(cell.note, 'italic', size - 1, w, 1);
          return h;
        }),
      ) + 2 * padY;

    const drawHeader = (): void => {
      const y = this.doc.y;
      const h = Math.max(...columns.map((c, i) => this.measure(c.heading, 'condensedBold', 7.5, widths[i] - 2 * padX, 1))) + 2 * padY;
      this.doc.rect(this.left, y, this.width, h).fillColor(COLOURS.panel).fill();
      columns.forEach((c, i) => {
        this.use('condensedBold', 7.5, COLOURS.muted).text(c.heading, xs[i] + padX, y + padY, { width: widths[i] - 2 * padX, align: c.align ?? 'left', lineGap: 1 });
      });
      this.doc.y = y + h;
    };

    const first = rows.length > 0 ? rowHeight(rows[0]) : 0;
    this.ensureSpace(22 + first);
    drawHeader();
    for (const cells of rows) {
      const h = rowHeight(cells);
      if (this.doc.y + h > this.bottom) {
        this.doc.addPage();
        drawHeader();
      }
      const y = this.doc.y;
      cells.forEach((cell, i) => {
        const w = widths[i] - 2 * padX;
        const col = columns[i];
        this.use(cell.font ?? col.font ?? 'condensed', size, cell.colour ?? COLOURS.ink).text(cell.text, xs[i] + padX, y + padY, { width: w, align: col.align ?? 'left', lineGap: 1 });
        if (cell.note) {
          this.use('italic', size - 1, COLOURS.muted).text(cell.note, xs[i] + padX, this.doc.y + 1.5, { width: w, align: col.align ?? 'left', lineGap: 1 });
        }
      });
      this.doc.moveTo(this.left, y + h).lineTo(this.left + this.width, y + h).lineWidth(0.4).strokeColor(COLOURS.rule).stroke();
      this.doc.y = y + h;
    }
    this.doc.x = this.left;
    this.doc.y += 6;
  }
}
