import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { varietyKeys } from '@/features/varieties/api/variety-keys';

/** Refused with 409 while plantings or seed lots of the variety are on record. */
export function deleteVariety(gardenId: number, varietyId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/varieties/${varietyId}`);
}

export function useDeleteVariety(gardenId: number, varietyId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteVariety(gardenId, varietyId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: varietyKeys.all(gardenId) }),
  });
}
