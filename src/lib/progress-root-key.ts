/**
 * The root of every progress query of a garden (the progress feature's key factory builds on it).
 * Features whose changes move a planting's progress — its dates and log, the garden's units, its
 * weather — mark it stale through this key, since features never import each other.
 */
export const progressRootKey = (gardenId: number) => ['progress', gardenId] as const;
