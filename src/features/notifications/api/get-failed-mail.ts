import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FailedMailDto } from '#shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from '@/features/notifications/api/notification-keys';

/** Owner only: messages of this garden that could not be delivered after every retry. */
export async function getFailedMail(gardenId: number, signal?: AbortSignal): Promise<FailedMailDto[]> {
  return (await api.get<{ items: FailedMailDto[] }>(`/api/gardens/${gardenId}/mail/failed`, signal)).items;
}

export const failedMailQueryOptions = (gardenId: number) =>
  queryOptions({ queryKey: notificationKeys.failed(gardenId), queryFn: ({ signal }) => getFailedMail(gardenId, signal) });

export function useFailedMail(gardenId: number) {
  return useQuery(failedMailQueryOptions(gardenId));
}
