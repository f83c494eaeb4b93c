import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from './api-client';
import { isSignedIn, subscribeToSignedIn } from './signed-in';

declare module '@tanstack/react-query' {
  interface Register {
    defaultError: Error;
    mutationMeta: {
      /** The caller shows the error itself (a form beside its fields); no toast. */
      inlineErrors?: boolean;
    };
  }
}

function describe(error: Error) {
  return isApiError(error) ? error.body.message : 'Something went wrong in the browser. Reload the page and try again.';
}

function isExpiredSession(error: Error) {
  return isApiError(error) && error.status === 401;
}

export function createQueryClient() {
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      // A first load shows its error in the page; only a failed refresh of data on screen needs a toast.
      onError: (error, query) => {
        if (query.state.data === undefined || isExpiredSession(error)) return;
        toaster.create({ type: 'error', title: 'Could not refresh the data on this page', description: describe(error) });
      },
    }),
    mutationCache: new MutationCache({
      onError: (error, _variables, _context, mutation) => {
        if (mutation.meta?.inlineErrors || isExpiredSession(error)) return;
        toaster.create({ type: 'error', title: 'The change was not saved', description: describe(error) });
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: (failureCount, error) => {
          if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
          return failureCount < 2;
        },
      },
    },
  });

  // After sign-out (or an expired session) nothing of the previous user may stay in the cache.
  subscribeToSignedIn(() => {
    if (!isSignedIn()) queryClient.clear();
  });

  return queryClient;
}

export const queryClient = createQueryClient();
