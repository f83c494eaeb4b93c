import type { OutboxMessageDto } from '@meritline/shared';
import { wholeListQuery } from '@/lib/list-query';

export const outboxQueries = {
  all: ['outbox'] as const,
  list: () => wholeListQuery<OutboxMessageDto>(outboxQueries.all, { staleTime: 0 }),
};
