import type { ReviewQueuePageDto } from '@meritline/shared';
import { keepPreviousData, queryOptions, type QueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { notificationKeys, reviewQueueKeys, studyKeys } from '@/lib/query-keys';
import type { HistoryItem, ReviewQueueParams, Signature, StudyComment, StudyDiff, StudyView } from './review-types';

export const studyReviewQueries = {
  ...studyKeys,
  study: studyKeys.detail,
  detail: (id: string) =>
    queryOptions({
      queryKey: [...studyKeys.detail(id), 'view'],
      queryFn: ({ signal }) => api.get<StudyView>(`/studies/${encodeURIComponent(id)}`, { signal }),
    }),
  signatures: (id: string) =>
    queryOptions({
      queryKey: [...studyReviewQueries.study(id), 'signatures'],
      queryFn: ({ signal }) => api.get<Signature[]>(`/studies/${encodeURIComponent(id)}/signatures`, { signal }),
    }),
  history: (id: string) =>
    queryOptions({
      queryKey: [...studyReviewQueries.study(id), 'history'],
      queryFn: ({ signal }) => api.get<HistoryItem[]>(`/studies/${encodeURIComponent(id)}/history`, { signal }),
    }),
  diff: (id: string) =>
    queryOptions({
      queryKey: [...studyReviewQueries.study(id), 'diff'],
      // The server answers an empty body while the study has been submitted only once.
      queryFn: async ({ signal }) => (await api.get<StudyDiff | undefined>(`/studies/${encodeURIComponent(id)}/diff`, { signal })) ?? null,
    }),
  comments: (id: string) =>
    queryOptions({
      queryKey: [...studyReviewQueries.study(id), 'comments'],
      queryFn: ({ signal }) => api.get<StudyComment[]>(`/studies/${encodeURIComponent(id)}/comments`, { signal }),
    }),
};

export const reviewQueueQueries = {
  ...reviewQueueKeys,
  list: (params: ReviewQueueParams) =>
    queryOptions({
      queryKey: [...reviewQueueKeys.lists(), params],
      queryFn: ({ signal }) => {
        const search = new URLSearchParams({ pageSize: String(params.pageSize) });
        if (params.kind) search.set('kind', params.kind);
        if (params.cursor) search.set('cursor', params.cursor);
        return api.get<ReviewQueuePageDto>(`/reviews/queue?${search.toString()}`, { signal });
      },
      placeholderData: keepPreviousData,
    }),
};

/** A study moved on its way to approval: its page, the review queue and the notifications all show it. */
export const invalidateAfterTransition = (queryClient: QueryClient, studyId: string) =>
  Promise.all([
    queryClient.invalidateQueries({ queryKey: studyReviewQueries.study(studyId) }),
    queryClient.invalidateQueries({ queryKey: reviewQueueQueries.all }),
    queryClient.invalidateQueries({ queryKey: notificationKeys.all }),
  ]);
