import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JobRunDto } from '#shared/schemas/weather';
import { api } from '@/lib/api-client';
import { weatherKeys } from '@/features/weather/api/weather-keys';

/** Owner only: the server answers 403 to everyone else, so callers render this for owners alone. */
export async function getWeatherRuns(gardenId: number, signal?: AbortSignal): Promise<JobRunDto[]> {
  const { runs } = await api.get<{ runs: JobRunDto[] }>(`/api/gardens/${gardenId}/weather/runs`, signal);
  return runs;
}

export const weatherRunsQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: weatherKeys.runs(gardenId),
    queryFn: ({ signal }) => getWeatherRuns(gardenId, signal),
  });

export function useWeatherRuns(gardenId: number) {
  return useQuery(weatherRunsQueryOptions(gardenId));
}
