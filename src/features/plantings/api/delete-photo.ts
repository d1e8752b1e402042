import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

/** Removes the stored file and the photo's log entry too. */
export function deletePhoto(gardenId: number, plantingId: number, photoId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/plantings/${plantingId}/photos/${photoId}`);
}

export function useDeletePhoto(gardenId: number, plantingId: number, photoId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deletePhoto(gardenId, plantingId, photoId),
    // The log and the planting's entry count change with it.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantingKeys.all(gardenId) }),
  });
}
