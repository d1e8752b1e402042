import type { DisplayUnit, GardenDto, Role } from '#shared/schemas/gardens';

export const ROLE_WORDS: Record<Role, string> = {
  owner: 'Owner',
  grower: 'Grower',
  viewer: 'Viewer',
};

export const ROLE_SENTENCES: Record<Role, string> = {
  owner: 'You own this garden: you can change its settings and records.',
  grower: 'You are a grower here: you can keep all of the garden’s records.',
  viewer: 'You are a viewer here: you can read the garden’s records but not change them.',
};

export const UNIT_WORDS: Record<DisplayUnit, string> = {
  F: '°F (Fahrenheit)',
  C: '°C (Celsius)',
};

export const HEMISPHERE_SENTENCES: Record<GardenDto['hemisphere'], string> = {
  N: 'Northern hemisphere: seasons run January–December.',
  S: 'Southern hemisphere: seasons run July–June.',
};

const coordinate = new Intl.NumberFormat('en', { minimumFractionDigits: 0, maximumFractionDigits: 4 });
const whole = new Intl.NumberFormat('en', { maximumFractionDigits: 0 });

export function formatLatitude(latitude: number): string {
  return `${coordinate.format(Math.abs(latitude))}° ${latitude < 0 ? 'S' : 'N'}`;
}

export function formatLongitude(longitude: number): string {
  return `${coordinate.format(Math.abs(longitude))}° ${longitude < 0 ? 'W' : 'E'}`;
}

export function formatLocation(garden: Pick<GardenDto, 'latitude' | 'longitude'>): string | null {
  if (garden.latitude === null || garden.longitude === null) return null;
  return `${formatLatitude(garden.latitude)}, ${formatLongitude(garden.longitude)}`;
}

export function formatElevation(elevationM: number | null): string | null {
  return elevationM === null ? null : `${whole.format(elevationM)} m`;
}

/** "3 seconds", "1 minute", "5 minutes" — rounded up so the grower never retries too early. */
export function formatWait(seconds: number): string {
  if (seconds < 60) {
    const s = Math.max(1, Math.ceil(seconds));
    return `${s} ${s === 1 ? 'second' : 'seconds'}`;
  }
  const minutes = Math.ceil(seconds / 60);
  return `${minutes} ${minutes === 1 ? 'minute' : 'minutes'}`;
}
