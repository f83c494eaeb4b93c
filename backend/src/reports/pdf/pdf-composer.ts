import PDFDocument from 'pdfkit';
import { fontName, fontRuns, printable, selectFont, type FontWeight } from './fonts.js';
import { drawPlot, type PlotSpec } from './plot.js';
import { drawTable, type TableSpec } from './table.js';
import { A4, colors, margins, sizes } from './theme.js';

export interface TextStyle {
  size?: number;
  weight?: FontWeight;
  color?: string;
  align?: 'left' | 'right' | 'center' | 'justify';
  lineGap?: number;
  characterSpacing?: number;
}

export interface PdfComposerOptions {
  /** Document title in the PDF properties. */
  title: string;
  author?: string;
  subject?: string;
  keywords?: string;
  /** Running header on every page: left and right halves. */
  header: { left: string; right: string };
  /** Footer text beside "page x of y" on every page (e.g. the data hash). */
  footer: string;
  /** Diagonal text across every page, e.g. for drafts. */
  watermark?: string | null;
  /** Extra entries of the PDF document information dictionary (ASCII values). */
  info?: Record<string, string>;
}

export type CalloutTone = 'neutral' | 'pass' | 'fail' | 'warning';

const TONES: Record<CalloutTone, { border: string; fill: string; title: string }> = {
  neutral: { border: colors.ruleStrong, fill: colors.panel, title: colors.spruce },
  pass: { border: colors.pass, fill: colors.spruceWash, title: colors.pass },
  fail: { border: colors.fail, fill: '#fbf0ec', title: colors.fail },
  warning: { border: colors.warning, fill: '#fff8eb', title: colors.warning },
};

/**
 * An A4 document with the embedded IBM Plex Sans fonts and Meritline's layout: a running header,
 * a footer with "page x of y", headings, paragraphs, key-value blocks, tables and vector plots.
 * Content flows top to bottom and breaks pages on its own; `finish()` returns the PDF bytes.
 */
export class PdfComposer {
  readonly doc: PDFKit.PDFDocument;
  private readonly chunks: Buffer[] = [];
  private readonly done: Promise<Buffer>;

  constructor(private readonly options: PdfComposerOptions) {
    this.doc = new PDFDocument({
      size: 'A4',
      margins,
      bufferPages: true,
      autoFirstPage: true,
      lang: 'en',
      displayTitle: true,
      info: { Title: options.title, Creator: 'Meritline', Producer: 'Meritline' },
    });
    // pdfkit hashes every information entry into the file ID, so none may be undefined.
    const extra = { Author: options.author, Subject: options.subject, Keywords: options.keywords, ...options.info };
    for (const [key, value] of Object.entries(extra)) if (value !== undefined) (this.doc.info as Record<string, unknown>)[key] = value;
    this.style();
    this.done = new Promise<Buffer>((resolve, reject) => {
      this.doc.on('data', (chunk: Buffer) => this.chunks.push(chunk));
      this.doc.on('end', () => resolve(Buffer.concat(this.chunks)));
      this.doc.on('error', reject);
    });
  }

  get left(): number {
    return margins.left;
  }

  get width(): number {
    return A4.width - margins.left - margins.right;
  }

  get bottom(): number {
    return A4.height - margins.bottom;
  }

  get y(): number {
    return this.doc.y;
  }

  set y(value: number) {
    this.doc.y = value;
  }

  /** Sets font, size and colour for measuring or drawing. */
  style(style: TextStyle = {}): this {
    selectFont(this.doc, fontName(style.weight ?? 'regular'));
    this.doc.fontSize(style.size ?? sizes.body).fillColor(style.color ?? colors.text);
    return this;
  }

  heightOf(text: string, width: number, style: TextStyle = {}): number {
    this.style(style);
    return this.doc.heightOfString(printable(text), { width, lineGap: style.lineGap ?? 1.5, characterSpacing: style.characterSpacing });
  }

  widthOf(text: string, style: TextStyle = {}): number {
    this.style(style);
    return this.doc.widthOfString(printable(text), { characterSpacing: style.characterSpacing });
  }

