import type { CriteriaTemplateDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const criteriaTemplatesQueries = {
  all: ['criteria-templates'] as const,
  list: () =>
    queryOptions({
      queryKey: [...criteriaTemplatesQueries.all, 'list'],
      queryFn: ({ signal }) => api.get<CriteriaTemplateDto[]>('/criteria-templates', { signal }),
      staleTime: 60 * 60_000,
    }),
};
