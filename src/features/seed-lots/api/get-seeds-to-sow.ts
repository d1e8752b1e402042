import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SeedsToSowDto } from '#shared/schemas/seed-lots';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

export async function getSeedsToSow(gardenId: number, id: number, plants: number, emergenceFactor: number, signal?: AbortSignal) {
  const params = new URLSearchParams({ plants: String(plants), emergenceFactor: String(emergenceFactor) });
  return (await api.get<{ seedsToSow: SeedsToSowDto }>(`/api/gardens/${gardenId}/seed-lots/${id}/seeds-to-sow?${params}`, signal)).seedsToSow;
}

export const seedsToSowQueryOptions = (gardenId: number, id: number, plants: number, emergenceFactor: number) =>
  queryOptions({
    queryKey: seedLotKeys.seedsToSow(gardenId, id, plants, emergenceFactor),
    queryFn: ({ signal }) => getSeedsToSow(gardenId, id, plants, emergenceFactor, signal),
  });

export function useSeedsToSow(gardenId: number, id: number, plants: number, emergenceFactor: number, enabled: boolean) {
  return useQuery({ ...seedsToSowQueryOptions(gardenId, id, plants, emergenceFactor), enabled });
}
