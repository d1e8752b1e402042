import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TodayDto } from '#shared/schemas/progress';
import { api } from '@/lib/api-client';
import { progressKeys } from '@/features/progress/api/progress-keys';

export function getToday(gardenId: number, signal?: AbortSignal): Promise<TodayDto> {
  return api.get<TodayDto>(`/api/gardens/${gardenId}/today`, signal);
}

export const todayQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: progressKeys.today(gardenId),
    queryFn: ({ signal }) => getToday(gardenId, signal),
  });

export function useToday(gardenId: number) {
  return useQuery(todayQueryOptions(gardenId));
}
