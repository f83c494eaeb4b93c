import type { ReferenceMaterialDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const referenceMaterialsQueries = {
  all: ['reference-materials'] as const,
  list: () =>
    queryOptions({
      queryKey: [...referenceMaterialsQueries.all, 'list'],
      queryFn: ({ signal }) => api.get<ReferenceMaterialDto[]>('/reference-materials', { signal }),
    }),
  expiring: () =>
    queryOptions({
      queryKey: [...referenceMaterialsQueries.all, 'expiring'],
      queryFn: ({ signal }) => api.get<ReferenceMaterialDto[]>('/reference-materials/expiring', { signal }),
    }),
};
