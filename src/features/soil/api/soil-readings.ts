import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SoilReadingCreateInput, SoilReadingDto } from '#shared/schemas/soil';
import { api } from '@/lib/api-client';
import { invalidateGardenFigures, weatherRootKey } from '@/lib/progress-root-key';
import { soilKeys } from '@/features/soil/api/get-soil';

/** A reading changes the garden's soil, its weather days and every page that reads them. */
function useRefreshSoil(gardenId: number) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: soilKeys.garden(gardenId) }),
      queryClient.invalidateQueries({ queryKey: weatherRootKey(gardenId) }),
      invalidateGardenFigures(queryClient, gardenId),
    ]);
}

export function useAddSoilReading(gardenId: number) {
  const refresh = useRefreshSoil(gardenId);
  return useMutation({
    mutationFn: ({ input, idempotencyKey }: { input: SoilReadingCreateInput; idempotencyKey: string }) =>
      api.post<{ reading: SoilReadingDto }>(`/api/gardens/${gardenId}/soil/readings`, input, { 'Idempotency-Key': idempotencyKey }),
    onSuccess: refresh,
  });
}

export function useDeleteSoilReading(gardenId: number, readingId: number) {
  const refresh = useRefreshSoil(gardenId);
  return useMutation({
    mutationFn: () => api.delete(`/api/gardens/${gardenId}/soil/readings/${readingId}`),
    onSuccess: refresh,
  });
}
