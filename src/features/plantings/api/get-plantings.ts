import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PlantingListQuery, PlantingPage } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

export function getPlantings(gardenId: number, query: PlantingListQuery, signal?: AbortSignal): Promise<PlantingPage> {
  const params = new URLSearchParams(Object.entries(query).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)]));
  return api.get<PlantingPage>(`/api/gardens/${gardenId}/plantings?${params}`, signal);
}

export const plantingsQueryOptions = (gardenId: number, query: PlantingListQuery) =>
  queryOptions({
    queryKey: plantingKeys.list(gardenId, query),
    queryFn: ({ signal }) => getPlantings(gardenId, query, signal),
    // Keeps the table in place while a new filter or sort loads.
    placeholderData: keepPreviousData,
  });

export function usePlantings(gardenId: number, query: PlantingListQuery) {
  return useQuery(plantingsQueryOptions(gardenId, query));
}
