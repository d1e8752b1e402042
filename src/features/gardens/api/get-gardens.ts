import { queryOptions, useQuery } from '@tanstack/react-query';
import type { GardenDto } from '#shared/schemas/gardens';
import { api } from '@/lib/api-client';
import { gardenKeys } from '@/features/gardens/api/garden-keys';

export async function getGardens(signal?: AbortSignal): Promise<GardenDto[]> {
  const { gardens } = await api.get<{ gardens: GardenDto[] }>('/api/gardens', signal);
  return gardens;
}

export const gardensQueryOptions = () =>
  queryOptions({
    queryKey: gardenKeys.list(),
    queryFn: ({ signal }) => getGardens(signal),
  });

export function useGardens() {
  return useQuery(gardensQueryOptions());
}
