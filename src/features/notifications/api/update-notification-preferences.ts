import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ApiErrorBody } from '#shared/schemas/errors';
import type { NotificationPreferencesDto, NotificationPreferencesUpdate } from '#shared/schemas/notifications';
import { ApiError } from '@/lib/api-client';
import { notificationKeys } from '@/features/notifications/api/notification-keys';
import { NOTIFICATION_PREFERENCES_PATH } from '@/features/notifications/api/get-notification-preferences';

/**
 * The shared client (src/lib/api-client.ts) has no PUT, and this is the one PUT route, so it is
 * sent here with the same headers (JSON, X-Requested-With for the CSRF rule) and error shape.
 */
export async function updateNotificationPreferences(body: NotificationPreferencesUpdate): Promise<NotificationPreferencesDto> {
  const response = await fetch(new URL(NOTIFICATION_PREFERENCES_PATH, document.baseURI), {
    method: 'PUT',
    headers: { Accept: 'application/json', 'Content-Type': 'application/json', 'X-Requested-With': 'heatclock' },
    credentials: 'same-origin',
    body: JSON.stringify(body),
  }).catch(() => {
    throw new ApiError({ status: 0, code: 'network_error', message: 'Heatclock could not be reached. Check your connection and try again.' });
  });
  const answer = (await response.json().catch(() => undefined)) as NotificationPreferencesDto | ApiErrorBody | undefined;
  if (response.ok) return answer as NotificationPreferencesDto;
  const error = answer && 'error' in answer ? answer.error : undefined;
  throw new ApiError({
    status: response.status,
    code: error?.code ?? 'http_error',
    message: error?.message ?? `The server answered with an unexpected error (HTTP ${response.status}). Please try again.`,
    fields: error?.fields,
  });
}

export function useUpdateNotificationPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNotificationPreferences,
    onSuccess: (data) => queryClient.setQueryData(notificationKeys.preferences(), data),
  });
}
