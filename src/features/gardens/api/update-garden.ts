import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GardenDto, GardenUpdateInput } from '#shared/schemas/gardens';
import { api, isApiError } from '@/lib/api-client';
import { gardenKeys } from '@/features/gardens/api/garden-keys';

export async function updateGarden(gardenId: number, changes: GardenUpdateInput): Promise<GardenDto> {
  const { garden } = await api.patch<{ garden: GardenDto }>(`/api/gardens/${gardenId}`, changes);
  return garden;
}

export function useUpdateGarden(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changes: GardenUpdateInput) => updateGarden(gardenId, changes),
    onSuccess: (garden) => {
      queryClient.setQueryData(gardenKeys.detail(gardenId), garden);
      // The switcher lists names, so the list must learn about a rename.
      return queryClient.invalidateQueries({ queryKey: gardenKeys.list() });
    },
    onError: (error) => {
      // A 403 means our idea of the grower's role is stale; fetch the truth.
      if (isApiError(error, 403)) return queryClient.invalidateQueries({ queryKey: gardenKeys.all });
    },
  });
}
