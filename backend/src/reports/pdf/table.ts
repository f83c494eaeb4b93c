import type { PdfComposer } from './pdf-composer.js';
import { colors, sizes } from './theme.js';

export interface TableColumn {
  header: string;
  /** Relative width (default 1); columns share the content width in proportion. */
  width?: number;
  align?: 'left' | 'right' | 'center';
}

export interface TableRow {
  cells: string[];
  /** Semibold, e.g. an overall or a highlighted row. */
  bold?: boolean;
  /** A light tint behind the row. */
  shaded?: boolean;
}

export interface TableSpec {
  columns: TableColumn[];
  rows: (string[] | TableRow)[];
  /** A small heading kept with the table's first rows. */
  caption?: string;
  /** A line under the table, e.g. what an abbreviation means. */
  note?: string;
  fontSize?: number;
  /** Shown as the only row when `rows` is empty. */
  empty?: string;
}

const PAD_X = 4;
const PAD_Y = 3.2;

/** Rows never split; when the page is full the table continues on the next page under a repeated header. */
export function drawTable(pdf: PdfComposer, spec: TableSpec): void {
  const size = spec.fontSize ?? sizes.table;
  const total = spec.columns.reduce((sum, c) => sum + (c.width ?? 1), 0);
  const widths = spec.columns.map((c) => (pdf.width * (c.width ?? 1)) / total);
  const rows: TableRow[] = spec.rows.map((row) => (Array.isArray(row) ? { cells: row } : row));
  if (!rows.length && spec.empty) rows.push({ cells: [spec.empty, ...spec.columns.slice(1).map(() => '')] });

  const cellHeight = (text: string, i: number, bold: boolean) =>
    pdf.heightOf(text, widths[i] - 2 * PAD_X, { size, weight: bold ? 'semibold' : 'regular', lineGap: 1 });
  const rowHeight = (cells: string[], bold: boolean) => Math.max(...cells.map((text, i) => cellHeight(text ?? '', i, bold))) + 2 * PAD_Y;
  const headerHeight = rowHeight(
    spec.columns.map((c) => c.header),
    true,
  );

  const drawCells = (cells: string[], top: number, bold: boolean, color: string = colors.text) => {
    let x = pdf.left;
    cells.forEach((text, i) => {
      pdf.textAt(text ?? '', x + PAD_X, top + PAD_Y, widths[i] - 2 * PAD_X, {
        size,
        weight: bold ? 'semibold' : 'regular',
        color,
        align: spec.columns[i].align ?? 'left',
        lineGap: 1,
      });
      x += widths[i];
    });
  };
  const rule = (y: number, color: string, width: number) =>
    pdf.doc
      .moveTo(pdf.left, y)
      .lineTo(pdf.left + pdf.width, y)
      .lineWidth(width)
      .strokeColor(color)
      .stroke();
  const drawHeader = () => {
    const top = pdf.y;
    drawCells(
      spec.columns.map((c) => c.header),
      top,
      true,
      colors.spruce,
    );
    rule(top + headerHeight, colors.ruleStrong, 0.7);
    pdf.y = top + headerHeight;
  };

  const captionHeight = spec.caption ? pdf.heightOf(spec.caption, pdf.width, { size: sizes.heading3, weight: 'semibold' }) + 4 : 0;
  const firstRows = rows.slice(0, 3).reduce((sum, row) => sum + rowHeight(row.cells, !!row.bold), 0);
  pdf.ensureSpace(captionHeight + headerHeight + firstRows);
  if (spec.caption) pdf.paragraph(spec.caption, { size: sizes.heading3, weight: 'semibold', color: colors.text, gap: 3 });
  drawHeader();

  for (const row of rows) {
    const height = rowHeight(row.cells, !!row.bold);
    if (pdf.y + height > pdf.bottom) {
      pdf.newPage();
      drawHeader();
    }
    const top = pdf.y;
    if (row.shaded) pdf.doc.save().rect(pdf.left, top, pdf.width, height).fill(colors.spruceWash).restore();
    drawCells(row.cells, top, !!row.bold);
    rule(top + height, colors.rule, 0.4);
    pdf.y = top + height;
  }
  pdf.doc.x = pdf.left;
  pdf.y += 4;
  if (spec.note) pdf.paragraph(spec.note, { size: sizes.small, color: colors.muted });
  pdf.y += 4;
}
