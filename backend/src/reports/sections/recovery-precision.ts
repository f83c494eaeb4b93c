import type { EvaluationResult, RecoveryGroup } from '@meritline/shared';
import {
  formatFixed,
  formatInterval,
  formatNumber,
  formatPercent,
  formatPercentValue,
  formatPValue,
  NOT_AVAILABLE,
  type PdfComposer,
  type TableRow,
  withUnit,
} from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';
import { confidenceWords, notEvaluated, sectionWarnings, xUnit } from './common.js';
import { anovaTable } from './anova.js';
import { numbered } from './numbering.js';

function groupRow(group: RecoveryGroup, label: string): string[] {
  const bias = group.significant === null ? NOT_AVAILABLE : group.significant ? 'Yes' : 'No';
  return [
    label,
    String(group.n),
    formatPercentValue(group.meanPct),
    formatPercentValue(group.sdPct),
    formatPercentValue(group.rsdPct),
    formatInterval(group.ci, (v) => formatFixed(v, 1)),
    formatNumber(group.t, 3),
    formatPValue(group.p),
    bias,
  ];
}

function recovery(pdf: PdfComposer, content: ReportContent, result: EvaluationResult): void {
  pdf.heading(numbered('recoveryPrecision', 'Recovery', 1), 2);
  const r = result.recovery;
  if (!r) {
    notEvaluated(pdf, result, ['recovery']);
    return;
  }
  const x = xUnit(content);
  const items = content.study.data.recovery ?? [];
  pdf.table({
    caption: 'Spiked samples',
    columns: [
      { header: 'Sample', width: 1.2 },
      { header: 'Level', width: 0.9 },
      { header: `Added (${x})`, align: 'right' },
      { header: `Native (${x})`, align: 'right' },
      { header: `Found (${x})`, align: 'right' },
      { header: 'Recovery %', align: 'right' },
    ],
    rows: r.items.map((item, i) => {
      const input = items.find((candidate) => candidate.id === item.id) ?? items[i];
      return [
        item.id,
        item.level ?? NOT_AVAILABLE,
        input ? String(input.added) : NOT_AVAILABLE,
        input ? String(input.native ?? 0) : NOT_AVAILABLE,
        input ? String(input.found) : NOT_AVAILABLE,
        formatPercentValue(item.pct),
      ];
    }),
    note: 'Recovery % = 100 (found - native) / added.',
  });
  const rows: TableRow[] = r.byLevel.map((g) => ({ cells: groupRow(g, g.level ?? NOT_AVAILABLE) }));
  rows.push({ cells: groupRow(r.overall, 'All levels'), bold: true, shaded: true });
  pdf.table({
    caption: 'Recovery by level',
    columns: [
      { header: 'Level', width: 1.1 },
      { header: 'n', width: 0.45, align: 'right' },
      { header: 'Mean %', width: 0.8, align: 'right' },
      { header: 'SD %', width: 0.7, align: 'right' },
      { header: 'RSD %', width: 0.7, align: 'right' },
      { header: `${confidenceWords(result)} interval %`, width: 1.5, align: 'right' },
      { header: 't', width: 0.7, align: 'right' },
      { header: 'p', width: 0.7, align: 'right' },
      { header: 'Bias?', width: 0.7, align: 'center' },
    ],
    rows,
    note: `t tests the mean recovery against 100 % (two-sided); "Bias? Yes" means the mean differs significantly from 100 % at the ${confidenceWords(result)} level.`,
  });
  sectionWarnings(pdf, result, ['recovery']);
}

function precision(pdf: PdfComposer, content: ReportContent, result: EvaluationResult): void {
  pdf.heading(numbered('recoveryPrecision', 'Precision', 2), 2);
  const p = result.precision;
  if (!p) {
    notEvaluated(pdf, result, ['precision']);
    return;
  }
  const x = xUnit(content);
  pdf.table({
    caption: 'Series',
    columns: [
      { header: 'Series', width: 1.6 },
      { header: 'n', width: 0.5, align: 'right' },
      { header: `Mean (${x})`, align: 'right' },
      { header: `SD (${x})`, align: 'right' },
    ],
    rows: p.series.map((s) => [s.group, String(s.n), formatNumber(s.mean, 5), formatNumber(s.sd, 3)]),
  });
  const total = (p.ssBetween ?? 0) + p.ssWithin;
  anovaTable(
    pdf,
    'One-way analysis of variance (ISO 5725-2)',
    [
      { source: 'Between series', df: p.dfBetween, ss: p.ssBetween, ms: p.msBetween, test: { F: p.F, p: p.p } },
      { source: 'Within series', df: p.dfWithin, ss: p.ssWithin, ms: p.msWithin },
      { source: 'Total', df: p.N - 1, ss: total, bold: true },
    ],
    4,
  );
  const pairs: [string, string][] = [
    [
      'Results',
      `N = ${p.N} in k = ${p.k} series; grand mean ${withUnit(formatNumber(p.grandMean, 5), x)}${p.n0 === null ? '' : `; n0 = ${formatNumber(p.n0, 3)}`}`,
    ],
    ['Repeatability', `SD ${withUnit(formatNumber(p.sR, 3), x)}, RSD ${formatPercent(p.rsdR)}`],
    ['Between-series SD', p.sBetween === null ? NOT_AVAILABLE : withUnit(formatNumber(p.sBetween, 3), x)],
    ['Intermediate precision', `SD ${withUnit(formatNumber(p.sI, 3), x)}, RSD ${formatPercent(p.rsdI)}`],
  ];
  if (p.horwitz) {
    pairs.push([
      'Horwitz',
      `mass fraction ${formatNumber(p.horwitz.massFraction, 3)}; predicted reproducibility RSD ${formatPercent(p.horwitz.predictedRsd)} (2^(1 - 0.5 log10 C), Horwitz 1980); ` +
        `HorRat (intermediate-precision RSD over the predicted RSD) ${formatFixed(p.horwitz.horRat, 2)}; repeatability HorRat ${formatFixed(p.horwitz.horRatRepeatability, 2)}`,
    ]);
  } else {
    pairs.push(['Horwitz', 'not evaluated: the study gives no mass fraction']);
  }
  pdf.keyValues(pairs, { labelWidth: 130 });
  sectionWarnings(pdf, result, ['precision']);
}

export function recoveryPrecisionSection(pdf: PdfComposer, content: ReportContent): void {
  pdf.heading(numbered('recoveryPrecision', 'Recovery and precision'));
  const result = content.study.result;
  if (!result) {
    notEvaluated(pdf, result, ['recovery', 'precision']);
    return;
  }
  recovery(pdf, content, result);
  precision(pdf, content, result);
}
