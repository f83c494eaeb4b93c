import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { Role, type UserDto } from '@meritline/shared';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { studyKeys } from '@/lib/query-keys';
import { studyReviewQueries } from './review-queries';

export const reassignSchema = yup.object({
  authorId: yup.string().required('Choose the analyst who takes the study over.'),
  reason: yup.string().trim().required('Say why the study changes hands.').max(500, 'Keep the reason under 500 characters.'),
});

export type ReassignValues = yup.InferType<typeof reassignSchema>;

/** Active analysts an administrator may hand a draft to. */
export const analystChoicesQuery = () =>
  queryOptions({
    queryKey: ['users', 'analyst-choices'],
    queryFn: async ({ signal }) =>
      (await api.get<UserDto[]>('/users', { signal })).filter((u) => u.active && !u.invitationPending && u.roles.includes(Role.Analyst)),
  });

export function useReassignStudy(studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ values, lockVersion }: { values: ReassignValues; lockVersion: number }) =>
      api.post(`/studies/${encodeURIComponent(studyId)}/reassign`, { ...values, lockVersion }),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: studyReviewQueries.study(studyId) }),
        queryClient.invalidateQueries({ queryKey: studyKeys.all }),
      ]),
    meta: { inlineErrors: true },
  });
}
