import type { GardenDto, Role } from '#shared/schemas/gardens';
import type { Garden } from '../../db/models';
import { isSouthern } from '#shared/thermal/index';

/** What presenting a garden reads of it (a model instance or a plain row). */
export type GardenRow = Pick<Garden, 'id' | 'name' | 'latitude' | 'longitude' | 'elevationM' | 'timeZone' | 'units'>;

export function presentGarden(g: GardenRow, role: Role): GardenDto {
  return {
    id: g.id,
    name: g.name,
    latitude: g.latitude,
    longitude: g.longitude,
    elevationM: g.elevationM,
    timeZone: g.timeZone,
    units: g.units,
    hemisphere: isSouthern(g.latitude ?? 0) ? 'S' : 'N',
    role,
  };
}
