import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { saveFile } from '@/lib/save-file';
import { methodsQueries } from './methods-queries';

export interface AssessmentInput {
  versionId: string;
  compareWith: string;
  lockVersion: number;
  statement: string;
  password: string;
  fileName: string;
}

/** Signs the change assessment and hands the signed PDF to the browser. */
export function useAssessVersion() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ versionId, fileName, ...body }: AssessmentInput) => {
      const pdf = await apiRequest<Blob>(`/method-versions/${encodeURIComponent(versionId)}/assessment`, {
        method: 'POST',
        body,
        responseType: 'blob',
        passwordCheck: true,
      });
      saveFile(pdf, fileName);
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: methodsQueries.all }),
    meta: { inlineErrors: true },
  });
}
