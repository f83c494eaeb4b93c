import { RUN_CAUTION, type DetectionApproach, type RunDto, type RunResult, type ValidationBasis } from '@meritline/shared';
import {
  colors,
  createPdfComposer,
  formatDate,
  formatDateTime,
  formatNumber,
  formatPercentValue,
  withUnit,
  type PlotLayer,
  type PlotPoint,
} from '../reports/pdf/index.js';
import { APPROACH_LABELS } from '../reports/report-figures.js';

const MODEL_NAMES: Record<string, string> = {
  'one-point': 'One-point (line through the origin)',
  'two-point': 'Two-point (line through two standards)',
  linear: 'Straight-line regression',
  quadratic: 'Quadratic regression',
};

/** LOD and LOQ of the measured solution, each with the approach it comes from, in words. */
export function limitsText(validation: ValidationBasis, xUnit: string): string {
  const { lod, loq, lodBasis, loqBasis } = validation;
  const words = (basis: DetectionApproach | null) => (basis ? APPROACH_LABELS[basis] : 'not computed');
  if (lodBasis === loqBasis) {
    return `${withUnit(formatNumber(lod, 3), xUnit)} / ${withUnit(formatNumber(loq, 3), xUnit)} (measured solution; both from: ${words(lodBasis)})`;
  }
  return (
    `LOD ${withUnit(formatNumber(lod, 3), xUnit)} (${words(lodBasis)}); ` +
    `LOQ ${withUnit(formatNumber(loq, 3), xUnit)} (${words(loqBasis)}); measured solution`
  );
}

/** The response the run's calibration predicts at x (bracketing: the segment that covers x). */
export function responseAt(result: RunResult, x: number): number {
  const calibration = result.calibration!;
  const segment = calibration.segments?.find((s) => x <= s.xHigh) ?? calibration.segments?.at(-1);
  if (segment) return segment.intercept + segment.slope * x;
  return calibration.intercept + calibration.slope * x + (calibration.curvature ?? 0) * x * x;
}

function curve(from: number, to: number, at: (x: number) => number, steps = 60): PlotPoint[] {
  return Array.from({ length: steps + 1 }, (_, i) => {
    const x = from + ((to - from) * i) / steps;
    return { x, y: at(x) };
  });
}

/** Standards, the calibration line and each unknown projected onto it with guides down to the concentration axis. */
export function runPlotLayers(run: RunDto): PlotLayer[] {
  const { result } = run;
  const calibration = result.calibration!;
  const unknowns = result.unknowns;
  const from = run.model === 'one-point' ? 0 : calibration.xMin;
  const to = Math.max(calibration.xMax, ...unknowns.map((u) => u.x0Undiluted));
  const standards = ((run.data.standards as { x: number; y: number; excluded?: unknown }[]) ?? []).filter((s) => !s.excluded);
  const layers: PlotLayer[] = [];
  const reference = result.onePointBias?.referenceLine;
  if (reference) {
    layers.push({
      type: 'line',
      label: 'Validation line through today’s standard',
      points: curve(0, to, (x) => reference.intercept + reference.slope * x, 2),
      color: colors.warning,
      dashed: true,
    });
  }
  layers.push({ type: 'line', label: 'Calibration', points: curve(from, to, (x) => responseAt(result, x)), color: colors.spruce });
  const yFloor = Math.min(0, ...standards.map((s) => s.y), ...unknowns.map((u) => u.yMean));
  for (const u of unknowns) {
    layers.push({
      type: 'line',
      points: [
        { x: from, y: u.yMean },
        { x: u.x0Undiluted, y: u.yMean },
        { x: u.x0Undiluted, y: yFloor },
      ],
      color: colors.faint,
      width: 0.6,
      dashed: true,
    });
  }
  layers.push({ type: 'points', label: 'Standards', points: standards.map((s) => ({ x: s.x, y: s.y })), color: colors.spruce });
  layers.push({
    type: 'points',
    label: 'Samples (read off the line)',
    points: unknowns.map((u) => ({ x: u.x0Undiluted, y: u.yMean })),
    color: colors.spruceMid,
    hollow: true,
    radius: 3,
  });
  return layers;
}

