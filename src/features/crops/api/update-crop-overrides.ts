import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CropDto, CropOverridesUpdateInput } from '#shared/schemas/crops';
import { api } from '@/lib/api-client';
import { cropKeys } from '@/features/crops/api/crop-keys';
import { invalidateGardenFigures } from '@/lib/progress-root-key';

/** Owner only. A value sets this garden's own figure; null goes back to the shared default. */
export async function updateCropOverrides(gardenId: number, cropKey: string, input: CropOverridesUpdateInput): Promise<CropDto> {
  return (await api.patch<{ crop: CropDto }>(`/api/gardens/${gardenId}/crops/${cropKey}`, input)).crop;
}

export function useUpdateCropOverrides(gardenId: number, cropKey: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CropOverridesUpdateInput) => updateCropOverrides(gardenId, cropKey, input),
    onSuccess: (crop) => {
      // The library is cached for minutes; put the answer in place at once, then confirm.
      queryClient.setQueryData<CropDto[]>(cropKeys.list(gardenId), (crops) => crops?.map((c) => (c.key === crop.key ? crop : c)));
      // Base, thresholds and triggers move every planting of the crop.
      return Promise.all([queryClient.invalidateQueries({ queryKey: cropKeys.all(gardenId) }), invalidateGardenFigures(queryClient, gardenId)]);
    },
  });
}
