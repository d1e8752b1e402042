import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantingCreateInput, PlantingDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { invalidatePlantings } from '@/features/plantings/api/invalidate-plantings';

/** `idempotencyKey` names the one planting meant: a retry with the same key adds it once. */
export async function createPlanting(gardenId: number, input: PlantingCreateInput, idempotencyKey?: string): Promise<PlantingDto> {
  return (await api.post<{ planting: PlantingDto }>(`/api/gardens/${gardenId}/plantings`, input, idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined)).planting;
}

export type CreatePlantingVariables = PlantingCreateInput & { idempotencyKey?: string };

export function useCreatePlanting(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ idempotencyKey, ...input }: CreatePlantingVariables) => createPlanting(gardenId, input, idempotencyKey),
    onSuccess: () => invalidatePlantings(queryClient, gardenId),
  });
}
