/** Garden-scoped ([feature, gardenId, …]), so a garden edit that changes units or place marks it stale. */
export const climateKeys = {
  garden: (gardenId: number) => ['climate', gardenId] as const,
};
