import { QueryClient } from '@tanstack/react-query';
import { ApiError } from '@/lib/api-client';

// A 4xx will answer the same way again, so only network faults and 5xx are worth a retry.
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 30_000 },
      mutations: { retry: false },
    },
  });
}
