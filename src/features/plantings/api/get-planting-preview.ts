import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { PlantingMethod, PlantingPreviewDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

export interface PreviewParams {
  varietyId: number;
  method: PlantingMethod;
  sownOn: string | null;
  transplantedOn: string | null;
}

export function getPlantingPreview(gardenId: number, p: PreviewParams, signal?: AbortSignal) {
  const q = new URLSearchParams({ varietyId: String(p.varietyId), method: p.method });
  if (p.sownOn) q.set('sownOn', p.sownOn);
  if (p.transplantedOn) q.set('transplantedOn', p.transplantedOn);
  return api.get<PlantingPreviewDto>(`/api/gardens/${gardenId}/plantings/preview?${q}`, signal);
}

/** The harvest window a planting not yet saved would get; off until a variety and its start date are chosen. */
export function usePlantingPreview(gardenId: number, p: PreviewParams | null) {
  return useQuery({
    queryKey: [...plantingKeys.all(gardenId), 'preview', p] as const,
    queryFn: ({ signal }) => getPlantingPreview(gardenId, p!, signal),
    enabled: p !== null,
    placeholderData: keepPreviousData,
    staleTime: 5 * 60_000,
  });
}
