import type { EvaluationResult } from '@meritline/shared';
import {
  colors,
  formatNumber,
  formatPercent,
  NOT_AVAILABLE,
  withUnit,
  type PdfComposer,
  type PlotLayer,
  type TableRow,
  formatPercentValue,
} from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';
import { notEvaluated, plural, sectionWarnings, xUnit } from './common.js';
import { numbered } from './numbering.js';

const pct = (value: number | null | undefined) => formatPercent(value);
const betaText = (beta: number) => `${formatNumber(beta * 100, 3)} %`;

function validityText(result: EvaluationResult, x: string): string {
  const p = result.accuracyProfile!;
  if (p.validFrom === null || p.validTo === null)
    return `At no level do both tolerance limits stay inside ±${formatNumber(p.lambda, 3)} %: the profile gives no validity domain.`;
  return (
    `Validity domain: from ${withUnit(formatNumber(p.validFrom, 4), x)} (lower limit of quantitation) to ${withUnit(formatNumber(p.validTo, 4), x)} ` +
    `(upper limit of quantitation). In this range, on average ${betaText(p.beta)} of future results are expected within ±${formatNumber(p.lambda, 3)} % of the true value.`
  );
}

function accuracyProfile(pdf: PdfComposer, content: ReportContent, result: EvaluationResult): void {
  pdf.heading(numbered('accuracyUncertainty', 'Accuracy profile', 1), 2);
  const p = result.accuracyProfile;
  if (!p) {
    notEvaluated(pdf, result, ['accuracyProfile']);
    return;
  }
  const x = xUnit(content);
  pdf.paragraph(
    `Total-error approach: at each level the relative bias and the β-expectation tolerance limits (β = ${betaText(p.beta)}) ` +
      `from ${plural(p.levels[0]?.series ?? 0, 'series', 'series')} of replicates, judged against acceptance limits of ±${formatNumber(p.lambda, 3)} %.`,
  );
  pdf.table({
    caption: 'Accuracy profile by level',
    columns: [
      { header: 'Level', width: 0.8 },
      { header: `Nominal (${x})`, align: 'right' },
      { header: 'Series × replicates', width: 1.1, align: 'right' },
      { header: `Mean found (${x})`, align: 'right' },
      { header: 'Relative bias %', align: 'right' },
      { header: 'Repeatability RSD %', width: 0.8, align: 'right' },
      { header: 'Intermediate precision RSD %', width: 0.8, align: 'right' },
      { header: 'Lower limit %', align: 'right' },
      { header: 'Upper limit %', align: 'right' },
      { header: `Inside ±${formatNumber(p.lambda, 3)} %`, width: 0.9, align: 'center' },
    ],
    rows: p.levels.map((l) => ({
      cells: [
        l.level,
        formatNumber(l.nominal, 4),
        `${l.series} × ${l.replicates}`,
        formatNumber(l.mean, 4),
        formatPercentValue(l.biasPct),
        formatPercentValue(l.rsdRPct),
        formatPercentValue(l.rsdIPct),
        formatPercentValue(l.lowerPct),
        formatPercentValue(l.upperPct),
        l.within ? 'Yes' : 'No',
      ],
      bold: !l.within,
    })),
    note: 'Lower and upper limit: the β-expectation tolerance interval (Mee 1984) around the mean, as % of the nominal value.',
  });
  const reach = Math.ceil(
    Math.max(p.lambda * 1.3, ...p.levels.flatMap((l) => [Math.abs(l.lowerPct), Math.abs(l.upperPct)]).map((v) => v * 1.1)),
  );
  const layers: PlotLayer[] = [];
  if (p.validFrom !== null && p.validTo !== null)
    layers.push({
      type: 'band',
      label: 'Validity domain',
      color: colors.spruceLight,
      opacity: 0.35,
      points: [
        { x: p.validFrom, low: -reach, high: reach },
        { x: p.validTo, low: -reach, high: reach },
      ],
    });
  layers.push(
    { type: 'hline', label: `Acceptance limits ±${formatNumber(p.lambda, 3)} %`, y: p.lambda, color: colors.warning, dashed: true },
    { type: 'hline', y: -p.lambda, color: colors.warning, dashed: true },
    { type: 'hline', y: 0, color: colors.ruleStrong },
    {
      type: 'line',
      label: `Tolerance limits (β = ${betaText(p.beta)})`,
      color: colors.spruceMid,
      dashed: true,
      points: p.levels.map((l) => ({ x: l.nominal, y: l.upperPct })),
    },
    { type: 'line', color: colors.spruceMid, dashed: true, points: p.levels.map((l) => ({ x: l.nominal, y: l.lowerPct })) },
    { type: 'line', color: colors.spruce, width: 1.4, points: p.levels.map((l) => ({ x: l.nominal, y: l.biasPct })) },
    {
      type: 'points',
      label: 'Relative bias',
      color: colors.spruce,
      radius: 2.8,
      points: p.levels.map((l) => ({ x: l.nominal, y: l.biasPct })),
    },
  );
  pdf.plot({
    caption: 'Accuracy profile',
    height: 220,
    x: { label: `Nominal concentration (${x})` },
    y: { label: 'Relative bias and tolerance limits (%)', min: -reach, max: reach },
    layers,
  });
  pdf.paragraph(validityText(result, x));
  sectionWarnings(pdf, result, ['accuracyProfile']);
}

