import { type CalibrationResult, criterionOutcomeLabel, type EvaluationResult, type UnknownFlag } from '@meritline/shared';
import {
  colors,
  formatEstimate,
  formatFixed,
  formatInterval,
  formatLevel,
  formatNumber,
  formatPercent,
  formatPercentValue,
  NOT_AVAILABLE,
  type PdfComposer,
  type PlotLayer,
  pText,
  withUnit,
} from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';
import { anovaTable, type AnovaLine } from './anova.js';
import { traceabilitySection } from './traceability.js';
import { confidenceWords, MODEL_WORDS, notEvaluated, plural, sectionWarnings, WEIGHTING_WORDS, xUnit, yUnit } from './common.js';
import { numbered } from './numbering.js';

const FLAG_WORDS: Record<UnknownFlag, string> = {
  belowRange: 'below the calibrated range',
  aboveRange: 'above the calibrated range',
  belowLod: 'below the LOD',
  belowLoq: 'below the LOQ',
};

function signed(text: string): string {
  return text.startsWith('-') ? `- ${text.slice(1)}` : `+ ${text}`;
}

function equation(c: CalibrationResult): string {
  const b = formatEstimate(c.slope, c.seSlope).value;
  const a = formatEstimate(c.intercept, c.seIntercept).value;
  if (c.model === 'quadratic' && c.curvature !== null)
    return `y = ${formatEstimate(c.curvature, c.seCurvature).value} · x² ${signed(b)} · x ${signed(a)}`;
  if (c.model === 'linear-through-origin' || c.model === 'one-point') return `y = ${b} · x`;
  return `y = ${b} · x ${signed(a)}`;
}

function modelParagraph(pdf: PdfComposer, result: EvaluationResult, c: CalibrationResult, x: string): void {
  const levels = c.levels.length;
  pdf.paragraph(
    `Model: ${MODEL_WORDS[c.model]}, ${WEIGHTING_WORDS[c.weighting]}. ${plural(c.n, 'standard')} at ${plural(levels, 'level')} ` +
      `from ${formatLevel(c.xMin)} to ${formatLevel(c.xMax)} ${x} enter the fit` +
      (c.excluded.length ? `; ${plural(c.excluded.length, 'standard')} excluded (see section ${numbered('outliers', '').trim()}).` : '.'),
  );
  const h = result.homoscedasticity;
  if (!h) {
    notEvaluated(pdf, result, ['homoscedasticity']);
    return;
  }
  const sums = (['none', '1/x', '1/x2'] as const)
    .map((w) => `${WEIGHTING_WORDS[w]} ${h.sumAbsRePct[w] === null ? 'not computable' : formatFixed(h.sumAbsRePct[w], 1)}`)
    .join(', ');
  const spread = h.significant
    ? 'the spread of the responses differs significantly between the ends of the range (heteroscedastic)'
    : 'the spread of the responses does not differ significantly between the ends of the range';
  pdf.paragraph(
    `Choice of weighting: the variance ratio of the replicates at the highest and the lowest level (x = ${formatLevel(h.xHigh)} and ${formatLevel(h.xLow)} ${x}) ` +
      `is F = ${formatNumber(h.F, 3)} with ${h.df[0]} and ${h.df[1]} degrees of freedom (${pText(h.p)}; decision level at 99 %: ${formatNumber(h.critical, 3)}): ${spread}. ` +
      `Sum of the absolute %RE of the back-calculated standards: ${sums}. ${h.advice} ` +
      (h.recommendedWeighting === c.weighting
        ? `The study uses ${WEIGHTING_WORDS[c.weighting]}, as recommended.`
        : `The study uses ${WEIGHTING_WORDS[c.weighting]}, not the recommended ${WEIGHTING_WORDS[h.recommendedWeighting]}.`),
  );
}

