import type { UserDto } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const usersQueries = {
  all: ['users'] as const,
  list: () =>
    queryOptions({
      queryKey: [...usersQueries.all, 'list'],
      queryFn: ({ signal }) => api.get<UserDto[]>('/users', { signal }),
    }),
};
