import { STUDY_STATUS_LABELS } from '@meritline/shared';
import { colors, formatDate, formatDateTime, NOT_AVAILABLE, type PdfComposer } from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';

const STATUS_WORDS: Record<ReportContent['study']['status'], string> = {
  draft: 'Draft (being prepared)',
  submitted: STUDY_STATUS_LABELS.submitted,
  returned: 'Returned to the analyst for changes',
  approved: 'Approved',
};

function performed(meta: ReportContent['study']['meta']): string {
  if (meta.startedOn && meta.finishedOn && meta.startedOn !== meta.finishedOn)
    return `${formatDate(meta.startedOn)} to ${formatDate(meta.finishedOn)}`;
  return formatDate(meta.startedOn ?? meta.finishedOn);
}

export function coverPage(pdf: PdfComposer, content: ReportContent): void {
  const { method, version, study } = content;
  pdf.y = 96;
  pdf.label(content.laboratoryName, colors.spruce);
  pdf.space(6);
  pdf.paragraph('Method validation report', { size: 26, weight: 'semibold', color: colors.spruce, gap: 6 });
  pdf.paragraph(method.name, { size: 16, weight: 'semibold', gap: 2 });
  pdf.paragraph(`${method.analyte} in ${method.matrix} · ${method.technique}`, { size: 11, color: colors.muted, gap: 22 });

  pdf.keyValues(
    [
      ['Method version', `Version ${version.number}: ${version.changeSummary}`],
      ['Study', study.title],
      ['Study id', study.id],
      ['Report id', content.reportId ?? 'None: draft preview, not issued'],
      ['Instrument', study.meta.instrument ?? NOT_AVAILABLE],
      ['Study performed', performed(study.meta)],
      ['Submitted for review', formatDateTime(study.submittedAt)],
      ['Approved', formatDateTime(study.approvedAt)],
      [content.reportId ? 'Report issued' : 'Preview printed', formatDateTime(content.issuedAt)],
      ['Study status', STATUS_WORDS[study.status] ?? study.status],
    ],
    { labelWidth: 130 },
  );
  pdf.space(10);

  const verdict = study.result?.verdict;
  if (!study.result) {
    pdf.callout('Not evaluated', ['The study data could not be evaluated yet; see the statistics sections for the reasons.'], 'warning');
  } else if (!verdict || verdict.pass === null) {
    pdf.callout(
      'No acceptance criteria',
      ['The method version names no acceptance criteria: the figures are reported without a pass or fail verdict.'],
      'neutral',
    );
  } else {
    const failed = verdict.criteria.filter((c) => !c.pass).length;
    const total = verdict.criteria.length;
    pdf.callout(
      verdict.pass ? 'Overall: Pass' : 'Overall: Fail',
      [
        verdict.pass
          ? `All ${total} acceptance criteria are met.`
          : `${failed} of ${total} acceptance criteria are not met (see the summary).`,
      ],
      verdict.pass ? 'pass' : 'fail',
    );
  }

  if (!content.reportId) {
    pdf.callout(
      'Draft preview: not approved',
      ['This preview is not signed and is not a validation report. Its numbers can still change until a reviewer approves the study.'],
      'warning',
    );
  } else {
    pdf.paragraph(
      `This report is signed digitally for ${content.laboratoryName}. Any change to the file breaks the signature. ` +
        `Check a copy with a PDF reader that shows signatures, or upload it at ${content.verifyUrl}.`,
      { size: 8.5, color: colors.muted },
    );
  }
  pdf.paragraph(
    'The report supports, and does not replace, the laboratory’s procedures, qualified review and the regulations that apply to it (see the caution at the end).',
    { size: 8.5, color: colors.muted },
  );
}
