import { formatDate, formatEstimate, formatLevel, formatNumber, type PdfComposer, type TableRow } from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';

type Preparation = ReportContent['preparations'][number];

function standardsWords(p: Preparation, content: ReportContent): string {
  const standards = content.study.data.standards ?? [];
  const listed = p.standards.map((i) => `${i + 1} (x = ${formatLevel(standards[i]?.x)})`).join(', ');
  return `${p.standards.length === 1 ? 'Standard' : 'Standards'} ${listed}`;
}

function rows(p: Preparation): TableRow[] {
  const line = (label: string, c: number, u: number, bold = false): TableRow => {
    const e = formatEstimate(c, u);
    return {
      cells: [label, `${e.value} ${p.stock.unit}`, `${e.uncertainty} ${p.stock.unit}`, `${formatNumber((100 * u) / c, 2)} %`],
      bold,
    };
  };
  return [line('Stock', p.stock.concentration, p.stock.u, true), ...p.steps.map((s, i) => line(`Dilution ${i + 1}`, s.concentration, s.u))];
}

/** Material and lot → stock → working standards, each with its standard uncertainty, for the standards that name a preparation. */
export function traceabilitySection(pdf: PdfComposer, content: ReportContent): void {
  if (!content.preparations.length) return;
  pdf.heading('Traceability of the standards', 3);
  for (const p of content.preparations) {
    const m = p.material;
    const purity = formatEstimate(p.source.purity, p.source.uPurity);
    pdf.keyValues([
      ['Preparation', `${p.name} (saved ${formatDate(p.savedAt)} by ${p.savedBy})`],
      [
        'Reference material',
        m
          ? `${m.name}, ${m.supplier}, lot ${m.lot}, certificate ${m.certificateNumber}, use until ${m.expiresOn}`
          : 'Purity entered by hand',
      ],
      ['Purity', `${purity.value} g/g, standard uncertainty ${purity.uncertainty} g/g`],
      ['Used by', standardsWords(p, content)],
    ]);
    pdf.table({
      columns: [
        { header: 'Solution', width: 1.2 },
        { header: 'Concentration', width: 1.3, align: 'right' },
        { header: 'Standard uncertainty', width: 1.3, align: 'right' },
        { header: 'Relative', width: 0.8, align: 'right' },
      ],
      rows: rows(p),
    });
  }
  pdf.paragraph(
    'Each concentration follows c = 1000 · m · P / V for the stock and c·a/V for each dilution, with relative standard uncertainties combined in quadrature (GUM 5.1.6); flask and pipette tolerances count as rectangular, a/sqrt(3), or triangular, a/sqrt(6), as entered.',
    { size: 8 },
  );
}
