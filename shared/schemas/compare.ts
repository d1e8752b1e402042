import { z } from 'zod';
import { CROP_KEYS } from '../crops/library';
import type { DisplayUnit } from './gardens';

const SEASONS_ERROR = 'Seasons must be a comma-separated list of 4-digit years, such as 2024,2025.';

/**
 * The comparison of one crop's varieties: `GET /api/gardens/:gardenId/compare` (and `compare.csv`).
 * `seasons` is a comma list of season start years; left out, every season with plantings counts.
 */
export const compareQuerySchema = z.strictObject({
  crop: z
    .string({ error: 'Choose a crop.' })
    .refine((key) => CROP_KEYS.includes(key), { error: 'Choose a crop from the library, such as lettuce.' }),
  seasons: z
    .string({ error: SEASONS_ERROR })
    .regex(/^\d{4}(,\d{4})*$/, { error: SEASONS_ERROR })
    .transform((s) => [...new Set(s.split(',').map(Number))].sort((a, b) => a - b))
    .optional(),
});
export type CompareQuery = z.input<typeof compareQuerySchema>;

/** What a planting's heat days were counted up to: its bolting when it bolted before any harvest, else its first harvest; null with neither. */
export type HeatUntil = 'bolt' | 'harvest' | null;

export interface ComparePlantingDto {
  plantingId: number;
  varietyId: number;
  /** The season's start year, and its label ('2025', or '2025–26' south of the equator). */
  season: number | null;
  seasonLabel: string | null;
  /** The start event (sowing, or transplanting for a variety counted from it). */
  startOn: string | null;
  firstHarvestOn: string | null;
  boltedOn: string | null;
  /** Calendar days from the start event; null without the event on record. */
  daysToHarvest: number | null;
  /** Degree days from the start event through the day, in the garden's unit; null when days without weather came before it. */
  ddToHarvest: number | null;
  daysToBolt: number | null;
  ddToBolt: number | null;
  /** Days before `heatUntil` with a high above the crop's bolt heat threshold; null when it cannot be counted. */
  heatDays: number | null;
  /** Longest run of consecutive heat days before `heatUntil`. */
  longestHotStreak: number | null;
  heatUntil: HeatUntil;
  /** Hours of daylight at the garden on the day it bolted. */
  dayLengthAtBolt: number | null;
  /** Bolted with no harvest before it; null when neither is on record. */
  boltedBeforeHarvest: boolean | null;
}

export interface CompareMediansDto {
  daysToHarvest: number | null;
  ddToHarvest: number | null;
  daysToBolt: number | null;
  ddToBolt: number | null;
  heatDays: number | null;
  longestHotStreak: number | null;
  dayLengthAtBolt: number | null;
}

export interface CompareVarietyDto {
  varietyId: number;
  name: string;
  /** Plantings of this variety in the seasons compared. */
  plantings: number;
  /** Plantings with a bolt or a harvest on record (the ones the ranking and share stand on). */
  withOutcome: number;
  /** Share 0–1 of `withOutcome` plantings that bolted before their first harvest; null when none. */
  boltedBeforeHarvestShare: number | null;
  medians: CompareMediansDto;
  /** 1 = most heat tolerant; null when there is nothing to rank on. */
  rank: number | null;
  /** The evidence behind the rank, in words with units. */
  evidence: string;
  /** Words of caution when few plantings back the rank, saying how many; else null. */
  caution: string | null;
}

export interface CompareDto {
  crop: { key: string; name: string };
  /** Degree days in °F-days or °C-days, temperatures in °F or °C. */
  unit: DisplayUnit;
  /** The crop's bolt heat threshold in the garden's unit; null when the crop has none (no heat days then). */
  heatThreshold: number | null;
  /** Seasons compared (start years with their labels), oldest first. */
  seasons: Array<{ year: number; label: string }>;
  /** Every season with plantings of this crop, for the season choice. */
  availableSeasons: Array<{ year: number; label: string }>;
  /** Ranked first (1, 2, …), then the varieties without a rank by name. */
  varieties: CompareVarietyDto[];
  plantings: ComparePlantingDto[];
  /** How the comparison is made, in words. */
  method: string;
}
