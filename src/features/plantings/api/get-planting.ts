import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlantingDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

export async function getPlanting(gardenId: number, id: number, signal?: AbortSignal): Promise<PlantingDto> {
  return (await api.get<{ planting: PlantingDto }>(`/api/gardens/${gardenId}/plantings/${id}`, signal)).planting;
}

export const plantingQueryOptions = (gardenId: number, id: number) =>
  queryOptions({ queryKey: plantingKeys.detail(gardenId, id), queryFn: ({ signal }) => getPlanting(gardenId, id, signal) });

export function usePlanting(gardenId: number, id: number) {
  return useQuery(plantingQueryOptions(gardenId, id));
}
