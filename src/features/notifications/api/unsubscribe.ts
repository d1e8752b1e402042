import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UnsubscribeInfoDto } from '#shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from '@/features/notifications/api/notification-keys';

export function unsubscribe(token: string) {
  return api.post<UnsubscribeInfoDto>(`/api/unsubscribe/${encodeURIComponent(token)}`, {});
}

export function useUnsubscribe(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => unsubscribe(token),
    // The link is spent now; the page keeps showing what it did rather than asking again.
    onSuccess: (info) => {
      queryClient.setQueryData(notificationKeys.unsubscribe(token), info);
      return queryClient.invalidateQueries({ queryKey: notificationKeys.preferences() });
    },
  });
}
