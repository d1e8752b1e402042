import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AlertDto } from '#shared/schemas/alerts';
import { api } from '@/lib/api-client';
import { progressRootKey } from '@/lib/progress-root-key';
import { alertKeys } from '@/features/alerts/api/alert-keys';

export async function acknowledgeAlert(gardenId: number, alertId: number): Promise<AlertDto> {
  const { alert } = await api.post<{ alert: AlertDto }>(`/api/gardens/${gardenId}/alerts/${alertId}/acknowledge`);
  return alert;
}

export function useAcknowledgeAlert(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (alertId: number) => acknowledgeAlert(gardenId, alertId),
    // Lists, counts and Today's actions (made from the open alerts) all move. Waiting for the
    // refetch keeps the button busy until the alert has left the open list, so it is sent once.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: alertKeys.all(gardenId) }),
        queryClient.invalidateQueries({ queryKey: [...progressRootKey(gardenId), 'today'] }),
      ]),
  });
}
