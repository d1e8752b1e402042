import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportReport } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import type { ApiError } from '@/lib/api-client';
import { invalidatePlantings } from '@/features/plantings/api/invalidate-plantings';

/** All or nothing: a 422 answer means no row was written. */
export async function importPlantings(gardenId: number, file: File): Promise<ImportReport> {
  const body = new FormData();
  body.append('file', file, file.name);
  return (await api.post<{ report: ImportReport }>(`/api/gardens/${gardenId}/plantings/import`, body)).report;
}

export function useImportPlantings(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation<ImportReport, ApiError, File>({
    mutationFn: (file) => importPlantings(gardenId, file),
    onSuccess: () => invalidatePlantings(queryClient, gardenId),
  });
}
