import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SeedLotDto } from '#shared/schemas/seed-lots';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

/** The single-lot answer is the one that lists every germination test. */
export async function getSeedLot(gardenId: number, id: number, signal?: AbortSignal): Promise<SeedLotDto> {
  return (await api.get<{ seedLot: SeedLotDto }>(`/api/gardens/${gardenId}/seed-lots/${id}`, signal)).seedLot;
}

export const seedLotQueryOptions = (gardenId: number, id: number) =>
  queryOptions({ queryKey: seedLotKeys.detail(gardenId, id), queryFn: ({ signal }) => getSeedLot(gardenId, id, signal) });

export function useSeedLot(gardenId: number, id: number) {
  return useQuery(seedLotQueryOptions(gardenId, id));
}
