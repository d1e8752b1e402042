import type { AlertListQuery } from '#shared/schemas/alerts';

export const alertKeys = {
  all: (gardenId: number) => ['alerts', gardenId] as const,
  list: (gardenId: number, query: AlertListQuery) => ['alerts', gardenId, 'list', query] as const,
  counts: (gardenId: number) => ['alerts', gardenId, 'counts'] as const,
};
