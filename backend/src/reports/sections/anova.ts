import { formatInteger, formatNumber, formatPValue, type PdfComposer } from '../pdf/index.js';

type Num = number | null | undefined;

/** One line of an analysis-of-variance table; F and p only on the line that is tested. */
export interface AnovaLine {
  source: string;
  df: Num;
  ss: Num;
  ms?: Num;
  test?: { F: Num; p: Num };
  bold?: boolean;
}

/** Sums of squares and mean squares to `digits` significant digits, F to 4, p by the shared p rule. */
export function anovaTable(pdf: PdfComposer, caption: string, lines: AnovaLine[], digits: number): void {
  pdf.table({
    caption,
    columns: [
      { header: 'Source', width: 1.6 },
      { header: 'df', width: 0.6, align: 'right' },
      { header: 'Sum of squares', width: 1.5, align: 'right' },
      { header: 'Mean square', width: 1.5, align: 'right' },
      { header: 'F', width: 1.1, align: 'right' },
      { header: 'p', width: 0.9, align: 'right' },
    ],
    rows: lines.map(({ source, df, ss, ms, test, bold }) => ({
      cells: [
        source,
        formatInteger(df),
        formatNumber(ss, digits),
        ms === undefined ? '' : formatNumber(ms, digits),
        test ? formatNumber(test.F, 4) : '',
        test ? formatPValue(test.p) : '',
      ],
      bold,
    })),
  });
}
