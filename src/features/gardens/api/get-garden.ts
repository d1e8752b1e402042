import { queryOptions, useQuery } from '@tanstack/react-query';
import type { GardenDto } from '#shared/schemas/gardens';
import { api } from '@/lib/api-client';
import { gardenKeys } from '@/features/gardens/api/garden-keys';

export async function getGarden(gardenId: number, signal?: AbortSignal): Promise<GardenDto> {
  const { garden } = await api.get<{ garden: GardenDto }>(`/api/gardens/${gardenId}`, signal);
  return garden;
}

export const gardenQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: gardenKeys.detail(gardenId),
    queryFn: ({ signal }) => getGarden(gardenId, signal),
  });

export function useGarden(gardenId: number) {
  return useQuery(gardenQueryOptions(gardenId));
}
