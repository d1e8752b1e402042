import { z } from 'zod';

/**
 * A garden's climate facts, from its own stored weather (shared/thermal/frost-dates.ts and
 * hardiness.ts), with the owner's override beside them.
 *
 * Frost dates are month-days 'MM-DD' (the same calendar day every year, 02-29 included), not
 * dated days of one season: they are figures over many seasons, and a month-day reads the same
 * next year. Percentiles are nearest-rank (shared/thermal/quantiles.ts): lastSpringFrost.p90 is
 * the month-day by which 90 % of the garden's seasons had had their last spring frost;
 * firstFallFrost.p10 the one by which 10 % had already had their first fall frost. A percentile
 * that falls on seasons with no frost at all is null.
 */

/** Years behind a figure before it stops being flagged an estimate (SCIENCE §6). */
export const CLIMATE_MIN_YEARS = 10;

const DAYS_IN_MONTH = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

export function isMonthDay(s: string): boolean {
  const m = /^(\d{2})-(\d{2})$/.exec(s);
  if (!m) return false;
  const month = Number(m[1]);
  const day = Number(m[2]);
  return month >= 1 && month <= 12 && day >= 1 && day <= DAYS_IN_MONTH[month - 1];
}

const monthDaySchema = (what: string) =>
  z
    .string({ error: `${what} must be a month and day, MM-DD (e.g. 04-25).` })
    .refine(isMonthDay, { error: `${what} must be a month and day, MM-DD (e.g. 04-25).` })
    .nullable()
    .optional();

export const HARDINESS_ZONE_PATTERN = /^(?:[1-9]|1[0-3])[ab]$/;

export const climateOverrideSchema = z.strictObject({
  lastSpringFrost50: monthDaySchema('Last spring frost'),
  firstFallFrost50: monthDaySchema('First fall frost'),
  zone: z
    .string({ error: 'Zone must be a hardiness zone from 1a to 13b.' })
    .trim()
    .toLowerCase()
    .regex(HARDINESS_ZONE_PATTERN, { error: 'Zone must be a hardiness zone from 1a to 13b.' })
    .nullable()
    .optional(),
});
export type ClimateOverrideInput = z.infer<typeof climateOverrideSchema>;

export interface FrostDateFigure {
  p10: string | null;
  p50: string | null;
  p90: string | null;
  /** Seasons of the garden's own weather behind the figure. */
  years: number;
  estimate: boolean;
}

export interface ClimateOverrideDto {
  lastSpringFrost50: string | null;
  firstFallFrost50: string | null;
  zone: string | null;
  updatedAt: string;
}

export interface ClimateDto {
  /** The fewest years behind any figure below; `estimate` when under CLIMATE_MIN_YEARS. */
  years: number;
  estimate: boolean;
  hemisphere: 'north' | 'south';
  /** Why there are no figures yet (no location, no stored weather), else null. */
  reason: string | null;
  lastSpringFrost: FrostDateFigure;
  firstFallFrost: FrostDateFigure;
  /** Days from the last spring frost to the first fall frost, exclusive; p10 is a short season. */
  frostFreeDays: { p10: number | null; p50: number | null; p90: number | null; years: number; estimate: boolean };
  /** Mean of each winter's lowest low, in `unit`. */
  extremeMinimum: { mean: number | null; unit: 'F' | 'C'; years: number; estimate: boolean };
  /** USDA zone of that mean (2023 map method, SCIENCE §6). */
  zone: { zone: string | null; years: number; estimate: boolean };
  override: ClimateOverrideDto | null;
  /** 'override' when the owner has set any figure; those figures then stand in for the history's. */
  source: 'history' | 'override';
}
