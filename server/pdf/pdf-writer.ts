/**
 * Top-to-bottom layout on pdfkit pages: headings, paragraphs, fact lists, simple tables, banners and monospace
 * blocks, with page breaks before a block that would not fit and a footer on every page.
 */
import type PDFDocument from "pdfkit";

type Doc = InstanceType<typeof PDFDocument>;

export const FONTS = { regular: "Sans", bold: "Sans-Bold", mono: "Mono" } as const;

export const COLORS = {
  ink: "#12262b",
  muted: "#51727a",
  tide: "#14737b",
  rule: "#cfdcdd",
  signal: "#8c3110",
  caution: "#6f520c",
  steady: "#245c40",
} as const;

const TINT: Record<string, string> = { [COLORS.signal]: "#fcf1ea", [COLORS.caution]: "#f6ebc9" };
const STATUS_COLOR: Record<string, string> = {
  PASS: COLORS.steady,
  FAIL: COLORS.signal,
  UNDETERMINED: COLORS.caution,
  INVESTIGATE: COLORS.caution,
  CLEAR: COLORS.steady,
  "NOT EVALUATED": COLORS.muted,
};

export class PdfWriter {
  y: number;

  constructor(readonly doc: Doc) {
    this.y = doc.page.margins.top;
  }

  get left(): number {
    return this.doc.page.margins.left;
  }

  get width(): number {
    return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right;
  }

  private get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }

  ensureSpace(height: number): void {
    if (this.y + height > this.bottom) {
      this.doc.addPage();
      this.y = this.doc.page.margins.top;
    }
  }

  private flow(text: string, font: string, size: number, color: string, gap: number, indent = 0): void {
    const options = { width: this.width - indent };
    this.doc.font(font).fontSize(size);
    this.ensureSpace(Math.min(this.doc.heightOfString(text, options), 120));
    this.doc.fillColor(color).text(text, this.left + indent, this.y, options);
    this.y = this.doc.y + gap;
  }

  kicker(text: string): void {
    this.flow(text, FONTS.bold, 8, COLORS.tide, 4);
  }

  title(text: string): void {
    this.flow(text, FONTS.bold, 18, COLORS.ink, 2);
  }

  /** A section title, kept on the same page as the first `keepWith` points of what follows. */
  heading(text: string, keepWith = 40): void {
    this.ensureSpace(30 + keepWith);
    this.y += 8;
    this.doc.lineWidth(0.6).strokeColor(COLORS.rule);
    this.doc.moveTo(this.left, this.y).lineTo(this.left + this.width, this.y).stroke();
    this.y += 6;
    this.flow(text, FONTS.bold, 11, COLORS.ink, 5);
  }

  paragraph(text: string, options: { color?: string; bold?: boolean } = {}): void {
    this.flow(text, options.bold ? FONTS.bold : FONTS.regular, 9, options.color ?? COLORS.ink, 4);
  }

  note(text: string): void {
    this.flow(text, FONTS.regular, 7.5, COLORS.muted, 3);
  }

  bullet(text: string, color: string = COLORS.ink): void {
    this.doc.font(FONTS.regular).fontSize(9);
    // The bullet and (the first lines of) its text on the same page: the same space the text itself will ask for.
    this.ensureSpace(Math.min(this.doc.heightOfString(text, { width: this.width - 14 }), 120));
    this.doc.fillColor(color).text("•", this.left + 4, this.y, { lineBreak: false });
    this.flow(text, FONTS.regular, 9, color, 3, 14);
  }

  facts(rows: [label: string, value: string][]): void {
    const labelWidth = 120;
    for (const [label, value] of rows) {
      this.doc.font(FONTS.regular).fontSize(9);
      const height = this.doc.heightOfString(value, { width: this.width - labelWidth });
      this.ensureSpace(height);
      this.doc.fillColor(COLORS.muted).text(label, this.left, this.y, { width: labelWidth - 8, lineBreak: false });
      this.doc.fillColor(COLORS.ink).text(value, this.left + labelWidth, this.y, { width: this.width - labelWidth });
      this.y += height + 3;
    }
    this.y += 3;
  }

  table(headers: string[], rows: string[][], widths: number[], options: { statusColumn?: number } = {}): void {
    const pad = 4;
    const rowHeight = (cells: string[], font: string) => {
      this.doc.font(font).fontSize(8.5);
      return Math.max(...cells.map((c, i) => this.doc.heightOfString(c, { width: widths[i] - 2 * pad }))) + 2 * pad;
    };
    const drawRow = (cells: string[], font: string, fill?: string) => {
      const height = rowHeight(cells, font);
      this.ensureSpace(height);
      if (fill) this.doc.rect(this.left, this.y, widths.reduce((a, b) => a + b, 0), height).fill(fill);
      let x = this.left;
      cells.forEach((cell, i) => {
        const status = i === options.statusColumn ? STATUS_COLOR[cell] : undefined;
        this.doc
          .font(status ? FONTS.bold : font)
          .fontSize(8.5)
          .fillColor(status ?? COLORS.ink)
          .text(cell, x + pad, this.y + pad, { width: widths[i] - 2 * pad });
        x += widths[i];
      });
      this.y += height;
      this.doc.lineWidth(0.4).strokeColor(COLORS.rule);
      this.doc.moveTo(this.left, this.y).lineTo(x, this.y).stroke();
    };
    drawRow(headers, FONTS.bold, "#eef3f3");
    for (const row of rows) drawRow(row, FONTS.regular);
    this.y += 6;
  }

  banner(text: string, color: string): void {
    const pad = 7;
    this.doc.font(FONTS.regular).fontSize(8.5);
    const height = this.doc.heightOfString(text, { width: this.width - 2 * pad }) + 2 * pad;
    this.ensureSpace(height);
    this.doc.rect(this.left, this.y, this.width, height).fill(TINT[color] ?? "#eef3f3");
    this.doc.fillColor(color).text(text, this.left + pad, this.y + pad, { width: this.width - 2 * pad });
    this.y += height + 6;
  }

  /** Fixed-width block, cut into equal lines (a JWS has no spaces to wrap at). */
  mono(text: string, charsPerLine = 96, size = 7): void {
    const lines = text.match(new RegExp(`.{1,${charsPerLine}}`, "g")) ?? [];
    this.doc.font(FONTS.mono).fontSize(size);
    for (const line of lines) {
      this.ensureSpace(size + 2);
      this.doc.fillColor(COLORS.ink).text(line, this.left, this.y, { lineBreak: false });
      this.y += size * 1.23;
    }
    this.y += 4;
  }

  /** Writes the footer on every buffered page (call once, before `doc.end()`). */
  footers(text: string): void {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      const bottomMargin = this.doc.page.margins.bottom;
      this.doc.page.margins.bottom = 0; // writing below the margin would otherwise open a new page
      const y = this.doc.page.height - 36;
      this.doc.font(FONTS.regular).fontSize(7).fillColor(COLORS.muted);
      this.doc.text(text, this.left, y, { width: this.width - 60, lineBreak: false });
      this.doc.text(`page ${i + 1} of ${range.count}`, this.left + this.width - 60, y, {
        width: 60,
        align: "right",
        lineBreak: false,
      });
      this.doc.page.margins.bottom = bottomMargin;
    }
  }
}
