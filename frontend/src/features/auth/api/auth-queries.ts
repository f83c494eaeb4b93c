import type { LoginResponse } from '@meritline/shared';
import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type SessionUser = LoginResponse['user'];

export const authQueries = {
  all: ['auth'] as const,
  currentUser: () =>
    queryOptions({
      queryKey: [...authQueries.all, 'current-user'],
      queryFn: ({ signal }) => api.get<SessionUser>('/auth/me', { signal }),
      staleTime: 5 * 60_000,
    }),
};
