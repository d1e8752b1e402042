import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UnsubscribeInfoDto } from '#shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from '@/features/notifications/api/notification-keys';

export function getUnsubscribe(token: string, signal?: AbortSignal) {
  return api.get<UnsubscribeInfoDto>(`/api/unsubscribe/${encodeURIComponent(token)}`, signal);
}

export const unsubscribeQueryOptions = (token: string) =>
  // A used or forged link stays so; asking again would only repeat the refusal.
  queryOptions({ queryKey: notificationKeys.unsubscribe(token), queryFn: ({ signal }) => getUnsubscribe(token, signal), retry: false });

export function useUnsubscribeInfo(token: string) {
  return useQuery(unsubscribeQueryOptions(token));
}
