import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { invalidateAfterTransition } from './review-queries';
import type { TransitionResult } from './review-types';

export const returnSchema = yup.object({
  comment: yup
    .string()
    .trim()
    .required('Say what the author should change before resubmitting.')
    .max(2000, 'Keep the comment under 2000 characters.'),
});

export type ReturnValues = yup.InferType<typeof returnSchema>;

export function useReturnStudy(studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ values, lockVersion }: { values: ReturnValues; lockVersion: number }) =>
      api.post<TransitionResult>(`/studies/${encodeURIComponent(studyId)}/return`, { comment: values.comment, lockVersion }),
    onSuccess: () => invalidateAfterTransition(queryClient, studyId),
    meta: { inlineErrors: true },
  });
}