function coefficients(pdf: PdfComposer, result: EvaluationResult, c: CalibrationResult, x: string, y: string): void {
  pdf.heading('Calibration function', 3);
  pdf.paragraph(equation(c), { size: 11, weight: 'semibold', gap: 2 });
  pdf.paragraph(
    `y: response in ${y}; x: concentration in ${x}. Coefficients are rounded to their standard errors (two significant digits).`,
    {
      size: 8,
      color: colors.muted,
    },
  );
  const row = (term: string, value: number | null, se: number | null, ci: [number, number] | null, unit: string) => {
    const estimate = formatEstimate(value, se);
    const decimals = estimate.decimals;
    return [
      term,
      estimate.value,
      estimate.uncertainty,
      formatInterval(ci, (v) => (decimals === null ? formatNumber(v, 5) : formatFixed(v, decimals))),
      unit,
    ];
  };
  const rows: string[][] = [row('Slope b', c.slope, c.seSlope, c.ciSlope, `${y} per ${x}`)];
  if (c.model !== 'linear-through-origin' && c.model !== 'one-point')
    rows.push(row('Intercept a', c.intercept, c.seIntercept, c.ciIntercept, y));
  if (c.model === 'quadratic') rows.push(row('Curvature c (x²)', c.curvature, c.seCurvature, c.ciCurvature, `${y} per (${x})²`));
  pdf.table({
    columns: [
      { header: 'Coefficient', width: 1.4 },
      { header: 'Estimate', width: 1.1, align: 'right' },
      { header: 'Standard error', width: 1.1, align: 'right' },
      { header: `${confidenceWords(result)} confidence interval`, width: 2, align: 'right' },
      { header: 'Unit', width: 1.3 },
    ],
    rows,
  });
  pdf.keyValues(
    [
      ['Standards in the fit', `n = ${c.n}${c.df === null ? '' : `, ${c.df} degrees of freedom`}`],
      ['Correlation coefficient r', formatFixed(c.r, 5)],
      ['R² / adjusted R²', `${formatFixed(c.r2, 5)} / ${formatFixed(c.adjR2, 5)}`],
      ['Residual SD s(y/x)', withUnit(formatNumber(c.sYX), y)],
      ['Student t for the intervals', c.t === null ? NOT_AVAILABLE : `${formatNumber(c.t)} (two-sided, ${confidenceWords(result)})`],
    ],
    { labelWidth: 150 },
  );
}

function regressionAnova(pdf: PdfComposer, result: EvaluationResult, c: CalibrationResult): void {
  if (!c.anova) return;
  const a = c.anova;
  const lof = result.lackOfFit;
  const lines: AnovaLine[] = [
    { source: 'Regression', df: a.dfRegression, ss: a.ssRegression, ms: a.msRegression, test: { F: a.F, p: a.p } },
    { source: 'Residual', df: a.dfResidual, ss: a.ssResidual, ms: a.msResidual },
  ];
  if (lof) {
    lines.push(
      {
        source: '   Lack of fit',
        df: lof.dfLackOfFit,
        ss: lof.ssLackOfFit,
        ms: lof.ssLackOfFit / lof.dfLackOfFit,
        test: { F: lof.F, p: lof.p },
      },
      { source: '   Pure error', df: lof.dfPureError, ss: lof.ssPureError, ms: lof.ssPureError / lof.dfPureError },
    );
  }
  lines.push({ source: 'Total', df: a.dfRegression + a.dfResidual, ss: a.ssRegression + a.ssResidual, bold: true });
  anovaTable(pdf, 'Analysis of variance of the regression', lines, 5);
}

function linearityInWords(pdf: PdfComposer, result: EvaluationResult, x: string, y: string): void {
  pdf.heading('Linearity and intercept', 3);
  const lines: string[] = [];
  const lof = result.lackOfFit;
  if (lof) {
    lines.push(
      `Lack-of-fit test: F = ${formatNumber(lof.F, 3)} with ${lof.dfLackOfFit} and ${lof.dfPureError} degrees of freedom, ${pText(lof.p)} (critical F ${formatNumber(lof.critical, 3)}). ` +
        (lof.significant
          ? 'The level means deviate from the fitted function more than the replicates scatter: the model does not describe the data well over this range.'
          : 'The level means deviate from the fitted function no more than the replicates scatter: no evidence that the model is inadequate.'),
    );
  } else {
    lines.push(
      `Lack-of-fit test: not evaluated (${result.warnings.find((w) => w.section === 'lackOfFit')?.message ?? 'no replicated levels'}).`,
    );
  }
  const m = result.mandel;
  if (m) {
    lines.push(
      `Mandel's fitting test (ISO 8466-1): F = ${formatNumber(m.F, 3)} with ${m.df[0]} and ${m.df[1]} degrees of freedom, ${pText(m.p)}; decision level F(99 %) = ${formatNumber(m.critical, 3)}. ` +
        `Residual SD of the straight line ${formatNumber(m.sYXLinear)} ${y}, of the quadratic ${formatNumber(m.sYXQuadratic)} ${y}. ` +
        (m.significant
          ? 'The quadratic fits significantly better: the response is curved over this range.'
          : 'The quadratic does not fit significantly better than the straight line.'),
    );
  } else {
    lines.push(
      `Mandel's fitting test: not evaluated (${result.warnings.find((w) => w.section === 'mandel')?.message ?? 'not applicable'}).`,
    );
  }
  const it = result.interceptTest;
  if (it) {
    lines.push(
      `Intercept: ${formatNumber(it.intercept)} ${y} (standard error ${formatNumber(it.seIntercept)}), t = ${formatNumber(it.t, 3)} with ${it.df} degrees of freedom, ${pText(it.p)}: ` +
        (it.significant ? 'significantly different from zero' : 'not significantly different from zero') +
        `. The intercept is ${formatPercent(it.interceptPctOfTopResponse)} of the response at the top standard.`,
    );
  }
  const o = result.throughOrigin;
  if (o) {
    lines.push(
      `Line forced through the origin, for comparison: slope ${formatNumber(o.slope, 5)} (standard error ${formatNumber(o.seSlope, 2)}), s(y/x) ${formatNumber(o.sYX)} ${y}, ` +
        `uncentred R² ${formatFixed(o.r2, 5)}.` +
        (o.biasAt.length
          ? ` For the unknowns it would change the result by ${o.biasAt.map((b) => `${b.id}: ${formatNumber(b.bias, 3)} ${x}`).join('; ')}.`
          : ''),
    );
  }
  pdf.bullets(lines);
}

