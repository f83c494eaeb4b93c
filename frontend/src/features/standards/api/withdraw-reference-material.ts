import type { ReferenceMaterialDto, WithdrawReferenceMaterialRequest } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { referenceMaterialsQueries } from './reference-materials-queries';

export const withdrawSchema = yup.object({
  reason: yup.string().trim().required('Say why the material is withdrawn.').max(1000, 'Use at most 1000 characters.'),
});

export function useWithdrawReferenceMaterial() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: WithdrawReferenceMaterialRequest }) =>
      api.post<ReferenceMaterialDto>(`/reference-materials/${encodeURIComponent(id)}/withdraw`, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: referenceMaterialsQueries.all }),
    meta: { inlineErrors: true },
  });
}
