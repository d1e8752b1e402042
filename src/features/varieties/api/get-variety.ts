import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VarietyDto } from '#shared/schemas/varieties';
import { api } from '@/lib/api-client';
import { varietyKeys } from '@/features/varieties/api/variety-keys';

export async function getVariety(gardenId: number, id: number, signal?: AbortSignal): Promise<VarietyDto> {
  return (await api.get<{ variety: VarietyDto }>(`/api/gardens/${gardenId}/varieties/${id}`, signal)).variety;
}

export const varietyQueryOptions = (gardenId: number, id: number) =>
  queryOptions({ queryKey: varietyKeys.detail(gardenId, id), queryFn: ({ signal }) => getVariety(gardenId, id, signal) });

export function useVariety(gardenId: number, id: number | null) {
  return useQuery({ ...varietyQueryOptions(gardenId, id ?? 0), enabled: id !== null });
}
