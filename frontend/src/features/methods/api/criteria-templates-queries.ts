import type { CriteriaTemplateDto } from '@meritline/shared';
import { wholeListQuery } from '@/lib/list-query';

export const criteriaTemplatesQueries = {
  all: ['criteria-templates'] as const,
  list: () => wholeListQuery<CriteriaTemplateDto>(criteriaTemplatesQueries.all, { staleTime: 60 * 60_000 }),
};
