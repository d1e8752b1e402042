import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LogEntryCreateInput, LogEntryDto, PlantingDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';
import { invalidatePlantings } from '@/features/plantings/api/invalidate-plantings';

export function addLogEntry(gardenId: number, plantingId: number, input: LogEntryCreateInput) {
  return api.post<{ entry: LogEntryDto; planting: PlantingDto }>(`/api/gardens/${gardenId}/plantings/${plantingId}/log`, input);
}

export function useAddLogEntry(gardenId: number, plantingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LogEntryCreateInput) => addLogEntry(gardenId, plantingId, input),
    onSuccess: ({ planting }) => {
      // A harvest or bolting entry moves the planting's dates and status too.
      queryClient.setQueryData(plantingKeys.detail(gardenId, plantingId), planting);
      return invalidatePlantings(queryClient, gardenId);
    },
  });
}
