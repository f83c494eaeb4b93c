import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { invalidateAfterTransition } from './review-queries';
import type { TransitionResult } from './review-types';

export const signSchema = yup.object({
  password: yup.string().required('Enter your password to sign.').max(200),
  comment: yup.string().trim().max(2000, 'Keep the comment under 2000 characters.').default(''),
  justification: yup.string().trim().max(4000, 'Keep the justification under 4000 characters.').default(''),
});

export type SignValues = yup.InferType<typeof signSchema>;

export type SigningAction = 'submit' | 'approve';

/** Submitting and approving are electronic signatures: the signer re-enters the password. */
export function useSignStudy(studyId: string, action: SigningAction) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ values, lockVersion }: { values: SignValues; lockVersion: number }) =>
      api.post<TransitionResult>(
        `/studies/${encodeURIComponent(studyId)}/${action}`,
        { password: values.password, comment: values.comment || undefined, justification: values.justification || undefined, lockVersion },
        { passwordCheck: true },
      ),
    onSuccess: () => invalidateAfterTransition(queryClient, studyId),
    meta: { inlineErrors: true },
  });
}
