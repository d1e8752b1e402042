import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WeatherResponse } from '#shared/schemas/weather';
import { api } from '@/lib/api-client';
import { weatherKeys } from '@/features/weather/api/weather-keys';
import type { WeatherRange } from '@/features/weather/api/weather-keys';

/** While the history backfill runs, the page asks again this often to move its progress bar. */
export const HISTORY_POLL_MS = 3_000;

export async function getWeather(gardenId: number, range: WeatherRange, signal?: AbortSignal): Promise<WeatherResponse> {
  const query = new URLSearchParams();
  if (range.from) query.set('from', range.from);
  if (range.to) query.set('to', range.to);
  const search = query.size ? `?${query.toString()}` : '';
  return api.get<WeatherResponse>(`/api/gardens/${gardenId}/weather${search}`, signal);
}

export const weatherQueryOptions = (gardenId: number, range: WeatherRange = {}) =>
  queryOptions({
    queryKey: weatherKeys.days(gardenId, range),
    queryFn: ({ signal }) => getWeather(gardenId, range, signal),
    refetchInterval: (query) => (query.state.data?.history?.running ? HISTORY_POLL_MS : false),
  });

export function useWeather(gardenId: number, range: WeatherRange = {}) {
  return useQuery(weatherQueryOptions(gardenId, range));
}
