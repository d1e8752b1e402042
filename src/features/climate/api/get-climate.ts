import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClimateDto } from '#shared/schemas/climate';
import { api } from '@/lib/api-client';
import { climateKeys } from '@/features/climate/api/climate-keys';

export async function getClimate(gardenId: number, signal?: AbortSignal): Promise<ClimateDto> {
  const { climate } = await api.get<{ climate: ClimateDto }>(`/api/gardens/${gardenId}/climate`, signal);
  return climate;
}

export const climateQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: climateKeys.garden(gardenId),
    queryFn: ({ signal }) => getClimate(gardenId, signal),
  });

export function useClimate(gardenId: number) {
  return useQuery(climateQueryOptions(gardenId));
}
