import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LogEntryDto } from '#shared/schemas/plantings';
import type { Page } from '#shared/schemas/records';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

export function getPlantingLog(gardenId: number, id: number, signal?: AbortSignal): Promise<Page<LogEntryDto>> {
  return api.get<Page<LogEntryDto>>(`/api/gardens/${gardenId}/plantings/${id}/log?pageSize=200`, signal);
}

export const plantingLogQueryOptions = (gardenId: number, id: number) =>
  queryOptions({ queryKey: plantingKeys.log(gardenId, id), queryFn: ({ signal }) => getPlantingLog(gardenId, id, signal) });

export function usePlantingLog(gardenId: number, id: number) {
  return useQuery(plantingLogQueryOptions(gardenId, id));
}
