import type { BedListQuery } from '#shared/schemas/beds';

export const bedKeys = {
  all: (gardenId: number) => ['beds', gardenId] as const,
  list: (gardenId: number, query: BedListQuery) => ['beds', gardenId, 'list', query] as const,
};
