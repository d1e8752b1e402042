import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BedCreateInput, BedDto } from '#shared/schemas/beds';
import { api } from '@/lib/api-client';
import { bedKeys } from '@/features/beds/api/bed-keys';

export async function createBed(gardenId: number, input: BedCreateInput): Promise<BedDto> {
  return (await api.post<{ bed: BedDto }>(`/api/gardens/${gardenId}/beds`, input)).bed;
}

export function useCreateBed(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BedCreateInput) => createBed(gardenId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: bedKeys.all(gardenId) }),
  });
}
