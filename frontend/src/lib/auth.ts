import type { CurrentUser, LoginResponse } from '@meritline/shared';
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { clearSessionToken, setSessionToken, useSessionToken } from '@/lib/session-token';
import { api } from '@/lib/api-client';

export const authQueries = {
  all: ['auth'] as const,
  currentUser: () =>
    queryOptions({
      queryKey: [...authQueries.all, 'current-user'],
      queryFn: ({ signal }) => api.get<CurrentUser>('/auth/me', { signal }),
      staleTime: 5 * 60_000,
    }),
};

export interface Session {
  /** The bearer token; null when signed out. */
  token: string | null;
  /** The signed-in user; undefined while it loads or when signed out. */
  user: CurrentUser | undefined;
  isLoading: boolean;
  /** Loading the user failed for a reason other than an expired session (that one signs out). */
  error: Error | null;
  signOut: () => void;
}

export function useSession(): Session {
  const token = useSessionToken();
  const currentUser = useQuery({ ...authQueries.currentUser(), enabled: token !== null });
  const signOut = useCallback(() => clearSessionToken({ byUser: true }), []);
  return {
    token,
    user: token ? currentUser.data : undefined,
    isLoading: token !== null && currentUser.isPending,
    error: token ? currentUser.error : null,
    signOut,
  };
}

/** Stores the token of a fresh sign-in and primes the current user, so the shell renders without a second round trip. */
export function useStartSession() {
  const queryClient = useQueryClient();
  return useCallback(
    (response: LoginResponse) => {
      queryClient.clear();
      queryClient.setQueryData(authQueries.currentUser().queryKey, response.user);
      setSessionToken(response.accessToken);
    },
    [queryClient],
  );
}
