import type { ReferenceMaterialDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { wholeListQuery } from '@/lib/list-query';

export const referenceMaterialsQueries = {
  all: ['reference-materials'] as const,
  list: () => wholeListQuery<ReferenceMaterialDto>(referenceMaterialsQueries.all),
  expiring: () =>
    queryOptions({
      queryKey: [...referenceMaterialsQueries.all, 'expiring'],
      queryFn: ({ signal }) => api.get<ReferenceMaterialDto[]>('/reference-materials/expiring', { signal }),
    }),
};