function fittedCurve(c: CalibrationResult): { x: number; y: number }[] {
  const steps = 60;
  const c2 = c.curvature ?? 0;
  return Array.from({ length: steps + 1 }, (_, i) => {
    const x = c.xMin + ((c.xMax - c.xMin) * i) / steps;
    return { x, y: c.intercept + c.slope * x + c2 * x * x };
  });
}

function plots(pdf: PdfComposer, result: EvaluationResult, c: CalibrationResult, x: string, y: string): void {
  const level = confidenceWords(result);
  const layers: PlotLayer[] = [];
  if (c.bands?.length) {
    const bands = c.bands;
    const band = (kind: 'prediction' | 'confidence', color: string, opacity: number): PlotLayer => ({
      type: 'band',
      label: `${level} ${kind} band`,
      color,
      opacity,
      points: bands.map((b) => ({ x: b.x, low: b.fit - b[`${kind}HalfWidth`], high: b.fit + b[`${kind}HalfWidth`] })),
    });
    layers.push(band('prediction', colors.spruceLight, 0.45), band('confidence', colors.spruceMid, 0.35));
    layers.push({ type: 'line', label: 'Fitted function', color: colors.spruce, points: c.bands.map((b) => ({ x: b.x, y: b.fit })) });
  } else {
    layers.push({ type: 'line', label: 'Fitted function', color: colors.spruce, points: fittedCurve(c) });
  }
  layers.push({
    type: 'points',
    label: 'Standards in the fit',
    color: colors.text,
    points: c.backCalculated.map((p) => ({ x: p.x, y: p.y })),
  });
  if (c.excluded.length)
    layers.push({
      type: 'points',
      label: 'Excluded standards (not in the fit)',
      color: colors.fail,
      hollow: true,
      radius: 2.8,
      points: c.excluded.map((p) => ({ x: p.x, y: p.y })),
    });
  pdf.plot({
    caption: 'Figure 1. Calibration',
    height: 250,
    x: { label: `Concentration (${x})`, includeZero: true },
    y: { label: `Response (${y})`, includeZero: true },
    layers,
  });

  const standardized = c.standardizedResiduals;
  const residuals = standardized ?? c.residuals;
  if (residuals.length !== c.backCalculated.length || !residuals.length) return;
  const residualLayers: PlotLayer[] = [{ type: 'hline', y: 0, color: colors.ruleStrong }];
  if (standardized) {
    residualLayers.push({ type: 'hline', label: '±2 (about 95 % of residuals fall inside)', y: 2, color: colors.warning, dashed: true });
    residualLayers.push({ type: 'hline', y: -2, color: colors.warning, dashed: true });
  }
  residualLayers.push({
    type: 'points',
    label: standardized ? 'Standardised residual' : `Residual (${y})`,
    color: colors.spruce,
    points: c.backCalculated.map((p, i) => ({ x: p.x, y: residuals[i] })),
  });
  const peak = Math.max(2.5, ...residuals.map(Math.abs));
  pdf.plot({
    caption: 'Figure 2. Residuals',
    height: 175,
    x: { label: `Concentration (${x})`, includeZero: true },
    y: standardized ? { label: 'Residual / s(y/x)', min: -Math.ceil(peak), max: Math.ceil(peak) } : { label: `Residual (${y})` },
    layers: residualLayers,
  });
}

