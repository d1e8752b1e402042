import type { PlantingListQuery } from '#shared/schemas/plantings';

export const plantingKeys = {
  all: (gardenId: number) => ['plantings', gardenId] as const,
  list: (gardenId: number, query: PlantingListQuery) => ['plantings', gardenId, 'list', query] as const,
  detail: (gardenId: number, id: number) => ['plantings', gardenId, 'detail', id] as const,
  log: (gardenId: number, id: number) => ['plantings', gardenId, 'detail', id, 'log'] as const,
  photos: (gardenId: number, id: number) => ['plantings', gardenId, 'detail', id, 'photos'] as const,
};
