import type { RunReportVerificationDto } from './runs.js';

/** The answer to an uploaded PDF: only a byte-identical copy of an issued report is valid. */
export type ReportVerification =
  | {
      valid: true;
      /** A study's validation report, or a quality manager's signed change assessment. */
      kind: 'validation-report' | 'change-assessment';
      studyId: string;
      studyTitle: string;
      reportId: string;
      methodName: string;
      methodVersion: number;
      signedAt: string;
      sha256: string;
    }
  | RunReportVerificationDto
  | {
      valid: true;
      kind: 'self-qualification';
      qualificationId: string;
      signedAt: string;
      passed: number;
      total: number;
      sha256: string;
    }
  | { valid: false; reason: string };

/** Largest PDF the verify route takes. */
export const MAX_REPORT_BYTES = 20 * 1024 * 1024;
