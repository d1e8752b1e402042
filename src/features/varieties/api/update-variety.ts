import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { VarietyDto, VarietyUpdateInput } from '#shared/schemas/varieties';
import { api } from '@/lib/api-client';
import { varietyKeys } from '@/features/varieties/api/variety-keys';
import { invalidateGardenFigures } from '@/lib/progress-root-key';

export async function updateVariety(gardenId: number, varietyId: number, input: VarietyUpdateInput): Promise<VarietyDto> {
  return (await api.patch<{ variety: VarietyDto }>(`/api/gardens/${gardenId}/varieties/${varietyId}`, input)).variety;
}

export function useUpdateVariety(gardenId: number, varietyId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: VarietyUpdateInput) => updateVariety(gardenId, varietyId, input),
    // The degree-day target follows from days to maturity, so the detail and every planting's progress are stale too.
    onSuccess: () =>
      Promise.all([queryClient.invalidateQueries({ queryKey: varietyKeys.all(gardenId) }), invalidateGardenFigures(queryClient, gardenId)]),
  });
}
