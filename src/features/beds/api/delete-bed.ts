import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { bedKeys } from '@/features/beds/api/bed-keys';

/** Refused with 409 while any planting, past or present, is on record in the bed. */
export function deleteBed(gardenId: number, bedId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/beds/${bedId}`);
}

export function useDeleteBed(gardenId: number, bedId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteBed(gardenId, bedId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: bedKeys.all(gardenId) }),
  });
}
