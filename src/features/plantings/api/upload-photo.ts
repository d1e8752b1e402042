import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoDto } from '#shared/schemas/plantings';
import { api } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

export async function uploadPhoto(gardenId: number, plantingId: number, file: File, caption: string): Promise<PhotoDto> {
  const body = new FormData();
  if (caption) body.append('caption', caption);
  body.append('photo', file);
  return (await api.post<{ photo: PhotoDto }>(`/api/gardens/${gardenId}/plantings/${plantingId}/photos`, body)).photo;
}

export function useUploadPhoto(gardenId: number, plantingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, caption }: { file: File; caption: string }) => uploadPhoto(gardenId, plantingId, file, caption),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantingKeys.detail(gardenId, plantingId) }),
  });
}
