import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BedListQuery, BedPage } from '#shared/schemas/beds';
import { api } from '@/lib/api-client';
import { bedKeys } from '@/features/beds/api/bed-keys';

export function getBeds(gardenId: number, query: BedListQuery, signal?: AbortSignal): Promise<BedPage> {
  const params = new URLSearchParams(Object.entries(query).map(([k, v]) => [k, String(v)]));
  return api.get<BedPage>(`/api/gardens/${gardenId}/beds?${params}`, signal);
}

export const bedsQueryOptions = (gardenId: number, query: BedListQuery = { pageSize: 200 }) =>
  queryOptions({ queryKey: bedKeys.list(gardenId, query), queryFn: ({ signal }) => getBeds(gardenId, query, signal) });

export function useBeds(gardenId: number, query?: BedListQuery) {
  return useQuery(bedsQueryOptions(gardenId, query));
}
