import type { CurrentUser, LoginResponse } from '@meritline/shared';
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { markSignedIn, markSignedOut, useSignedIn } from '@/lib/signed-in';
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
  signedIn: boolean;
  /** The signed-in user; undefined while it loads or when signed out. */
  user: CurrentUser | undefined;
  isLoading: boolean;
  /** Loading the user failed for a reason other than an expired session (that one signs out). */
  error: Error | null;
  signOut: () => void;
}

export function useSession(): Session {
  const signedIn = useSignedIn();
  const currentUser = useQuery({ ...authQueries.currentUser(), enabled: signedIn });
  const signOut = useCallback(() => {
    // The server ends the session and clears its cookie; this browser forgets it even if the server cannot be reached.
    void api.post('/auth/logout').catch(() => undefined);
    markSignedOut({ byUser: true });
  }, []);
  return {
    signedIn,
    user: signedIn ? currentUser.data : undefined,
    isLoading: signedIn && currentUser.isPending,
    error: signedIn ? currentUser.error : null,
    signOut,
  };
}

/** Marks a fresh sign-in (the server has set its cookie) and primes the current user, so the shell renders without a second round trip. */
export function useStartSession() {
  const queryClient = useQueryClient();
  return useCallback(
    (response: LoginResponse) => {
      queryClient.clear();
      queryClient.setQueryData(authQueries.currentUser().queryKey, response.user);
      markSignedIn();
    },
    [queryClient],
  );
}
