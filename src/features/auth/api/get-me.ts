import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UserDto } from '#shared/schemas/auth';
import { api, isApiError } from '@/lib/api-client';
import { authKeys } from '@/features/auth/api/auth-keys';

/** Signed out is an ordinary answer here, not an error: it resolves to null. */
export async function getMe(signal?: AbortSignal): Promise<UserDto | null> {
  try {
    const { user } = await api.get<{ user: UserDto }>('/api/auth/me', signal);
    return user;
  } catch (error) {
    if (isApiError(error, 401)) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
