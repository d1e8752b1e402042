import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { VarietyCreateInput, VarietyDto } from '#shared/schemas/varieties';
import { api } from '@/lib/api-client';
import { varietyKeys } from '@/features/varieties/api/variety-keys';

/** `idempotencyKey` names the one variety meant: a retry with the same key adds it once. */
export async function createVariety(gardenId: number, input: VarietyCreateInput, idempotencyKey?: string): Promise<VarietyDto> {
  return (await api.post<{ variety: VarietyDto }>(`/api/gardens/${gardenId}/varieties`, input, idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined)).variety;
}

export type CreateVarietyVariables = VarietyCreateInput & { idempotencyKey?: string };

export function useCreateVariety(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ idempotencyKey, ...input }: CreateVarietyVariables) => createVariety(gardenId, input, idempotencyKey),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: varietyKeys.all(gardenId) }),
  });
}
