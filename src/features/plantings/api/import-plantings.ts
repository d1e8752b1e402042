import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportReport } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import type { ApiError, ApiRowProblem } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

/** All or nothing: a 422 answer means no row was written. */
export async function importPlantings(gardenId: number, file: File): Promise<ImportReport> {
  const body = new FormData();
  body.append('file', file, file.name);
  return (await api.post<{ report: ImportReport }>(`/api/gardens/${gardenId}/plantings/import`, body)).report;
}

const PROBLEM_KEY = /^line (\d+)(?:, (.*))?$/;

/**
 * The planting import names each problem in `fields` as "line 4, bed" (or "line 4" for a row the
 * CSV reader could not split); this turns them back into rows for the report table.
 */
export function importProblems(error: ApiError): ApiRowProblem[] {
  return Object.entries(error.fields).flatMap(([key, message]) => {
    const match = PROBLEM_KEY.exec(key);
    return match ? [{ line: Number(match[1]), column: match[2] || null, message }] : [];
  });
}

export function useImportPlantings(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation<ImportReport, ApiError, File>({
    mutationFn: (file) => importPlantings(gardenId, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantingKeys.all(gardenId) }),
  });
}
