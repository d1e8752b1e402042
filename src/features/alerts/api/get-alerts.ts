import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AlertDto, AlertListQuery } from '#shared/schemas/alerts';
import { api } from '@/lib/api-client';
import { alertKeys } from '@/features/alerts/api/alert-keys';
import { alertSearchParams } from '@/features/alerts/utils/alert-search';

export function getAlerts(gardenId: number, query: AlertListQuery, signal?: AbortSignal): Promise<{ items: AlertDto[] }> {
  const params = alertSearchParams(query);
  const search = params.size ? `?${params}` : '';
  return api.get<{ items: AlertDto[] }>(`/api/gardens/${gardenId}/alerts${search}`, signal);
}

export const alertsQueryOptions = (gardenId: number, query: AlertListQuery) =>
  queryOptions({
    queryKey: alertKeys.list(gardenId, query),
    queryFn: ({ signal }) => getAlerts(gardenId, query, signal),
    // Keeps the list in place while another filter loads.
    placeholderData: keepPreviousData,
  });

export function useAlerts(gardenId: number, query: AlertListQuery) {
  return useQuery(alertsQueryOptions(gardenId, query));
}
