import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PhotoDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

export async function getPhotos(gardenId: number, plantingId: number, signal?: AbortSignal): Promise<PhotoDto[]> {
  return (await api.get<{ photos: PhotoDto[] }>(`/api/gardens/${gardenId}/plantings/${plantingId}/photos`, signal)).photos;
}

export const photosQueryOptions = (gardenId: number, plantingId: number) =>
  queryOptions({ queryKey: plantingKeys.photos(gardenId, plantingId), queryFn: ({ signal }) => getPhotos(gardenId, plantingId, signal) });

export function usePhotos(gardenId: number, plantingId: number) {
  return useQuery(photosQueryOptions(gardenId, plantingId));
}
