import type { MethodDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** Methods with their versions, to choose from when a study is set up or the list is filtered. */
export const methodChoicesQueries = {
  // Under the methods key, so that a change to a method refreshes the choices too.
  all: ['methods', 'choices'] as const,
  list: () =>
    queryOptions({
      queryKey: [...methodChoicesQueries.all],
      queryFn: ({ signal }) => api.get<MethodDto[]>('/methods', { signal }),
    }),
};
