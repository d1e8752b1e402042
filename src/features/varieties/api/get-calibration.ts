import { useQuery } from '@tanstack/react-query';
import type { CalibrationDto } from '#shared/schemas/varieties';
import { api } from '@/lib/api-client';
import { varietyKeys } from '@/features/varieties/api/variety-keys';

export function getCalibration(gardenId: number, varietyId: number, signal?: AbortSignal) {
  return api.get<CalibrationDto>(`/api/gardens/${gardenId}/varieties/${varietyId}/calibration`, signal);
}

/** Asked for only when the grower opens "From your harvests" (`enabled`), not for every card. */
export function useCalibration(gardenId: number, varietyId: number, enabled: boolean) {
  return useQuery({
    queryKey: [...varietyKeys.detail(gardenId, varietyId), 'calibration'] as const,
    queryFn: ({ signal }) => getCalibration(gardenId, varietyId, signal),
    enabled,
  });
}
