import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { RunReviewDto } from '@meritline/shared';
import { api } from '@/lib/api-client';
import { notificationKeys, reviewQueueKeys } from '@/lib/query-keys';
import { runsQueries } from './runs-queries';

export type RunReleaseAction = 'submit' | 'release' | 'return';

export const runReleaseQueries = {
  review: (runId: string) =>
    queryOptions({
      queryKey: [...runsQueries.all, 'review', runId],
      queryFn: ({ signal }) => api.get<RunReviewDto>(`/runs/${encodeURIComponent(runId)}/review`, { signal }),
    }),
};

/** Submitting, releasing and returning a run: the signer re-enters the password. */
export function useRunReleaseAction(runId: string, action: RunReleaseAction) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ password, comment, version }: { password: string; comment?: string; version: number }) =>
      api.post<RunReviewDto>(
        `/runs/${encodeURIComponent(runId)}/${action}`,
        action === 'return' ? { password, comment, version } : { password, version },
        { passwordCheck: true },
      ),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: runsQueries.all }),
        queryClient.invalidateQueries({ queryKey: reviewQueueKeys.all }),
        queryClient.invalidateQueries({ queryKey: notificationKeys.all }),
      ]),
    meta: { inlineErrors: true },
  });
}
