import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Toaster } from '@/components/ui/toaster';
import { UiProvider } from '@/components/ui/provider';
import { queryClient as appQueryClient } from '@/lib/query-client';

export interface AppProviderProps {
  children: ReactNode;
  /** Tests pass a fresh client so no cache leaks between them. */
  queryClient?: QueryClient;
}

export function AppProvider({ children, queryClient = appQueryClient }: AppProviderProps) {
  return (
    <UiProvider>
      <QueryClientProvider client={queryClient}>
        {children}
        <Toaster />
      </QueryClientProvider>
    </UiProvider>
  );
}
