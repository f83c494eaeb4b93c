import {
  COMPARISON_TEST_LABELS,
  comparisonVerdictLabel,
  DETECTION_APPROACH_LABELS,
  type VersionComparisonResponse,
  type VersionComparisonTests,
} from '@meritline/shared';
import { colors, createPdfComposer, formatDateTime, formatInterval, formatNumber, pText } from '../reports/pdf/index.js';
import { REPORT_ID_INFO_KEY } from '../reports/validation-report.document.js';

export interface AssessmentContent {
  laboratoryName: string;
  verifyUrl: string;
  assessmentId: string;
  signedAt: Date;
  signerName: string;
  statement: string;
  comparison: VersionComparisonResponse;
}

type Test = VersionComparisonTests['slope'] | VersionComparisonTests['residualSd'] | VersionComparisonTests['recovery']['welch'];

const dfText = (df: number) => (Number.isInteger(df) ? String(df) : df.toFixed(1));

function testRow(label: string, test: Test | VersionComparisonTests['recovery']['tost']): string[] {
  if (!test.available) return [label, '—', '—', `Not tested: ${test.reason}`];
  if ('F' in test) {
    return [
      label,
      `${formatNumber(test.from)} → ${formatNumber(test.to)}`,
      `F = ${formatNumber(test.F, 3)} (${dfText(test.df[0])}, ${dfText(test.df[1])} df), ${pText(test.p)}`,
      comparisonVerdictLabel(test.verdict),
    ];
  }
  if ('margin' in test) {
    return [
      label,
      `difference ${formatNumber(test.difference, 3)}, ${Math.round(100 * (1 - 2 * test.alpha))} % interval ${formatInterval(test.ci, (v) => formatNumber(v, 3))}`,
      `margin ±${formatNumber(test.margin, 3)} points, larger one-sided ${pText(test.p)}`,
      comparisonVerdictLabel(test.verdict),
    ];
  }
  const change = 'changePct' in test && test.changePct !== null ? ` (${formatNumber(test.changePct, 3)} %)` : '';
  return [
    label,
    `${formatNumber(test.from)} → ${formatNumber(test.to)}${change}`,
    `t = ${formatNumber(test.t, 3)}, ${dfText(test.df)} df, ${pText(test.p)}`,
    comparisonVerdictLabel(test.verdict),
  ];
}

/** The change assessment as PDF bytes, ready to be signed. */
export async function renderChangeAssessment(content: AssessmentContent): Promise<Buffer> {
  const { comparison: c } = content;
  const pdf = createPdfComposer({
    title: `Change assessment: ${c.method.name}, version ${c.to.number} against version ${c.from.number}`,
    author: content.laboratoryName,
    subject: `Change assessment ${content.assessmentId}`,
    keywords: 'method change, change assessment, method validation',
    header: { left: `${c.method.name} · version ${c.to.number}`, right: `Assessment ${content.assessmentId.slice(0, 8)}` },
    footer: `Verify a copy at ${content.verifyUrl}`,
    info: { [REPORT_ID_INFO_KEY]: content.assessmentId },
  });
  pdf.y = 96;
  pdf.label(content.laboratoryName, colors.spruce);
  pdf.space(6);
  pdf.paragraph('Change assessment', { size: 24, weight: 'semibold', color: colors.spruce, gap: 6 });
  pdf.paragraph(c.method.name, { size: 15, weight: 'semibold', gap: 14 });
  pdf.keyValues(
    [
      ['Assessed version', `Version ${c.to.number}`],
      ['Compared with', `Version ${c.from.number}`],
      ['Study of the assessed version', c.to.studyTitle ?? 'None approved'],
      ['Study of the earlier version', c.from.studyTitle ?? 'None approved'],
      ['Significance level', `α = ${formatNumber(c.alpha, 3)} (the later study's)`],
      ['Recovery equivalence margin', `±${formatNumber(c.recoveryMarginPct, 3)} percentage points`],
      ['Assessment id', content.assessmentId],
      ['Signed', formatDateTime(content.signedAt)],
    ],
    { labelWidth: 150 },
  );
  if (c.missing.length) pdf.callout('Part of the comparison is missing', c.missing, 'warning');

  pdf.heading('1  What changed');
  pdf.table({
    columns: [
      { header: 'Aspect', width: 1.3 },
      { header: `Version ${c.from.number}`, width: 1.6 },
      { header: `Version ${c.to.number}`, width: 1.6 },
    ],
    rows: c.changes.map((row) => ({ cells: [row.aspect, row.from ?? '—', row.to ?? '—'], bold: row.changed })),
    note: 'Changed aspects in bold.',
  });

  pdf.heading('2  Statistical tests');
  const t = c.tests;
  pdf.table({
    columns: [
      { header: 'Test', width: 1.5 },
      { header: 'Earlier → later', width: 1.5 },
      { header: 'Statistic', width: 1.9 },
      { header: 'Verdict', width: 1.2 },
    ],
    rows: [
      testRow(COMPARISON_TEST_LABELS.slope, t.slope),
      testRow(COMPARISON_TEST_LABELS.intercept, t.intercept),
      testRow(COMPARISON_TEST_LABELS.residualSd, t.residualSd),
      testRow(COMPARISON_TEST_LABELS.repeatability, t.repeatability),
      testRow(COMPARISON_TEST_LABELS.intermediatePrecision, t.intermediatePrecision),
      testRow(COMPARISON_TEST_LABELS.recoveryWelch, t.recovery.welch),
      testRow(COMPARISON_TEST_LABELS.recoveryTost, t.recovery.tost),
      { cells: [COMPARISON_TEST_LABELS.recovery, '', '', comparisonVerdictLabel(t.recovery.verdict)], bold: true },
    ],
    note: 'Slopes and intercepts: t test with the pooled residual variance; standard deviations: two-sided F test; mean recovery: Welch t test and two one-sided tests.',
  });

  if (c.detection.length) {
    pdf.heading('3  Detection and quantitation limits');
    pdf.table({
      columns: [
        { header: 'Approach', width: 1.6 },
        { header: 'LOD earlier → later', width: 1.5 },
        { header: 'LOQ earlier → later', width: 1.5 },
        { header: 'LOQ ratio', width: 0.8, align: 'right' },
      ],
      rows: c.detection.map((d) => [
        DETECTION_APPROACH_LABELS[d.approach],
        `${formatNumber(d.lodFrom)} → ${formatNumber(d.lodTo)} ${c.method.xUnit}`,
        d.loqFrom === null && d.loqTo === null ? '—' : `${formatNumber(d.loqFrom)} → ${formatNumber(d.loqTo)} ${c.method.xUnit}`,
        formatNumber(d.loqRatio, 3),
      ]),
    });
  }

  pdf.heading(`${c.detection.length ? 4 : 3}  Assessment and signature`);
  pdf.paragraph(content.statement);
  pdf.keyValues(
    [
      ['Signed by', `${content.signerName}, quality manager`],
      ['Meaning', 'Change assessed'],
      ['Signed', formatDateTime(content.signedAt)],
    ],
    { labelWidth: 150 },
  );
  pdf.callout(
    'Caution',
    [
      'A statistical difference is a reason to look, not a decision; an equivalence shown here holds only within the stated margin.',
      'Whether the changed method may be used is decided under the laboratory’s change-control procedure, by qualified review and the regulations that apply.',
    ],
    'neutral',
  );
  return pdf.finish();
}
