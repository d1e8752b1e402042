import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

/** `idempotencyKey` names the one photo meant: a retry with the same key adds it once. */
export async function uploadPhoto(gardenId: number, plantingId: number, file: File, caption: string, idempotencyKey?: string, takenOn?: string): Promise<PhotoDto> {
  const body = new FormData();
  if (caption) body.append('caption', caption);
  // Sent the same way as a photo that waited offline, so a retry under one key is one request body.
  if (takenOn) body.append('takenOn', takenOn);
  body.append('photo', file);
  return (await api.post<{ photo: PhotoDto }>(`/api/gardens/${gardenId}/plantings/${plantingId}/photos`, body, idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined)).photo;
}

export interface UploadPhotoVariables {
  file: File;
  caption: string;
  idempotencyKey?: string;
  /** The garden's day the photo was taken (today there when it is chosen). */
  takenOn?: string;
}

export function useUploadPhoto(gardenId: number, plantingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, caption, idempotencyKey, takenOn }: UploadPhotoVariables) => uploadPhoto(gardenId, plantingId, file, caption, idempotencyKey, takenOn),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantingKeys.detail(gardenId, plantingId) }),
  });
}
