import { alertsRootKey } from '@/lib/progress-root-key';
import type { AlertListQuery } from '#shared/schemas/alerts';

export const alertKeys = {
  all: alertsRootKey,
  list: (gardenId: number, query: AlertListQuery) => ['alerts', gardenId, 'list', query] as const,
  counts: (gardenId: number) => ['alerts', gardenId, 'counts'] as const,
};
