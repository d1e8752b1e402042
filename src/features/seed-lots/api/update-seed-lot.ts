import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SeedLotDto, SeedLotUpdateInput } from '#shared/schemas/seed-lots';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

/** Changing the variety of a lot that plantings were sown from is refused with 409. */
export async function updateSeedLot(gardenId: number, seedLotId: number, input: SeedLotUpdateInput): Promise<SeedLotDto> {
  return (await api.patch<{ seedLot: SeedLotDto }>(`/api/gardens/${gardenId}/seed-lots/${seedLotId}`, input)).seedLot;
}

export function useUpdateSeedLot(gardenId: number, seedLotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SeedLotUpdateInput) => updateSeedLot(gardenId, seedLotId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seedLotKeys.all(gardenId) }),
  });
}
