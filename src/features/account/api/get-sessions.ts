import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AccountSessionDto } from '#shared/schemas/account';
import { api } from '@/lib/api-client';
import { accountKeys } from '@/features/account/api/account-keys';

export async function getSessions(signal?: AbortSignal): Promise<AccountSessionDto[]> {
  const { items } = await api.get<{ items: AccountSessionDto[] }>('/api/me/sessions', signal);
  return items;
}

export const sessionsQueryOptions = () => queryOptions({ queryKey: accountKeys.sessions(), queryFn: ({ signal }) => getSessions(signal) });

export function useSessions() {
  return useQuery(sessionsQueryOptions());
}
