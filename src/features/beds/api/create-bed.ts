import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BedCreateInput, BedDto } from '#shared/schemas/beds';
import { api } from '@/lib/api-client';
import { bedKeys } from '@/features/beds/api/bed-keys';

/** `idempotencyKey` names the one bed meant: a retry with the same key adds it once. */
export async function createBed(gardenId: number, input: BedCreateInput, idempotencyKey?: string): Promise<BedDto> {
  return (await api.post<{ bed: BedDto }>(`/api/gardens/${gardenId}/beds`, input, idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined)).bed;
}

export type CreateBedVariables = BedCreateInput & { idempotencyKey?: string };

export function useCreateBed(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ idempotencyKey, ...input }: CreateBedVariables) => createBed(gardenId, input, idempotencyKey),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: bedKeys.all(gardenId) }),
  });
}
