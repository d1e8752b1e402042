import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProgressDto } from '#shared/schemas/progress';
import { api } from '@/lib/api-client';
import { progressKeys } from '@/features/progress/api/progress-keys';

export function getProgress(gardenId: number, plantingId: number, signal?: AbortSignal): Promise<ProgressDto> {
  return api.get<ProgressDto>(`/api/gardens/${gardenId}/plantings/${plantingId}/progress`, signal);
}

export const progressQueryOptions = (gardenId: number, plantingId: number) =>
  queryOptions({
    queryKey: progressKeys.planting(gardenId, plantingId),
    queryFn: ({ signal }) => getProgress(gardenId, plantingId, signal),
  });

export function useProgress(gardenId: number, plantingId: number) {
  return useQuery(progressQueryOptions(gardenId, plantingId));
}
