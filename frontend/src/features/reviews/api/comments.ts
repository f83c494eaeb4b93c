import type { StudySection } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { studyReviewQueries } from './review-queries';
import type { StudyComment } from './review-types';

export const commentSchema = yup.object({
  body: yup.string().trim().required('Write the comment before posting it.').max(4000, 'Keep the comment under 4000 characters.'),
});

export type CommentValues = yup.InferType<typeof commentSchema>;

export function usePostComment(studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (comment: { section: StudySection; body: string; threadId?: string }) =>
      api.post<StudyComment>(`/studies/${encodeURIComponent(studyId)}/comments`, comment),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studyReviewQueries.study(studyId) }),
    meta: { inlineErrors: true },
  });
}

export function useResolveComment(studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ commentId, resolved }: { commentId: string; resolved: boolean }) =>
      api.patch<StudyComment>(`/studies/${encodeURIComponent(studyId)}/comments/${encodeURIComponent(commentId)}`, { resolved }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studyReviewQueries.study(studyId) }),
  });
}
