import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** The server's answer: only a byte-identical copy of an issued report is valid. */
export type ReportVerification =
  | {
      valid: true;
      studyId: string;
      studyTitle: string;
      reportId: string;
      methodName: string;
      methodVersion: number;
      signedAt: string;
      sha256: string;
    }
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

export const MAX_REPORT_BYTES = 20 * 1024 * 1024;

export function verifyReport(file: File): Promise<ReportVerification> {
  const form = new FormData();
  form.append('file', file);
  return api.post<ReportVerification>('/reports/verify', form, { public: true });
}

export function useVerifyReport() {
  return useMutation({ mutationFn: verifyReport });
}
