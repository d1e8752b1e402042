import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantingDto, PlantingUpdateInput } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';
import { invalidatePlantings } from '@/features/plantings/api/invalidate-plantings';

/** A partial change; the server re-checks the whole planting with the change applied. */
export async function updatePlanting(gardenId: number, plantingId: number, input: PlantingUpdateInput): Promise<PlantingDto> {
  return (await api.patch<{ planting: PlantingDto }>(`/api/gardens/${gardenId}/plantings/${plantingId}`, input)).planting;
}

export function useUpdatePlanting(gardenId: number, plantingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PlantingUpdateInput) => updatePlanting(gardenId, plantingId, input),
    onSuccess: (planting) => {
      queryClient.setQueryData(plantingKeys.detail(gardenId, plantingId), planting);
      return invalidatePlantings(queryClient, gardenId);
    },
  });
}
