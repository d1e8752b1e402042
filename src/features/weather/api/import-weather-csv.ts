import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CsvRowError, WeatherImportResult } from '#shared/schemas/weather';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { ApiError } from '@/lib/api-client';
import { weatherKeys } from '@/features/weather/api/weather-keys';

/** A rejected upload; for an invalid CSV (422) it carries every bad row the server found. */
export class WeatherImportError extends ApiError {
  readonly rows: CsvRowError[];

  constructor(init: ConstructorParameters<typeof ApiError>[0] & { rows?: CsvRowError[] }) {
    super(init);
    this.rows = init.rows ?? [];
  }
}

export interface WeatherImportInput {
  unit: DisplayUnit;
  file: File;
}

interface ErrorBody {
  error?: { code?: string; message?: string; fields?: Record<string, string>; rows?: CsvRowError[] };
}

async function readJson(response: Response): Promise<unknown> {
  try {
    return await response.json();
  } catch {
    return undefined;
  }
}

// Not through `api`: a file goes as multipart form data (the browser sets the boundary in
// Content-Type), and a 422 carries the row report that ApiError has no place for.
export async function importWeatherCsv(gardenId: number, input: WeatherImportInput): Promise<WeatherImportResult> {
  const body = new FormData();
  body.append('unit', input.unit);
  body.append('file', input.file, input.file.name);

  let response: Response;
  try {
    response = await fetch(new URL(`/api/gardens/${gardenId}/weather/imports`, document.baseURI).toString(), {
      method: 'POST',
      headers: { Accept: 'application/json', 'X-Requested-With': 'heatclock' },
      credentials: 'same-origin',
      body,
    });
  } catch {
    throw new WeatherImportError({
      status: 0,
      code: 'network_error',
      message: 'Heatclock could not be reached. Check your connection and try again.',
    });
  }

  const json = await readJson(response);
  if (response.ok) return (json as { import: WeatherImportResult }).import;
  const error = (json as ErrorBody | undefined)?.error;
  throw new WeatherImportError({
    status: response.status,
    code: error?.code ?? 'http_error',
    message:
      error?.message ??
      (response.status === 413
        ? 'The file is larger than 2 MB.'
        : `The server answered with an unexpected error (HTTP ${response.status}). Please try again.`),
    fields: error?.fields,
    rows: error?.rows,
  });
}

export function useImportWeatherCsv(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation<WeatherImportResult, WeatherImportError, WeatherImportInput>({
    mutationFn: (input) => importWeatherCsv(gardenId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.garden(gardenId) }),
  });
}
