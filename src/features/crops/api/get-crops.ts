import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CropDto } from '#shared/schemas/crops';
import { api } from '@/lib/api-client';
import { cropKeys } from '@/features/crops/api/crop-keys';

export async function getCrops(gardenId: number, signal?: AbortSignal): Promise<CropDto[]> {
  return (await api.get<{ crops: CropDto[] }>(`/api/gardens/${gardenId}/crops`, signal)).crops;
}

export const cropsQueryOptions = (gardenId: number) =>
  queryOptions({ queryKey: cropKeys.list(gardenId), queryFn: ({ signal }) => getCrops(gardenId, signal), staleTime: 5 * 60_000 });

export function useCrops(gardenId: number) {
  return useQuery(cropsQueryOptions(gardenId));
}
