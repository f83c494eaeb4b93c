import type { MethodDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const methodsQueries = {
  all: ['methods'] as const,
  list: () =>
    queryOptions({
      queryKey: [...methodsQueries.all, 'list'],
      queryFn: ({ signal }) => api.get<MethodDto[]>('/methods', { signal }),
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: [...methodsQueries.all, 'detail', id],
      queryFn: ({ signal }) => api.get<MethodDto>(`/methods/${encodeURIComponent(id)}`, { signal }),
    }),
};
