import type PDFDocument from 'pdfkit';
import { textRuns, type PdfFonts, type Weight } from './pdf-fonts';

export const INK = '#1f2a33';
export const MUTED = '#5b6770';

export interface TextStyle {
  size?: number;
  weight?: Weight;
  color?: string;
}

/** Writes text in the shipped Roboto, switching font file inside a line where the script changes. */
export class PdfText {
  constructor(
    readonly doc: PDFKit.PDFDocument,
    private readonly fonts: PdfFonts,
  ) {
    for (const [name, file] of fonts.files) doc.registerFont(name, file);
  }

  get contentWidth(): number {
    const { width, margins } = this.doc.page;
    return width - margins.left - margins.right;
  }

  get left(): number {
    return this.doc.page.margins.left;
  }

  /** Room left on the page below the cursor. */
  get roomLeft(): number {
    return this.doc.page.height - this.doc.page.margins.bottom - this.doc.y;
  }

  /** Starts a new page when fewer than `height` points are left. */
  ensureRoom(height: number): void {
    if (this.roomLeft < height) this.doc.addPage();
  }

  /** A flowing paragraph at the left margin; long text wraps and continues on the next page. */
  paragraph(text: string, style: TextStyle = {}, options: PDFKit.Mixins.TextOptions = {}): void {
    this.style(style);
    const runs = textRuns(text, this.fonts, style.weight ?? 400);
    this.doc.x = this.left + (options.indent ?? 0);
    runs.forEach((run, i) => {
      this.doc.font(run.font).text(run.text, {
        ...options,
        indent: undefined,
        width: this.contentWidth - (options.indent ?? 0),
        continued: i < runs.length - 1,
      });
    });
    this.doc.x = this.left;
  }

  heading(text: string, size = 13): void {
    this.ensureRoom(size * 4);
    this.doc.moveDown(0.6);
    this.paragraph(text, { size, weight: 700 });
    this.doc.moveDown(0.3);
  }

  /** One line of text in a box (a table cell or a chart label); too long text is cut with an ellipsis. */
  cell(text: string, x: number, y: number, width: number, align: 'left' | 'right' | 'center' = 'left', style: TextStyle = {}): void {
    this.style(style);
    const runs = textRuns(text, this.fonts, style.weight ?? 400);
    if (runs.length === 1) {
      this.doc.font(runs[0].font).text(runs[0].text, x, y, { width, align, lineBreak: false, ellipsis: true, height: (style.size ?? 9) * 1.4 });
    } else {
      runs.forEach((run, i) => {
        const options = { lineBreak: false, continued: i < runs.length - 1 };
        if (i === 0) this.doc.font(run.font).text(run.text, x, y, options);
        else this.doc.font(run.font).text(run.text, options);
      });
    }
    this.doc.x = this.left;
  }

  /** Text wrapped inside a box of `width` (a table cell that may take several lines). */
  wrapped(text: string, x: number, y: number, width: number, align: 'left' | 'right' = 'left', style: TextStyle = {}): void {
    this.style(style);
    const runs = textRuns(text, this.fonts, style.weight ?? 400);
    runs.forEach((run, i) => {
      const options = { width, align, continued: i < runs.length - 1 };
      if (i === 0) this.doc.font(run.font).text(run.text, x, y, options);
      else this.doc.font(run.font).text(run.text, options);
    });
    this.doc.x = this.left;
  }

  /** How tall `wrapped` will draw the text. */
  heightOf(text: string, width: number, style: TextStyle = {}): number {
    this.style(style);
    const runs = textRuns(text, this.fonts, style.weight ?? 400);
    if (runs[0]) this.doc.font(runs[0].font);
    return this.doc.heightOfString(text, { width });
  }

  widthOf(text: string, style: TextStyle = {}): number {
    this.style(style);
    return textRuns(text, this.fonts, style.weight ?? 400).reduce((sum, run) => sum + this.doc.font(run.font).widthOfString(run.text), 0);
  }

  private style(style: TextStyle): void {
    this.doc.fontSize(style.size ?? 10).fillColor(style.color ?? INK);
  }
}

export type PdfDocument = InstanceType<typeof PDFDocument>;
