import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SeedLotCreateInput, SeedLotDto } from '#shared/schemas/seed-lots';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

/** `idempotencyKey` names the one lot meant: a retry with the same key adds it once. */
export async function createSeedLot(gardenId: number, input: SeedLotCreateInput, idempotencyKey?: string): Promise<SeedLotDto> {
  return (await api.post<{ seedLot: SeedLotDto }>(`/api/gardens/${gardenId}/seed-lots`, input, idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined)).seedLot;
}

export type CreateSeedLotVariables = SeedLotCreateInput & { idempotencyKey?: string };

export function useCreateSeedLot(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ idempotencyKey, ...input }: CreateSeedLotVariables) => createSeedLot(gardenId, input, idempotencyKey),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seedLotKeys.all(gardenId) }),
  });
}
