import { progressRootKey } from '@/lib/progress-root-key';

export const progressKeys = {
  all: progressRootKey,
  planting: (gardenId: number, plantingId: number) => [...progressRootKey(gardenId), 'planting', plantingId] as const,
  today: (gardenId: number) => [...progressRootKey(gardenId), 'today'] as const,
};
