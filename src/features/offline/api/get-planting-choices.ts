import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlantingPage } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';

/** The garden's plantings a kept entry can be moved to (its own keys: features do not share them). */
export function getPlantingChoices(gardenId: number, signal?: AbortSignal) {
  return api.get<PlantingPage>(`/api/gardens/${gardenId}/plantings?pageSize=100`, signal);
}

export const plantingChoicesQueryOptions = (gardenId: number) =>
  queryOptions({ queryKey: ['offline', gardenId, 'planting-choices'], queryFn: ({ signal }) => getPlantingChoices(gardenId, signal) });

export function usePlantingChoices(gardenId: number, enabled: boolean) {
  return useQuery({ ...plantingChoicesQueryOptions(gardenId), enabled });
}