  /** Draws text at (x, y) within `width`, switching fonts inside the text where a character needs another script. */
  textAt(text: string, x: number, y: number, width: number, style: TextStyle = {}, lineBreak = true): this {
    this.style(style);
    const runs = fontRuns(text, style.weight ?? 'regular');
    const base = {
      width,
      align: runs.length > 1 ? 'left' : style.align,
      lineGap: style.lineGap ?? 1.5,
      characterSpacing: style.characterSpacing,
      lineBreak,
    };
    runs.forEach((run, i) => {
      selectFont(this.doc, run.font);
      const options = { ...base, continued: i < runs.length - 1 };
      if (i === 0) this.doc.text(run.text, x, y, options);
      else this.doc.text(run.text, options);
    });
    return this;
  }

  /** Starts a new page unless `height` points still fit on this one. */
  ensureSpace(height: number): this {
    if (this.doc.y + height > this.bottom) this.newPage();
    return this;
  }

  newPage(): this {
    this.doc.addPage();
    this.doc.x = this.left;
    this.doc.y = margins.top;
    return this;
  }

  space(points: number): this {
    if (this.doc.y + points <= this.bottom) this.doc.y += points;
    return this;
  }

  /** Level 1 opens a section with a rule; a heading is never left alone at the foot of a page. */
  heading(text: string, level: 1 | 2 | 3 = 1): this {
    const size = level === 1 ? sizes.heading1 : level === 2 ? sizes.heading2 : sizes.heading3;
    const before = level === 1 ? 16 : level === 2 ? 12 : 8;
    const height = this.heightOf(text, this.width, { size, weight: 'semibold' });
    if (this.doc.y > margins.top + 1) this.space(before);
    this.ensureSpace(height + 100);
    const top = this.doc.y;
    this.textAt(text, this.left, top, this.width, { size, weight: 'semibold', color: colors.spruce });
    this.doc.y = top + height + (level === 1 ? 4 : 3);
    if (level === 1) {
      this.doc
        .moveTo(this.left, this.doc.y)
        .lineTo(this.left + this.width, this.doc.y)
        .lineWidth(0.8)
        .strokeColor(colors.spruce)
        .stroke();
      this.doc.y += 8;
    }
    return this;
  }

  paragraph(text: string, style: TextStyle & { gap?: number; indent?: number } = {}): this {
    const indent = style.indent ?? 0;
    const width = this.width - indent;
    const height = this.heightOf(text, width, style);
    this.ensureSpace(Math.min(height, 40));
    this.textAt(text, this.left + indent, this.doc.y, width, style);
    this.doc.x = this.left;
    this.doc.y += style.gap ?? 5;
    return this;
  }

  /** A label above a block in small capitals, e.g. the laboratory name on a cover. */
  label(text: string, color: string = colors.muted): this {
    return this.paragraph(text.toUpperCase(), { size: sizes.small, weight: 'semibold', color, characterSpacing: 0.3, gap: 2 });
  }

  bullets(items: string[], style: TextStyle = {}): this {
    for (const item of items) {
      const height = this.heightOf(item, this.width - 12, style);
      this.ensureSpace(height);
      const top = this.doc.y;
      this.textAt('•', this.left + 2, top, 8, { ...style, color: colors.spruceMid });
      this.textAt(item, this.left + 12, top, this.width - 12, style);
      this.doc.y = top + height + 3;
    }
    this.doc.x = this.left;
    this.doc.y += 2;
    return this;
  }

  /** Label–value pairs in two columns; a pair never splits across pages. */
  keyValues(rows: [label: string, value: string][], options: { labelWidth?: number; size?: number } = {}): this {
    const labelWidth = options.labelWidth ?? 150;
    const size = options.size ?? sizes.body;
    const valueWidth = this.width - labelWidth - 8;
    for (const [label, value] of rows) {
      const height = Math.max(this.heightOf(label, labelWidth, { size, weight: 'semibold' }), this.heightOf(value, valueWidth, { size }));
      this.ensureSpace(height + 3);
      const top = this.doc.y;
      this.textAt(label, this.left, top, labelWidth, { size, weight: 'semibold', color: colors.muted });
      this.textAt(value, this.left + labelWidth + 8, top, valueWidth, { size });
      this.doc.y = top + height + 3.5;
    }
    this.doc.x = this.left;
    this.doc.y += 4;
    return this;
  }

