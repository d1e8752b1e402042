import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClimateOverrideDto, ClimateOverrideInput } from '#shared/schemas/climate';
import { api } from '@/lib/api-client';
import { climateKeys } from '@/features/climate/api/climate-keys';

export async function updateClimateOverride(gardenId: number, input: ClimateOverrideInput): Promise<ClimateOverrideDto | null> {
  const { override } = await api.put<{ override: ClimateOverrideDto | null }>(`/api/gardens/${gardenId}/climate`, input);
  return override;
}

export function useUpdateClimateOverride(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ClimateOverrideInput) => updateClimateOverride(gardenId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: climateKeys.garden(gardenId) }),
  });
}
