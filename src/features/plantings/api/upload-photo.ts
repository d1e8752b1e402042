import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

/** `idempotencyKey` names the one photo meant: a retry with the same key adds it once. */
export async function uploadPhoto(gardenId: number, plantingId: number, file: File, caption: string, idempotencyKey?: string): Promise<PhotoDto> {
  const body = new FormData();
  if (caption) body.append('caption', caption);
  body.append('photo', file);
  return (await api.post<{ photo: PhotoDto }>(`/api/gardens/${gardenId}/plantings/${plantingId}/photos`, body, idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined)).photo;
}

export interface UploadPhotoVariables {
  file: File;
  caption: string;
  idempotencyKey?: string;
}

export function useUploadPhoto(gardenId: number, plantingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, caption, idempotencyKey }: UploadPhotoVariables) => uploadPhoto(gardenId, plantingId, file, caption, idempotencyKey),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantingKeys.detail(gardenId, plantingId) }),
  });
}
