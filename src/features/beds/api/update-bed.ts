import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BedDto, BedUpdateInput } from '#shared/schemas/beds';
import { api } from '@/lib/api-client';
import { bedKeys } from '@/features/beds/api/bed-keys';

export async function updateBed(gardenId: number, bedId: number, input: BedUpdateInput): Promise<BedDto> {
  return (await api.patch<{ bed: BedDto }>(`/api/gardens/${gardenId}/beds/${bedId}`, input)).bed;
}

export function useUpdateBed(gardenId: number, bedId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BedUpdateInput) => updateBed(gardenId, bedId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: bedKeys.all(gardenId) }),
  });
}
