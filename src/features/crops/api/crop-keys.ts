export const cropKeys = {
  all: (gardenId: number) => ['crops', gardenId] as const,
  list: (gardenId: number) => ['crops', gardenId, 'list'] as const,
};
