import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GerminationTestCreateInput, SeedLotDto } from '#shared/schemas/seed-lots';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

export async function addGerminationTest(gardenId: number, seedLotId: number, input: GerminationTestCreateInput): Promise<SeedLotDto> {
  return (await api.post<{ seedLot: SeedLotDto }>(`/api/gardens/${gardenId}/seed-lots/${seedLotId}/germination-tests`, input)).seedLot;
}

export function useAddGerminationTest(gardenId: number, seedLotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: GerminationTestCreateInput) => addGerminationTest(gardenId, seedLotId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seedLotKeys.all(gardenId) }),
  });
}