function levelTables(pdf: PdfComposer, c: CalibrationResult, x: string, y: string): void {
  pdf.table({
    caption: 'Standards by level',
    columns: [
      { header: `x (${x})`, align: 'right' },
      { header: 'n', width: 0.5, align: 'right' },
      { header: `Mean response (${y})`, width: 1.4, align: 'right' },
      { header: 'SD of response', width: 1.2, align: 'right' },
      { header: `Mean back-calculated x (${x})`, width: 1.5, align: 'right' },
      { header: 'Mean %RE', width: 0.9, align: 'right' },
      { header: 'RSD %', width: 0.8, align: 'right' },
    ],
    rows: c.levels.map((l) => [
      formatLevel(l.x),
      String(l.n),
      formatNumber(l.yMean, 5),
      formatNumber(l.ySd, 3),
      formatNumber(l.xBackMean, 4),
      formatFixed(l.rePct, 2),
      formatFixed(l.rsdPct, 2),
    ]),
  });
  pdf.table({
    caption: 'Back-calculated standards',
    columns: [
      { header: 'Standard', width: 0.8, align: 'right' },
      { header: `x (${x})`, align: 'right' },
      { header: `Response (${y})`, width: 1.3, align: 'right' },
      { header: `Back-calculated x (${x})`, width: 1.5, align: 'right' },
      { header: '%RE', width: 0.8, align: 'right' },
    ],
    rows: c.backCalculated.map((p) => [
      String(p.index + 1),
      formatLevel(p.x),
      formatNumber(p.y, 5),
      formatNumber(p.xBack, 4),
      formatFixed(p.rePct, 2),
    ]),
    note: '%RE = 100 (back-calculated x - x) / x; not defined at x = 0. Standards are numbered in the order of the study data.',
  });
}

function samples(pdf: PdfComposer, result: EvaluationResult, x: string, y: string): void {
  const unknowns = result.unknowns ?? [];
  if (unknowns.length) {
    pdf.table({
      caption: 'Samples read off the calibration',
      columns: [
        { header: 'Sample', width: 1.1 },
        { header: 'Readings', width: 0.85, align: 'right' },
        { header: `Mean response (${y})`, width: 1.3, align: 'right' },
        { header: 'Dilution', width: 0.7, align: 'right' },
        { header: `Result (${x})`, width: 1.15, align: 'right' },
        { header: `${confidenceWords(result)} interval`, width: 1.6, align: 'right' },
        { header: 'Flags', width: 1.6 },
      ],
      rows: unknowns.map((u) => {
        const estimate = formatEstimate(u.x0, u.sX0);
        const format = (v: number) => (estimate.decimals === null ? formatNumber(v) : formatFixed(v, estimate.decimals));
        return [
          u.id,
          String(u.m),
          formatNumber(u.yMean, 5),
          formatLevel(u.dilution),
          estimate.value,
          formatInterval(u.ci, format),
          u.flags.map((f) => FLAG_WORDS[f]).join('; ') || 'none',
        ];
      }),
    });
  }
  const checks = result.checks ?? [];
  if (checks.length) {
    pdf.table({
      caption: 'Check standards',
      columns: [
        { header: 'Check', width: 1.4 },
        { header: `Nominal (${x})`, align: 'right' },
        { header: `Found (${x})`, align: 'right' },
        { header: 'Recovery %', align: 'right' },
      ],
      rows: checks.map((c) => [c.id, formatLevel(c.nominal), formatNumber(c.found), formatPercentValue(c.recoveryPct)]),
    });
  }
  const range = result.range;
  if (range) {
    const figures = [...new Set(range.levels.flatMap((l) => Object.keys(l.values)))];
    const names: Record<string, string> = { 'range.rePct': 'Mean %RE', 'range.rsdPct': 'RSD %', 'range.recoveryPct': 'Mean recovery %' };
    pdf.table({
      caption: `Working range: ${formatLevel(range.low)} to ${formatLevel(range.high)} ${x}`,
      columns: [
        { header: `Level (${x})`, align: 'right' },
        ...figures.map((f) => ({ header: names[f] ?? f, align: 'right' as const })),
        { header: 'Per-level criteria', align: 'center' },
      ],
      rows: range.levels.map((l) => [formatLevel(l.x), ...figures.map((f) => formatFixed(l.values[f], 2)), criterionOutcomeLabel(l.pass)]),
      note: `The working range is the longest run of adjacent levels at which every per-level criterion is met (basis: ${range.basis === 'standards' ? 'back-calculated standards' : 'recovery by level'}).`,
    });
  }
}

export function calibrationSection(pdf: PdfComposer, content: ReportContent): void {
  const result = content.study.result;
  pdf.heading(numbered('calibration', 'Calibration'));
  const c = result?.calibration;
  if (!result || !c) {
    notEvaluated(pdf, result, ['calibration']);
    return;
  }
  const x = xUnit(content);
  const y = yUnit(content);
  modelParagraph(pdf, result, c, x);
  coefficients(pdf, result, c, x, y);
  regressionAnova(pdf, result, c);
  linearityInWords(pdf, result, x, y);
  plots(pdf, result, c, x, y);
  levelTables(pdf, c, x, y);
  traceabilitySection(pdf, content);
  samples(pdf, result, x, y);
  sectionWarnings(pdf, result, [
    'calibration',
    'lackOfFit',
    'mandel',
    'interceptTest',
    'throughOrigin',
    'homoscedasticity',
    'unknowns',
    'range',
  ]);
}
