import { queryOptions } from '@tanstack/react-query';
import type { MethodTrendResponse, VersionComparisonResponse } from '@meritline/shared';
import { api } from '@/lib/api-client';

export const comparisonsQueries = {
  all: ['comparisons'] as const,
  compare: (from: string, to: string) =>
    queryOptions({
      queryKey: [...comparisonsQueries.all, 'compare', from, to],
      queryFn: ({ signal }) =>
        api.get<VersionComparisonResponse>(`/method-versions/compare?${new URLSearchParams({ from, to }).toString()}`, { signal }),
    }),
  trend: (methodId: string) =>
    queryOptions({
      queryKey: [...comparisonsQueries.all, 'trend', methodId],
      queryFn: ({ signal }) => api.get<MethodTrendResponse>(`/methods/${encodeURIComponent(methodId)}/trend`, { signal }),
    }),
};
