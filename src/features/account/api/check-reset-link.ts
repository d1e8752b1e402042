import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { accountKeys } from '@/features/account/api/account-keys';

export function checkResetLink(token: string, signal?: AbortSignal): Promise<{ status: 'usable' }> {
  return api.get(`/api/auth/password-reset/${encodeURIComponent(token)}`, signal);
}

export const resetLinkQueryOptions = (token: string) =>
  queryOptions({ queryKey: accountKeys.resetLink(token), queryFn: ({ signal }) => checkResetLink(token, signal), retry: false, staleTime: Infinity });

/**
 * Asked before the form shows, so a used or expired link says so before a new password is typed.
 * `enabled: false` once the password is changed: the page then clears every query, and asking
 * again about the link just used would only fetch a 410.
 */
export function useResetLink(token: string, enabled = true) {
  return useQuery({ ...resetLinkQueryOptions(token), enabled });
}
