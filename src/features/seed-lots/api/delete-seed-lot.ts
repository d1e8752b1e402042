import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

/** Takes the lot's germination tests with it; refused with 409 while plantings were sown from it. */
export function deleteSeedLot(gardenId: number, seedLotId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/seed-lots/${seedLotId}`);
}

export function useDeleteSeedLot(gardenId: number, seedLotId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteSeedLot(gardenId, seedLotId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seedLotKeys.all(gardenId) }),
  });
}