function trueness(pdf: PdfComposer, content: ReportContent, result: EvaluationResult): void {
  pdf.heading(numbered('accuracyUncertainty', 'Trueness against a reference material', 2), 2);
  const t = result.trueness;
  if (!t) {
    pdf.paragraph('Not evaluated: the study has no results on a reference material.', { color: colors.muted });
    return;
  }
  const x = xUnit(content);
  const v = (value: number, digits = 4) => withUnit(formatNumber(value, digits), x);
  pdf.keyValues(
    [
      ['Certified value', `${v(t.certified)}, standard uncertainty ${v(t.uCertified, 3)}`],
      ['Found', `mean ${v(t.mean)} of ${t.n} results, SD ${v(t.sd, 3)}`],
      ['Difference', `${v(t.difference, 3)} (${pct(t.differencePct)})`],
      ['Expanded uncertainty of the difference', `${v(t.UDifference, 3)} = 2 × √(s²/n + u(certified)²)`],
    ],
    { labelWidth: 170 },
  );
  const direction = t.difference >= 0 ? 'above' : 'below';
  pdf.paragraph(
    `The mean found is ${v(Math.abs(t.difference), 3)} ${direction} the certified value. ` +
      (t.significant
        ? 'The difference is larger than its expanded uncertainty: the method shows a bias on this material.'
        : 'The difference lies within its expanded uncertainty: no bias is shown on this material.'),
  );
}

function uncertainty(pdf: PdfComposer, content: ReportContent, result: EvaluationResult): void {
  pdf.heading(numbered('accuracyUncertainty', 'Measurement uncertainty', 3), 2);
  const u = result.uncertainty;
  if (!u) {
    notEvaluated(pdf, result, ['uncertainty']);
    return;
  }
  const x = xUnit(content);
  const rows: TableRow[] = u.byLevel.map((l) => {
    const relative = l.expressedAs === 'relative';
    const show = (absolute: number, percent: number) => (relative ? `${formatPercent(percent)}` : withUnit(formatNumber(absolute, 3), x));
    return {
      cells: [
        l.level,
        formatNumber(l.concentration, 4),
        relative ? 'relative' : 'absolute',
        show(l.uRw, l.uRwPct),
        show(l.uBias, l.uBiasPct),
        show(l.uc, l.ucPct),
        show(l.U, l.UPct),
      ],
    };
  });
  pdf.table({
    caption: `Measurement uncertainty by level (k = ${formatNumber(u.coverageFactor, 3)})`,
    columns: [
      { header: 'Level', width: 0.8 },
      { header: `Concentration (${x})`, width: 1.1, align: 'right' },
      { header: 'Stated', width: 0.8 },
      { header: 'u(Rw)', align: 'right' },
      { header: 'u(bias)', align: 'right' },
      { header: 'uc', align: 'right' },
      { header: 'U', align: 'right' },
    ],
    rows,
    note:
      'u(Rw): within-laboratory reproducibility (intermediate precision); u(bias): root mean square of the biases combined with the uncertainty of the reference values; ' +
      `uc = √(u(Rw)² + u(bias)²); U = k·uc (Nordtest TR 537).${u.relativeAbove !== null ? ` Stated in ${x} below ${withUnit(formatNumber(u.relativeAbove, 4), x)}, relative from it on.` : ''}`,
  });
  const samples = (result.unknowns ?? []).filter((s) => s.sX0 !== null);
  if (samples.length) {
    pdf.table({
      caption: 'For comparison: the calibration alone, u(x0) of the samples read off the line',
      columns: [
        { header: 'Sample', width: 2.2 },
        { header: `Found (${x})`, align: 'right' },
        { header: `u(x0) (${x})`, align: 'right' },
        { header: 'u(x0) relative %', align: 'right' },
      ],
      rows: samples.map((s) => [
        s.id,
        formatNumber(s.x0, 4),
        formatNumber(s.sX0, 3),
        s.x0 ? formatPercentValue((100 * (s.sX0 as number)) / Math.abs(s.x0)) : NOT_AVAILABLE,
      ]),
      note: 'u(x0) covers only the scatter about the calibration line; U also covers day-to-day precision and bias.',
    });
  }
  sectionWarnings(pdf, result, ['uncertainty']);
}

export function accuracyUncertaintySection(pdf: PdfComposer, content: ReportContent): void {
  pdf.heading(numbered('accuracyUncertainty', 'Accuracy profile, trueness and measurement uncertainty'));
  const result = content.study.result;
  if (!result) {
    notEvaluated(pdf, result, ['accuracyProfile', 'trueness', 'uncertainty']);
    return;
  }
  if (!result.accuracyProfile && !result.trueness && !result.uncertainty) {
    pdf.paragraph('Not evaluated: the study has no accuracy design, reference material or uncertainty options.', { color: colors.muted });
    return;
  }
  accuracyProfile(pdf, content, result);
  trueness(pdf, content, result);
  uncertainty(pdf, content, result);
}
