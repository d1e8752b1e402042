import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { invalidateGardenFigures } from '@/lib/progress-root-key';
import { weatherKeys } from '@/features/weather/api/weather-keys';

export interface RefreshRun {
  runId: number;
  cellsOk: number;
  cellsFailed: number;
  cellsSkipped: number;
  daysWritten: number;
  daysRejected: number;
  requests: number;
  message?: string;
}

export async function refreshWeather(gardenId: number): Promise<RefreshRun> {
  const { run } = await api.post<{ run: RefreshRun }>(`/api/gardens/${gardenId}/weather/refresh`);
  return run;
}

export function useRefreshWeather(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => refreshWeather(gardenId),
    // The refresh also restarts the history backfill, so the days, progress and job list all move,
    // and so does every planting's progress.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: weatherKeys.garden(gardenId) }),
        invalidateGardenFigures(queryClient, gardenId),
      ]),
    onError: (error) => {
      // 409 no_location: the location was removed meanwhile; the page should say so.
      if (isApiError(error, 409)) return queryClient.invalidateQueries({ queryKey: weatherKeys.garden(gardenId) });
    },
  });
}
