export const gardenKeys = {
  all: ['gardens'] as const,
  list: () => ['gardens', 'list'] as const,
  detail: (gardenId: number) => ['gardens', 'detail', gardenId] as const,
};
