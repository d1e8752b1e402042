import { z } from 'zod';
import { nameSchema } from './records';

export const ROLES = ['owner', 'grower', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const UNITS = ['F', 'C'] as const;
export type DisplayUnit = (typeof UNITS)[number];

function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

export const timeZoneSchema = z
  .string({ error: 'Time zone is required.' })
  .min(1, 'Time zone is required.')
  .max(64)
  .refine(isTimeZone, 'Time zone must be an IANA name such as America/Chicago or Australia/Melbourne.');

export const gardenUpdateSchema = z
  .object({
    name: nameSchema('Garden name', 120),
    latitude: z
      .number({ error: 'Latitude must be a number.' })
      .min(-90, 'Latitude must be between -90 and 90.')
      .max(90, 'Latitude must be between -90 and 90.'),
    longitude: z
      .number({ error: 'Longitude must be a number.' })
      .min(-180, 'Longitude must be between -180 and 180.')
      .max(180, 'Longitude must be between -180 and 180.'),
    elevationM: z
      .number({ error: 'Elevation must be a number of metres.' })
      .min(-450, 'Elevation must be between -450 and 9000 m.')
      .max(9000, 'Elevation must be between -450 and 9000 m.')
      .nullable(),
    timeZone: timeZoneSchema,
    units: z.enum(UNITS, { error: 'Units must be F or C.' }),
  })
  .partial()
  .strict();
export type GardenUpdateInput = z.infer<typeof gardenUpdateSchema>;

export interface GardenDto {
  id: number;
  name: string;
  latitude: number | null;
  longitude: number | null;
  elevationM: number | null;
  timeZone: string;
  units: DisplayUnit;
  /** 'N' or 'S'; south of the equator a growing season runs July–June. */
  hemisphere: 'N' | 'S';
  role: Role;
}
