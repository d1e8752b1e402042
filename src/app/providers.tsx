import type { ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import type { QueryClient } from '@tanstack/react-query';
import { createQueryClient } from '@/lib/query-client';

/** The one QueryClient of the app. */
export const appQueryClient = createQueryClient();

/** Tests pass their own fresh client; the app uses the shared one. */
export function AppProviders({
  queryClient = appQueryClient,
  children,
}: {
  queryClient?: QueryClient;
  children: ReactNode;
}) {
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