  /** A boxed message; the tone colours the border, the title carries the meaning in words. */
  callout(title: string, lines: string[], tone: CalloutTone = 'neutral'): this {
    const palette = TONES[tone];
    const inner = this.width - 24;
    const titleHeight = this.heightOf(title, inner, { size: sizes.heading3, weight: 'semibold' });
    const bodyHeights = lines.map((line) => this.heightOf(line, inner, { size: sizes.body }));
    const height = 16 + titleHeight + bodyHeights.reduce((sum, h) => sum + h + 3, 0) + (lines.length ? 2 : -2);
    this.ensureSpace(height + 6);
    const top = this.doc.y;
    this.doc.save();
    this.doc.rect(this.left, top, this.width, height).fill(palette.fill);
    this.doc.rect(this.left, top, 3, height).fill(palette.border);
    this.doc.restore();
    let y = top + 8;
    this.textAt(title, this.left + 14, y, inner, { size: sizes.heading3, weight: 'semibold', color: palette.title });
    y += titleHeight + 4;
    lines.forEach((line, i) => {
      this.textAt(line, this.left + 14, y, inner, { size: sizes.body });
      y += bodyHeights[i] + 3;
    });
    this.doc.x = this.left;
    this.doc.y = top + height + 8;
    return this;
  }

  table(spec: TableSpec): this {
    drawTable(this, spec);
    return this;
  }

  plot(spec: PlotSpec): this {
    drawPlot(this, spec);
    return this;
  }

  /** Embeds a file (e.g. the data the numbers were computed from) as a PDF attachment. */
  attach(name: string, content: Buffer, description: string, type = 'application/octet-stream'): this {
    this.doc.file(content, { name, description, type, hidden: false });
    return this;
  }

  /** Draws the running header, footer and watermark on every page and returns the finished PDF. */
  async finish(): Promise<Buffer> {
    const { start, count } = this.doc.bufferedPageRange();
    for (let i = 0; i < count; i++) {
      this.doc.switchToPage(start + i);
      this.drawPageFrame(i + 1, count);
    }
    this.doc.end();
    return this.done;
  }

  private drawPageFrame(page: number, pages: number): void {
    const saved = this.doc.page.margins;
    // Text below the bottom margin would otherwise start a new page.
    this.doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
    const { header, footer, watermark } = this.options;
    const half = this.width / 2;
    const headerY = 32;
    const tiny = { size: sizes.tiny, color: colors.muted };
    this.textAt(header.left, this.left, headerY, half + 60, { ...tiny, weight: 'semibold' }, false);
    this.textAt(header.right, this.left + half + 60, headerY, half - 60, { ...tiny, align: 'right' }, false);
    this.doc
      .moveTo(this.left, headerY + 12)
      .lineTo(this.left + this.width, headerY + 12)
      .lineWidth(0.5)
      .strokeColor(colors.rule)
      .stroke();

    const footerY = A4.height - 38;
    this.doc
      .moveTo(this.left, footerY - 6)
      .lineTo(this.left + this.width, footerY - 6)
      .lineWidth(0.5)
      .strokeColor(colors.rule)
      .stroke();
    this.textAt(footer, this.left, footerY, this.width - 70, tiny, false);
    this.textAt(`page ${page} of ${pages}`, this.left + this.width - 70, footerY, 70, { ...tiny, align: 'right' }, false);

    if (watermark) {
      const size = 44;
      const centre = { x: A4.width / 2, y: A4.height / 2 };
      this.doc.save();
      this.doc.rotate(-52, { origin: [centre.x, centre.y] });
      this.doc.fillOpacity(0.13);
      this.textAt(
        watermark,
        centre.x - 400,
        centre.y - size / 2,
        800,
        { size, weight: 'semibold', color: colors.watermark, align: 'center' },
        false,
      );
      this.doc.restore();
    }
    this.doc.page.margins = saved;
  }
}

export function createPdfComposer(options: PdfComposerOptions): PdfComposer {
  return new PdfComposer(options);
}
