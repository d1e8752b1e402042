import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';
import { invalidatePlantings } from '@/features/plantings/api/invalidate-plantings';

/** Takes the planting's log and photos with it. */
export function deletePlanting(gardenId: number, plantingId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/plantings/${plantingId}`);
}

export function useDeletePlanting(gardenId: number, plantingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deletePlanting(gardenId, plantingId),
    onSuccess: () => {
      // Dropped rather than refetched: the detail would only answer 404 now.
      queryClient.removeQueries({ queryKey: plantingKeys.detail(gardenId, plantingId) });
      return invalidatePlantings(queryClient, gardenId);
    },
  });
}
