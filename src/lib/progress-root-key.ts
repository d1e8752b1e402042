import type { QueryClient } from '@tanstack/react-query';

/**
 * The root of every progress query of a garden (the progress feature's key factory builds on it).
 * Features whose changes move a planting's progress — its dates and log, the garden's units, its
 * weather, a variety or crop value — mark it stale through these, since features never import each other.
 */
export const progressRootKey = (gardenId: number) => ['progress', gardenId] as const;

/** A garden's weather days (the weather feature's keys build on it); soil readings change their soil figures. */
export const weatherRootKey = (gardenId: number) => ['weather', gardenId] as const;

/** Alerts follow from progress on the server, so whatever moves one moves the other. */
export const alertsRootKey = (gardenId: number) => ['alerts', gardenId] as const;

export function invalidateGardenFigures(queryClient: QueryClient, gardenId: number) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: progressRootKey(gardenId) }),
    queryClient.invalidateQueries({ queryKey: alertsRootKey(gardenId) }),
  ]);
}
