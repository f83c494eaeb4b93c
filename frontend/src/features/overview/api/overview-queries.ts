import type { AuditReviewDto, OverviewDto, ReviewQueuePageDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { reviewQueueKeys, studyKeys } from '@/lib/query-keys';

export interface ReturnedStudy {
  id: string;
  title: string;
  updatedAt: string;
}

const RETURNED_STUDIES = { status: 'returned', mine: true, pageSize: 10 } as const;

/** What the overview reads; the keys are those of the screens that change the same data, so their changes refresh it. */
export const overviewQueries = {
  work: () =>
    queryOptions({
      queryKey: ['overview'],
      queryFn: ({ signal }) => api.get<OverviewDto>('/overview', { signal }),
    }),
  reviewQueue: () =>
    queryOptions({
      queryKey: [...reviewQueueKeys.lists(), 'overview'],
      queryFn: ({ signal }) => api.get<ReviewQueuePageDto>('/reviews/queue?pageSize=20', { signal }).then((page) => page.items),
    }),
  returnedStudies: () =>
    queryOptions({
      queryKey: studyKeys.list(RETURNED_STUDIES),
      queryFn: ({ signal }) =>
        api.get<{ items: ReturnedStudy[] }>('/studies?status=returned&mine=true&pageSize=10', { signal }).then((page) => page.items),
    }),
  latestAuditReview: () =>
    queryOptions({
      queryKey: ['audit', 'reviews'],
      queryFn: ({ signal }) => api.get<AuditReviewDto[]>('/audit/reviews', { signal }),
      select: (reviews) => reviews[0] ?? null,
    }),
};
