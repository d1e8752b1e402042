import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VarietyListQuery, VarietyPage } from '#shared/schemas/varieties';
import { api } from '@/lib/api-client';
import { varietyKeys } from '@/features/varieties/api/variety-keys';

export function getVarieties(gardenId: number, query: VarietyListQuery, signal?: AbortSignal): Promise<VarietyPage> {
  const params = new URLSearchParams(Object.entries(query).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)]));
  return api.get<VarietyPage>(`/api/gardens/${gardenId}/varieties?${params}`, signal);
}

export const varietiesQueryOptions = (gardenId: number, query: VarietyListQuery = { pageSize: 200 }) =>
  queryOptions({ queryKey: varietyKeys.list(gardenId, query), queryFn: ({ signal }) => getVarieties(gardenId, query, signal) });

export function useVarieties(gardenId: number, query?: VarietyListQuery) {
  return useQuery(varietiesQueryOptions(gardenId, query));
}
