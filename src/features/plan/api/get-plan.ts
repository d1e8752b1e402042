import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { FrostRisk, PlanDto } from '#shared/schemas/plan';
import { api } from '@/lib/api-client';

export function getPlan(gardenId: number, varietyId: number, frostRisk: FrostRisk, signal?: AbortSignal): Promise<PlanDto> {
  const q = new URLSearchParams({ varietyId: String(varietyId), frostRisk });
  return api.get<PlanDto>(`/api/gardens/${gardenId}/plan?${q}`, signal);
}

/** Key root ['plan', gardenId]: a garden edit that changes every figure marks it stale with the rest. */
export function usePlan(gardenId: number, varietyId: number | null, frostRisk: FrostRisk) {
  return useQuery({
    queryKey: ['plan', gardenId, varietyId, frostRisk] as const,
    queryFn: ({ signal }) => getPlan(gardenId, varietyId!, frostRisk, signal),
    enabled: varietyId !== null,
    placeholderData: keepPreviousData,
  });
}
