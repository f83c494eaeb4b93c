import { createHash } from 'node:crypto';
import { canonicalJson } from '@meritline/shared';
import { createPdfComposer } from './pdf/index.js';
import type { ReportContent } from './report-content.js';
import { accuracyUncertaintySection } from './sections/accuracy-uncertainty.js';
import { calibrationSection } from './sections/calibration.js';
import { coverPage } from './sections/cover.js';
import { detectionSection } from './sections/detection.js';
import { methodsSection, STUDY_DATA_ATTACHMENT } from './sections/methods.js';
import { outliersSection } from './sections/outliers.js';
import { recoveryPrecisionSection } from './sections/recovery-precision.js';
import { cautionSection, signaturesSection } from './sections/signatures.js';
import { studyDataAppendix } from './sections/study-data.js';
import { summarySection } from './sections/summary.js';

export const DRAFT_WATERMARK = 'DRAFT — not approved';

/** Key of the PDF information entry that names the report, so a changed copy can still be recognised. */
export const REPORT_ID_INFO_KEY = 'MeritlineReportId';

/** meritline-<method>-v<version>-<first 8 characters of the report id, or of the study id for a draft>.pdf */
export function reportFileName(methodName: string, versionNumber: number, reportId: string | null, studyId: string): string {
  const slug =
    methodName
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .replace(/ß/g, 'ss')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .slice(0, 60)
      .replace(/^-+|-+$/g, '') || 'method';
  return `meritline-${slug}-v${versionNumber}-${(reportId ?? studyId).slice(0, 8)}${reportId ? '' : '-draft'}.pdf`;
}

/** The validation report as PDF bytes (unsigned). Without a report id it is a watermarked draft preview. */
export async function renderValidationReport(content: ReportContent): Promise<Buffer> {
  const { method, version, study, reportId } = content;
  const studyData = Buffer.from(canonicalJson(study.data), 'utf8');
  const pdf = createPdfComposer({
    title: `Method validation report: ${method.name}, version ${version.number}`,
    author: content.laboratoryName,
    subject: `Validation study "${study.title}" (${study.id})`,
    keywords: `method validation, ${method.analyte}, ${method.matrix}, ${method.technique}`,
    header: {
      left: `${method.name} · version ${version.number}`,
      right: reportId ? `Report ${reportId}` : `${DRAFT_WATERMARK} · no report id`,
    },
    footer: `Data SHA-256 ${study.dataHash}`,
    watermark: reportId ? null : DRAFT_WATERMARK,
    info: reportId ? { [REPORT_ID_INFO_KEY]: reportId } : {},
  });
  coverPage(pdf, content);
  pdf.newPage();
  summarySection(pdf, content);
  calibrationSection(pdf, content);
  detectionSection(pdf, content);
  recoveryPrecisionSection(pdf, content);
  accuracyUncertaintySection(pdf, content);
  outliersSection(pdf, content);
  methodsSection(pdf, content, createHash('sha256').update(studyData).digest('hex'));
  signaturesSection(pdf, content);
  cautionSection(pdf, content);
  studyDataAppendix(pdf, content);
  pdf.attach(STUDY_DATA_ATTACHMENT, studyData, 'The study data these figures were computed from (canonical JSON).', 'application/json');
  return pdf.finish();
}
