import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlacesResponse } from '#shared/schemas/places';
import { api } from '@/lib/api-client';

/** Not garden-scoped: the same words find the same places for anyone. */
export const placeKeys = {
  search: (q: string) => ['places', q] as const,
};

export const placesQueryOptions = (q: string) =>
  queryOptions({
    queryKey: placeKeys.search(q),
    queryFn: ({ signal }) => api.get<PlacesResponse>(`/api/places?${new URLSearchParams({ q })}`, signal),
    staleTime: Infinity,
  });

/** Asks only once the grower has pressed Find (`q` null until then). */
export function usePlaces(q: string | null) {
  return useQuery({ ...placesQueryOptions(q ?? ''), enabled: q !== null });
}
