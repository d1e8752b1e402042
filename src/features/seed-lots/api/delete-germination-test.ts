import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { seedLotKeys } from '@/features/seed-lots/api/seed-lot-keys';

export function deleteGerminationTest(gardenId: number, seedLotId: number, testId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/seed-lots/${seedLotId}/germination-tests/${testId}`);
}

export function useDeleteGerminationTest(gardenId: number, seedLotId: number, testId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteGerminationTest(gardenId, seedLotId, testId),
    // The latest test drives the lot's viability and the seeds-to-sow figure.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seedLotKeys.all(gardenId) }),
  });
}
