import { queryOptions, useQuery } from '@tanstack/react-query';
import type { GardenSoilResponse } from '#shared/schemas/soil';
import { api } from '@/lib/api-client';

/** Garden-scoped ([feature, gardenId]), so a garden edit marks it stale. */
export const soilKeys = {
  garden: (gardenId: number) => ['soil', gardenId] as const,
};

export const soilQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: soilKeys.garden(gardenId),
    queryFn: ({ signal }) => api.get<GardenSoilResponse>(`/api/gardens/${gardenId}/soil`, signal),
  });

export function useSoil(gardenId: number) {
  return useQuery(soilQueryOptions(gardenId));
}
