import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GerminationTestCreateInput, SeedLotDto } from '#shared/schemas/seed-lots';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

/** `idempotencyKey` names the one test meant: a retry with the same key records it once. */
export async function addGerminationTest(gardenId: number, seedLotId: number, input: GerminationTestCreateInput, idempotencyKey?: string): Promise<SeedLotDto> {
  return (await api.post<{ seedLot: SeedLotDto }>(`/api/gardens/${gardenId}/seed-lots/${seedLotId}/germination-tests`, input, idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined)).seedLot;
}

export type AddGerminationTestVariables = GerminationTestCreateInput & { idempotencyKey?: string };

export function useAddGerminationTest(gardenId: number, seedLotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ idempotencyKey, ...input }: AddGerminationTestVariables) => addGerminationTest(gardenId, seedLotId, input, idempotencyKey),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seedLotKeys.all(gardenId) }),
  });
}