/** The run sheet: the batch's calibration, check standards and reported results on A4, unsigned. */
export async function runSheet(run: RunDto, laboratoryName: string): Promise<Buffer> {
  const { result, method } = run;
  const { xUnit, yUnit } = method;
  const validation = result.validation;
  const calibration = result.calibration!;
  const rejected = run.status === 'rejected';
  const pdf = createPdfComposer({
    title: `Run sheet: ${run.title}`,
    author: run.author.name,
    subject: `${method.name}, version ${run.versionNumber}`,
    // pdfkit reads every information entry when it builds the file ID: none may be left undefined.
    keywords: `routine run, ${run.model} calibration, ${method.analyte}`,
    header: { left: `${laboratoryName} · Run sheet`, right: `Created ${formatDate(run.createdAt)}` },
    footer: `Run ${run.id} · data SHA-256 ${run.dataHash.slice(0, 16)}… · engine ${run.engineVersion} · not signed`,
    watermark: rejected ? 'REJECTED: NOT REPORTABLE' : null,
  });

  pdf.label('Routine run');
  pdf.heading(run.title);
  pdf.keyValues([
    ['Method', `${method.name}, version ${run.versionNumber}`],
    ['Calibration', `${MODEL_NAMES[run.model] ?? run.model}${result.weighting !== 'none' ? `, weighting ${result.weighting}` : ''}`],
    ['Analyst', run.author.name],
    ['Created', formatDateTime(run.createdAt)],
    ['Validation study', validation.studyTitle],
    ['LOD / LOQ', limitsText(validation, xUnit)],
    [
      'Validated range',
      validation.validatedRange
        ? `${formatNumber(validation.validatedRange.low, 3)} to ${withUnit(formatNumber(validation.validatedRange.high, 3), xUnit)}`
        : 'not stated',
    ],
  ]);
  if (rejected) {
    pdf.callout('Run rejected: its results are not reportable', run.rejectionReasons, 'fail');
  } else {
    pdf.callout(
      'Run accepted',
      [
        `Every check standard recovered within ${result.acceptance.low} to ${result.acceptance.high} % of its nominal value${result.blanks?.length || result.qcSamples?.length ? '; every method blank and QC sample met its limit' : ''}.`,
      ],
      'pass',
    );
  }

  pdf.heading('Results', 2);
  pdf.table({
    columns: [
      { header: 'Sample', width: 1.1 },
      { header: 'Dilution', width: 0.7, align: 'right' },
      { header: `Mean response (${yUnit})`, width: 1, align: 'right' },
      { header: 'Reported', width: 1.6, align: 'right' },
      { header: 'Remarks', width: 2.8 },
    ],
    rows: result.unknowns.map((u) => ({
      cells: [
        u.id,
        String(u.dilution),
        formatNumber(u.yMean, 4),
        rejected ? `${u.reported} (not reportable)` : u.reported,
        u.remarks.join(' '),
      ],
    })),
    note: result.unknowns.some((u) => u.uncertainty?.value)
      ? '± is the expanded uncertainty U of the result, from the validation (basis below).'
      : calibration.sYX === null
        ? 'No interval: a one- or two-point calibration has no residual spread to estimate it from.'
        : `± is the ${Math.round(result.confidence * 100)} % confidence interval of the reading (from its standard deviation about the calibration line, Miller & Miller), times the dilution factor.`,
  });
  for (const basis of new Set(result.unknowns.flatMap((u) => (u.uncertainty ? [u.uncertainty.basis] : []))))
    pdf.paragraph(`Uncertainty: ${basis}`, { size: 8.5, color: colors.muted });

  const bias = result.onePointBias;
  if (bias) {
    pdf.heading('What the one-point line costs', 2);
    pdf.paragraph(
      `The validation's straight line has an intercept worth ${withUnit(formatNumber(bias.interceptAsConcentration, 3), xUnit)}. Rescaled through today's standard, it reads each sample as below; the difference is the bias of forcing the line through the origin.`,
      { color: colors.muted },
    );
    pdf.table({
      columns: [
        { header: 'Sample' },
        { header: `One-point (${xUnit})`, align: 'right' },
        { header: `Validation line (${xUnit})`, align: 'right' },
        { header: `Bias (${xUnit})`, align: 'right' },
        { header: 'Bias (%)', align: 'right' },
      ],
      rows: bias.items.map((b) => [
        b.id,
        formatNumber(b.onePoint, 4),
        formatNumber(b.regression, 4),
        formatNumber(b.bias, 3),
        formatPercentValue(b.biasPct),
      ]),
    });
  }

  pdf.heading('Check standards', 2);
  pdf.table({
    columns: [
      { header: 'Check' },
      { header: `Nominal (${xUnit})`, align: 'right' },
      { header: `Found (${xUnit})`, align: 'right' },
      { header: 'Recovery (%)', align: 'right' },
      { header: 'Outcome' },
    ],
    rows: result.checks.map((c) => ({
      cells: [c.id, formatNumber(c.nominal, 4), formatNumber(c.found, 4), formatPercentValue(c.recoveryPct), c.pass ? 'pass' : 'FAIL'],
      bold: !c.pass,
    })),
    note: `Acceptance window: ${result.acceptance.low} to ${result.acceptance.high} % recovery.`,
  });

  const blanks = result.blanks ?? [];
  const qcSamples = result.qcSamples ?? [];
  if (blanks.length || qcSamples.length) {
    pdf.heading('Method blanks and QC samples', 2);
    if (blanks.length)
      pdf.table({
        columns: [
          { header: 'Method blank' },
          { header: `Found (${xUnit})`, align: 'right' },
          { header: `Must stay below (${xUnit})`, align: 'right' },
          { header: 'Outcome' },
        ],
        rows: blanks.map((b) => ({
          cells: [
            b.id,
            formatNumber(b.found, 3),
            `${formatNumber(b.limit, 3)} (${b.limitBasis === 'lod' ? 'LOD' : 'set limit'})`,
            b.pass ? 'below the limit' : 'NOT BELOW THE LIMIT',
          ],
          bold: !b.pass,
        })),
      });
    if (qcSamples.length)
      pdf.table({
        columns: [
          { header: 'QC sample' },
          { header: `Known (${xUnit})`, align: 'right' },
          { header: `Found (${xUnit})`, align: 'right' },
          { header: 'Recovery (%)', align: 'right' },
          { header: 'Outcome' },
        ],
        rows: qcSamples.map((q) => ({
          cells: [q.id, formatNumber(q.known, 4), formatNumber(q.found, 4), formatPercentValue(q.recoveryPct), q.pass ? 'pass' : 'FAIL'],
          bold: !q.pass,
        })),
        note: result.qcWindow
          ? `QC window: ${result.qcWindow.low} to ${result.qcWindow.high} % recovery (${result.qcWindow.basis}).`
          : undefined,
      });
  }

  pdf.heading('Calibration', 2);
  pdf.keyValues([
    [`Slope (${yUnit} per ${xUnit})`, formatNumber(calibration.slope, 5)],
    [`Intercept (${yUnit})`, formatNumber(calibration.intercept, 4)],
    ...(calibration.curvature !== null ? [['Curvature', formatNumber(calibration.curvature, 4)] as [string, string]] : []),
    ...(calibration.sYX !== null
      ? ([
          ['R²', formatNumber(calibration.r2, 5)],
          [`Residual SD (${yUnit})`, formatNumber(calibration.sYX, 3)],
        ] as [string, string][])
      : []),
  ]);
  const layers = runPlotLayers(run);
  const highest = Math.max(...layers.flatMap((l) => (l.type === 'line' || l.type === 'points' ? l.points.map((p) => p.y) : [])));
  pdf.plot({
    x: { label: `Concentration in the measured solution (${xUnit})`, includeZero: true },
    // Headroom keeps the markers at the top of the range whole.
    y: { label: `Response (${yUnit})`, includeZero: true, max: highest * 1.06 },
    layers,
    height: 250,
    caption: 'Calibration with each sample read off the line',
  });

  pdf.callout('Caution', [RUN_CAUTION], 'warning');
  return pdf.finish();
}
