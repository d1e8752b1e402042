import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { VarietyCreateInput, VarietyDto } from '#shared/schemas/varieties';
import { api } from '@/lib/api-client';
import { varietyKeys } from '@/features/varieties/api/variety-keys';

export async function createVariety(gardenId: number, input: VarietyCreateInput): Promise<VarietyDto> {
  return (await api.post<{ variety: VarietyDto }>(`/api/gardens/${gardenId}/varieties`, input)).variety;
}

export function useCreateVariety(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: VarietyCreateInput) => createVariety(gardenId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: varietyKeys.all(gardenId) }),
  });
}
