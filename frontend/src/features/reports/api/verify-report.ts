import type { ReportVerification } from '@meritline/shared';
import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export function verifyReport(file: File): Promise<ReportVerification> {
  const form = new FormData();
  form.append('file', file);
  return api.post<ReportVerification>('/reports/verify', form, { public: true });
}

export function useVerifyReport() {
  return useMutation({ mutationFn: verifyReport });
}
