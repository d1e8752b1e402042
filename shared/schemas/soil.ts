import { z } from 'zod';
import type { DisplayUnit } from './gardens';
import type { SoilSowingStatus } from '../thermal/emergence';
import { isoDateSchema } from './records';

/** POST /api/gardens/:gardenId/soil/readings — a thermometer reading, in the garden's display unit. */
export const soilReadingCreateSchema = z.strictObject({
  readOn: isoDateSchema('Date'),
  temperature: z.number({ error: 'Temperature must be a number.' }).finite('Temperature must be a number.'),
  depthCm: z
    .number({ error: 'Depth must be a number.' })
    .min(0, 'Depth must be at least 0 cm.')
    .max(60, 'Depth must be at most 60 cm.')
    .nullable()
    .optional(),
  note: z.string({ error: 'The note must be text.' }).trim().max(300, 'The note must be at most 300 characters.').optional(),
});
export type SoilReadingCreateInput = z.infer<typeof soilReadingCreateSchema>;

/** Readings a thermometer in garden soil can give, °C (outside is a typing slip). */
export const SOIL_READING_RANGE_C = { min: -20, max: 50 } as const;

export interface SoilReadingDto {
  id: number;
  readOn: string;
  /** In the garden's display unit. */
  temperature: number;
  depthCm: number | null;
  note: string;
  by: string | null;
}

export type SoilDaySource = 'reading' | 'observed' | 'forecast';

export interface SoilCropDto {
  key: string;
  name: string;
  season: 'cool' | 'warm';
  status: SoilSowingStatus;
  /** Mean days to emergence at the soil temperature (interpolated in the table); null outside it. */
  emergenceDays: number | null;
  interpolated: boolean;
  /** Germination soil temperatures in the display unit; null when not known. */
  germ: { min: number; opt: number | null; max: number } | null;
  /** One sentence for the grower. */
  words: string;
}

/** GET /api/gardens/:gardenId/soil */
export interface GardenSoilResponse {
  unit: DisplayUnit;
  /** The soil temperature sowing advice reads: today's reading, else the latest day up to today. */
  current: { date: string; temperature: number; source: SoilDaySource } | null;
  /** The days ahead the service forecasts, in the display unit. */
  forecast: { date: string; temperature: number }[];
  readings: SoilReadingDto[];
  crops: SoilCropDto[];
  /** Where the days to emergence come from. */
  emergenceSource: string;
}
