import type { PreparationDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** Saved standard preparations, to take a study's standards from. */
export const preparationChoicesQueries = {
  // Under the preparations key, so that saving a preparation refreshes the choices too.
  all: ['preparations', 'choices'] as const,
  list: () =>
    queryOptions({
      queryKey: [...preparationChoicesQueries.all],
      queryFn: ({ signal }) => api.get<PreparationDto[]>('/preparations', { signal }),
    }),
};
