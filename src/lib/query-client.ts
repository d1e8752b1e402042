import { QueryClient } from '@tanstack/react-query';
import { ApiError } from '@/lib/api-client';

/** Retries happen only after an attempt that failed quickly, so the grower hears within ~30 s. */
export const QUICK_FAILURE_MS = 5_000;
/** A server that asks for a longer pause than this is told to the grower instead of waited out. */
export const LONGEST_RETRY_AFTER_S = 5;

/**
 * Which failed queries are worth asking again by themselves:
 * - a 4xx answers the same way again, and a wait the server asks for beyond a few seconds is
 *   shown to the grower instead (its words say how long);
 * - a timeout has already waited the whole bounded wait, so it is shown at once;
 * - no connection, a 5xx or any other quick failure: twice more, after 1 s and 2 s.
 * So a query without an answer shows its problem within about 30 s: two quick failures
 * (each under 5 s) and the pauses, then at most one full 15 s wait.
 */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (failureCount >= 2) return false;
  if (!(error instanceof ApiError)) return true;
  if (error.status >= 400 && error.status < 500) return false;
  if (error.code === 'timeout') return false;
  if (error.retryAfterSeconds !== undefined && error.retryAfterSeconds > LONGEST_RETRY_AFTER_S) return false;
  return error.elapsedMs < QUICK_FAILURE_MS;
}

/** 1 s, then 2 s; or what the server's Retry-After asked for (at most 5 s, see shouldRetry). */
export function retryDelay(failureCount: number, error: unknown): number {
  if (error instanceof ApiError && error.retryAfterSeconds !== undefined) return Math.min(error.retryAfterSeconds, LONGEST_RETRY_AFTER_S) * 1000;
  return Math.min(1000 * 2 ** failureCount, 4000);
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      // networkMode 'always': without it a query or a save made while the browser reports no
      // connection is paused, not tried, and its spinner turns for as long as the signal is gone.
      // Tried, it fails with the words of src/lib/problems.ts and a Try again.
      queries: { retry: shouldRetry, retryDelay, staleTime: 30_000, networkMode: 'always' },
      // A save is never repeated by itself (no duplicate writes): the grower presses Try again.
      mutations: { retry: false, networkMode: 'always' },
    },
  });
}
