import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { NotificationPreferencesDto, NotificationPreferencesUpdate } from '#shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from '@/features/notifications/api/notification-keys';
import { NOTIFICATION_PREFERENCES_PATH } from '@/features/notifications/api/get-notification-preferences';

/** Through the shared client: the same headers, bounded wait and error words as every other call. */
export function updateNotificationPreferences(body: NotificationPreferencesUpdate): Promise<NotificationPreferencesDto> {
  return api.put<NotificationPreferencesDto>(NOTIFICATION_PREFERENCES_PATH, body);
}

export function useUpdateNotificationPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNotificationPreferences,
    onSuccess: (data) => queryClient.setQueryData(notificationKeys.preferences(), data),
  });
}
