import type { VarietyListQuery } from '#shared/schemas/varieties';

export const varietyKeys = {
  all: (gardenId: number) => ['varieties', gardenId] as const,
  list: (gardenId: number, query: VarietyListQuery) => ['varieties', gardenId, 'list', query] as const,
  detail: (gardenId: number, id: number) => ['varieties', gardenId, 'detail', id] as const,
};
