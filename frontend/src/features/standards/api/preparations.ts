import type { CreatePreparationRequest, PreparationDto } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { preparationsQueries } from './preparations-queries';

export function useCreatePreparation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreatePreparationRequest) => api.post<PreparationDto>('/preparations', body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: preparationsQueries.all }),
    meta: { inlineErrors: true },
  });
}
