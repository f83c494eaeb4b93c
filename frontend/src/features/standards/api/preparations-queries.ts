import type { PreparationDto, PreparationPreviewDto, PreparationPreviewRequest } from '@meritline/shared';
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { wholeListQuery } from '@/lib/list-query';

export const preparationsQueries = {
  all: ['preparations'] as const,
  list: () => wholeListQuery<PreparationDto>(preparationsQueries.all),
  /** The server's dry run: nothing is saved. */
  preview: (body: PreparationPreviewRequest | null) =>
    queryOptions({
      queryKey: [...preparationsQueries.all, 'preview', body],
      queryFn: ({ signal }) => api.post<PreparationPreviewDto>('/preparations/preview', body, { signal }),
      enabled: body !== null,
      placeholderData: keepPreviousData,
      retry: false,
      staleTime: Infinity,
    }),
};
