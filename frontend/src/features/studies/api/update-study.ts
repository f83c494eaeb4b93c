import type { StudyDto, StudyMeta } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { studiesQueries } from './studies-queries';

export interface StudyChanges {
  lockVersion: number;
  title?: string;
  data?: Record<string, unknown>;
  meta?: StudyMeta;
  /** Required for data changes once a reviewer has returned the study. */
  reason?: string;
}

/** Saves a draft; the caller handles 409 (someone else saved) and 422 itself. */
export function useUpdateStudy(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changes: StudyChanges) => api.patch<StudyDto>(`/studies/${encodeURIComponent(id)}`, changes),
    onSuccess: (study) => {
      queryClient.setQueryData(studiesQueries.detail(id).queryKey, study);
      return queryClient.invalidateQueries({ queryKey: studiesQueries.lists() });
    },
    meta: { inlineErrors: true },
  });
}
