import type { UserDto } from '#shared/schemas/auth';
import type { GardenDto } from '#shared/schemas/gardens';

// Invented test people and places, in the spirit of the demo scenario.
export const grower: UserDto = { id: 7, email: 'mara@example.org', name: 'Mara Quill' };

export function aGarden(overrides: Partial<GardenDto> = {}): GardenDto {
  return {
    id: 1,
    name: 'Hollowbrook Teaching Garden',
    latitude: 44.52,
    longitude: -72.81,
    elevationM: 210,
    timeZone: 'America/New_York',
    units: 'F',
    hemisphere: 'N',
    role: 'owner',
    ...overrides,
  };
}
