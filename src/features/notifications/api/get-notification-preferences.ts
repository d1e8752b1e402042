import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationPreferencesDto } from '#shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from '@/features/notifications/api/notification-keys';

export const NOTIFICATION_PREFERENCES_PATH = '/api/me/notification-preferences';

export function getNotificationPreferences(signal?: AbortSignal) {
  return api.get<NotificationPreferencesDto>(NOTIFICATION_PREFERENCES_PATH, signal);
}

export const notificationPreferencesQueryOptions = () =>
  queryOptions({ queryKey: notificationKeys.preferences(), queryFn: ({ signal }) => getNotificationPreferences(signal) });

export function useNotificationPreferences() {
  return useQuery(notificationPreferencesQueryOptions());
}
