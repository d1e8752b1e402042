import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AlertCountsDto } from '#shared/schemas/alerts';
import { api } from '@/lib/api-client';
import { alertKeys } from '@/features/alerts/api/alert-keys';

export function getAlertCounts(gardenId: number, signal?: AbortSignal): Promise<AlertCountsDto> {
  return api.get<AlertCountsDto>(`/api/gardens/${gardenId}/alerts/counts`, signal);
}

export const alertCountsQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: alertKeys.counts(gardenId),
    queryFn: ({ signal }) => getAlertCounts(gardenId, signal),
  });

export function useAlertCounts(gardenId: number) {
  return useQuery(alertCountsQueryOptions(gardenId));
}
