import type { MethodDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { wholeListQuery } from '@/lib/list-query';

export const methodsQueries = {
  all: ['methods'] as const,
  list: () => wholeListQuery<MethodDto>(methodsQueries.all),
  detail: (id: string) =>
    queryOptions({
      queryKey: [...methodsQueries.all, 'detail', id],
      queryFn: ({ signal }) => api.get<MethodDto>(`/methods/${encodeURIComponent(id)}`, { signal }),
    }),
};
