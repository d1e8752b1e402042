import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SeedLotCreateInput, SeedLotDto } from '#shared/schemas/seed-lots';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

export async function createSeedLot(gardenId: number, input: SeedLotCreateInput): Promise<SeedLotDto> {
  return (await api.post<{ seedLot: SeedLotDto }>(`/api/gardens/${gardenId}/seed-lots`, input)).seedLot;
}

export function useCreateSeedLot(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SeedLotCreateInput) => createSeedLot(gardenId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seedLotKeys.all(gardenId) }),
  });
}
