import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidatePlantings } from '@/features/plantings/api/invalidate-plantings';

/** A photo's own entry is refused with 409: deleting the photo removes it. */
export function deleteLogEntry(gardenId: number, plantingId: number, entryId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/plantings/${plantingId}/log/${entryId}`);
}

export function useDeleteLogEntry(gardenId: number, plantingId: number, entryId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteLogEntry(gardenId, plantingId, entryId),
    // The planting's entry count and list row change as well as its log.
    onSuccess: () => invalidatePlantings(queryClient, gardenId),
  });
}
