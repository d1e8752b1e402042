import type { SeedLotListQuery } from '#shared/schemas/seed-lots';

export const seedLotKeys = {
  all: (gardenId: number) => ['seed-lots', gardenId] as const,
  list: (gardenId: number, query: SeedLotListQuery) => ['seed-lots', gardenId, 'list', query] as const,
  detail: (gardenId: number, id: number) => ['seed-lots', gardenId, 'detail', id] as const,
  seedsToSow: (gardenId: number, id: number, plants: number, emergenceFactor: number) =>
    ['seed-lots', gardenId, 'seeds-to-sow', id, plants, emergenceFactor] as const,
};
