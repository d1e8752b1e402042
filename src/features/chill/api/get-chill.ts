import { queryOptions, useQuery } from '@tanstack/react-query';
import type { GardenChill } from '#shared/schemas/chill';
import { api } from '@/lib/api-client';

/** Garden-scoped ([feature, gardenId]), so a garden edit that moves its place marks it stale. */
export const chillKeys = {
  garden: (gardenId: number) => ['chill', gardenId] as const,
};

export const chillQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: chillKeys.garden(gardenId),
    queryFn: ({ signal }) => api.get<GardenChill>(`/api/gardens/${gardenId}/chill`, signal),
  });

export function useChill(gardenId: number) {
  return useQuery(chillQueryOptions(gardenId));
}
