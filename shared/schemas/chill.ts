import type { ChillStatus } from '../crops/fruit';

/** GET /api/gardens/:gardenId/chill */
export interface GardenChill {
  /** First day counted: the start of the garden's chill season (1 Oct north, 1 Apr south). */
  since: string;
  /** Last day counted (yesterday in the garden, or the season's end); null before any day. */
  through: string | null;
  /** The season's last day (30 Apr north, 31 Oct south). */
  until: string;
  /** True once `until` has passed: the figures are last winter's, final. */
  seasonEnded: boolean;
  hoursAtOrBelow7C: number;
  utahUnits: number;
  /** How the hours were had: estimated from each day's high and low by Linvill's curve. */
  method: 'linvill-1990-from-daily';
  estimated: boolean;
  daysCounted: number;
  /** Days of the season so far without a high and low (not filled: the totals leave them out). */
  daysMissing: number;
  fruit: {
    key: string;
    name: string;
    chillHours: { min: number; max: number };
    source: string;
    status: ChillStatus;
    words: string;
  }[];
}
