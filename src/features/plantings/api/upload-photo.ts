import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoDto } from '#shared/schemas/plantings';
import { ApiError } from '@/lib/api-client';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

/** Multipart, so not through the JSON client; the CSRF header is the same one it sends. */
export async function uploadPhoto(gardenId: number, plantingId: number, file: File, caption: string): Promise<PhotoDto> {
  const body = new FormData();
  if (caption) body.append('caption', caption);
  body.append('photo', file);
  const response = await fetch(new URL(`/api/gardens/${gardenId}/plantings/${plantingId}/photos`, document.baseURI), {
    method: 'POST',
    headers: { 'X-Requested-With': 'heatclock', Accept: 'application/json' },
    credentials: 'same-origin',
    body,
  });
  const json = (await response.json().catch(() => null)) as { photo?: PhotoDto; error?: { code: string; message: string; fields?: Record<string, string> } } | null;
  if (response.ok && json?.photo) return json.photo;
  throw new ApiError({
    status: response.status,
    code: json?.error?.code ?? 'http_error',
    message: json?.error?.message ?? `The photo could not be uploaded (HTTP ${response.status}).`,
    fields: json?.error?.fields,
  });
}

export function useUploadPhoto(gardenId: number, plantingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, caption }: { file: File; caption: string }) => uploadPhoto(gardenId, plantingId, file, caption),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantingKeys.detail(gardenId, plantingId) }),
  });
}
