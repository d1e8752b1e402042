import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { CompareDto } from '#shared/schemas/compare';
import { api } from '@/lib/api-client';

/** The query string of a comparison; `seasons` null means every season. */
export function compareSearch(crop: string, seasons: readonly number[] | null): string {
  const q = new URLSearchParams({ crop });
  if (seasons) q.set('seasons', seasons.join(','));
  return q.toString();
}

export function getCompare(gardenId: number, crop: string, seasons: readonly number[] | null, signal?: AbortSignal): Promise<CompareDto> {
  return api.get<CompareDto>(`/api/gardens/${gardenId}/compare?${compareSearch(crop, seasons)}`, signal);
}

/** The CSV of the same comparison, for a plain download link. */
export function compareCsvHref(gardenId: number, crop: string, seasons: readonly number[] | null): string {
  return `/api/gardens/${gardenId}/compare.csv?${compareSearch(crop, seasons)}`;
}

/** Key root ['compare', gardenId]: a garden edit that changes every figure marks it stale with the rest. */
export function useCompare(gardenId: number, crop: string | null, seasons: readonly number[] | null) {
  return useQuery({
    queryKey: ['compare', gardenId, crop, seasons] as const,
    queryFn: ({ signal }) => getCompare(gardenId, crop!, seasons, signal),
    enabled: crop !== null && (seasons === null || seasons.length > 0),
    placeholderData: keepPreviousData,
  });
}
