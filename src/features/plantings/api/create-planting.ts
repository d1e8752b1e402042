import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantingCreateInput, PlantingDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { invalidatePlantings } from '@/features/plantings/api/invalidate-plantings';

export async function createPlanting(gardenId: number, input: PlantingCreateInput): Promise<PlantingDto> {
  return (await api.post<{ planting: PlantingDto }>(`/api/gardens/${gardenId}/plantings`, input)).planting;
}

export function useCreatePlanting(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PlantingCreateInput) => createPlanting(gardenId, input),
    onSuccess: () => invalidatePlantings(queryClient, gardenId),
  });
}
