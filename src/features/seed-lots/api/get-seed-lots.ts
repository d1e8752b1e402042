import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SeedLotListQuery, SeedLotPage } from '#shared/schemas/seed-lots';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

export function getSeedLots(gardenId: number, query: SeedLotListQuery, signal?: AbortSignal): Promise<SeedLotPage> {
  const params = new URLSearchParams(Object.entries(query).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)]));
  return api.get<SeedLotPage>(`/api/gardens/${gardenId}/seed-lots?${params}`, signal);
}

export const seedLotsQueryOptions = (gardenId: number, query: SeedLotListQuery = { pageSize: 200 }) =>
  queryOptions({ queryKey: seedLotKeys.list(gardenId, query), queryFn: ({ signal }) => getSeedLots(gardenId, query, signal) });

export function useSeedLots(gardenId: number, query?: SeedLotListQuery) {
  return useQuery(seedLotsQueryOptions(gardenId, query));
}
