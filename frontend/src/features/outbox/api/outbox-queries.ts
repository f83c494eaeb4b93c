import type { OutboxMessageDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const outboxQueries = {
  all: ['outbox'] as const,
  list: () =>
    queryOptions({
      queryKey: [...outboxQueries.all, 'list'],
      queryFn: ({ signal }) => api.get<OutboxMessageDto[]>('/outbox', { signal }),
      staleTime: 0,
    }),
};
