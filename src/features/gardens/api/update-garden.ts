import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GardenDto, GardenUpdateInput } from '#shared/schemas/gardens';
import { api, isApiError } from '@/lib/api-client';
import { gardenKeys } from '@/features/gardens/api/garden-keys';

export async function updateGarden(gardenId: number, changes: GardenUpdateInput): Promise<GardenDto> {
  const { garden } = await api.patch<{ garden: GardenDto }>(`/api/gardens/${gardenId}`, changes);
  return garden;
}

const GARDEN_WIDE: (keyof GardenUpdateInput)[] = ['units', 'latitude', 'longitude', 'timeZone'];

export function useUpdateGarden(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changes: GardenUpdateInput) => updateGarden(gardenId, changes),
    onSuccess: (garden, changes) => {
      queryClient.setQueryData(gardenKeys.detail(gardenId), garden);
      // Units, place and time zone change every figure shown for the garden (weather, progress,
      // plantings' rows): every garden-scoped query, keyed [feature, gardenId, …], is stale.
      const refigured = GARDEN_WIDE.some((field) => field in changes);
      return Promise.all([
        // The switcher lists names, so the list must learn about a rename.
        queryClient.invalidateQueries({ queryKey: gardenKeys.list() }),
        refigured && queryClient.invalidateQueries({ predicate: ({ queryKey }) => queryKey[0] !== gardenKeys.all[0] && queryKey[1] === gardenId }),
      ]);
    },
    onError: (error) => {
      // A 403 means our idea of the grower's role is stale; fetch the truth.
      if (isApiError(error, 403)) return queryClient.invalidateQueries({ queryKey: gardenKeys.all });
    },
  });
}
