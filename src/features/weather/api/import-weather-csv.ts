import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WeatherImportResult } from '#shared/schemas/weather';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { api } from '@/lib/api-client';
import type { ApiError } from '@/lib/api-client';
import { invalidateGardenFigures } from '@/lib/progress-root-key';
import { weatherKeys } from '@/features/weather/api/weather-keys';

export interface WeatherImportInput {
  unit: DisplayUnit;
  file: File;
  /** Names the one upload meant: a retry with the same key is answered as the first was. */
  idempotencyKey?: string;
}

/** A 422 answer lists every bad row of the file in the error's `rows`. */
export async function importWeatherCsv(gardenId: number, input: WeatherImportInput): Promise<WeatherImportResult> {
  const body = new FormData();
  body.append('unit', input.unit);
  body.append('file', input.file, input.file.name);
  const headers = input.idempotencyKey ? { 'Idempotency-Key': input.idempotencyKey } : undefined;
  return (await api.post<{ import: WeatherImportResult }>(`/api/gardens/${gardenId}/weather/imports`, body, headers)).import;
}

export function useImportWeatherCsv(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation<WeatherImportResult, ApiError, WeatherImportInput>({
    mutationFn: (input) => importWeatherCsv(gardenId, input),
    // The station's days replace the service's for this garden, so its plantings' progress moves.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: weatherKeys.garden(gardenId) }),
        invalidateGardenFigures(queryClient, gardenId),
      ]),
  });
}
