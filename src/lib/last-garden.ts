/**
 * The garden each user last opened, kept in this browser so signing in reopens it. Storage may be
 * unavailable (private mode, quota, blocked): then sign-in opens the first garden as before.
 */
const keyFor = (userId: number) => `heatclock.last-garden.${userId}`;

export function rememberGarden(userId: number, gardenId: number): void {
  try {
    localStorage.setItem(keyFor(userId), String(gardenId));
  } catch {
    // Nothing to keep then; the first garden opens next time.
  }
}

export function lastGarden(userId: number): number | null {
  try {
    const value = Number(localStorage.getItem(keyFor(userId)));
    return Number.isInteger(value) && value > 0 ? value : null;
  } catch {
    return null;
  }
}
