import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AlertDto } from '#shared/schemas/alerts';
import { api } from '@/lib/api-client';
import { progressRootKey } from '@/lib/progress-root-key';
import { alertKeys } from '@/features/alerts/api/alert-keys';

/** `idempotencyKey` names the one tap meant: a retry with the same key is answered as the first was. */
export async function acknowledgeAlert(gardenId: number, alertId: number, idempotencyKey?: string): Promise<AlertDto> {
  const { alert } = await api.post<{ alert: AlertDto }>(`/api/gardens/${gardenId}/alerts/${alertId}/acknowledge`, undefined, idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined);
  return alert;
}

export function useAcknowledgeAlert(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ alertId, idempotencyKey }: { alertId: number; idempotencyKey?: string }) => acknowledgeAlert(gardenId, alertId, idempotencyKey),
    // Lists, counts and Today's actions (made from the open alerts) all move. Waiting for the
    // refetch keeps the button busy until the alert has left the open list, so it is sent once.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: alertKeys.all(gardenId) }),
        queryClient.invalidateQueries({ queryKey: [...progressRootKey(gardenId), 'today'] }),
      ]),
  });
}
