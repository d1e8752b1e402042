import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LogEntryCreateInput, LogEntryDto, PlantingDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';
import { invalidatePlantings } from '@/features/plantings/api/invalidate-plantings';

/**
 * `idempotencyKey` names one entry the grower means to add: a retry after no answer sends the
 * same key, so a server that keeps keys stores the entry once however often it arrives.
 */
export function addLogEntry(gardenId: number, plantingId: number, input: LogEntryCreateInput, idempotencyKey?: string) {
  return api.post<{ entry: LogEntryDto; planting: PlantingDto }>(
    `/api/gardens/${gardenId}/plantings/${plantingId}/log`,
    input,
    idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined,
  );
}

export type AddLogEntryVariables = LogEntryCreateInput & { idempotencyKey?: string };

export function useAddLogEntry(gardenId: number, plantingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ idempotencyKey, ...input }: AddLogEntryVariables) => addLogEntry(gardenId, plantingId, input, idempotencyKey),
    onSuccess: ({ planting }) => {
      // A harvest or bolting entry moves the planting's dates and status too.
      queryClient.setQueryData(plantingKeys.detail(gardenId, plantingId), planting);
      return invalidatePlantings(queryClient, gardenId);
    },
  });
}
