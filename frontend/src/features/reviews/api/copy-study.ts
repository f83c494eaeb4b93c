import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { studyReviewQueries } from './review-queries';

export function useCopyStudy(studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<{ id: string; title: string }>(`/studies/${encodeURIComponent(studyId)}/copy`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studyReviewQueries.all }),
  });
}
