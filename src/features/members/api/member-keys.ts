export const memberKeys = {
  all: (gardenId: number) => ['members', gardenId] as const,
  list: (gardenId: number) => ['members', gardenId, 'list'] as const,
};
