import type { QueryClient } from '@tanstack/react-query';
import { invalidateGardenFigures } from '@/lib/progress-root-key';
import { plantingKeys } from '@/features/plantings/api/planting-keys';

/** A planting's dates, status or log move its progress (and Today's list) as well as its own rows. */
export function invalidatePlantings(queryClient: QueryClient, gardenId: number) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: plantingKeys.all(gardenId) }),
    invalidateGardenFigures(queryClient, gardenId),
  ]);
}
