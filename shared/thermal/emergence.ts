/**
 * Days from sowing to emergence at a constant soil temperature, and what a soil temperature means
 * for sowing a crop now.
 *
 * The table is Harrington & Minges (1954), "Vegetable Seed Germination", as reprinted in Knott's
 * Handbook for Vegetable Growers: mean days to emergence at soil temperatures of 32, 41, 50, …,
 * 104 °F; null where the table shows no emergence. The cells SCIENCE.md §7 quotes (lettuce 68 °F
 * → 3 days, tomato 50 → 43, onion 32 → 136, pepper 50 → none, spinach 50 → 12, radish 59 → 6,
 * sweet corn 59 → 12) are checked in tests/reference/emergence.test.ts; every other cell is
 * recalled, from memory. Between two columns the days are interpolated linearly in temperature
 * (our choice, common practice, no source): the table was measured at those nine temperatures only.
 */
import { cToF } from './units';

/** The table's soil temperatures, °F. */
export const EMERGENCE_TEMPS_F = [32, 41, 50, 59, 68, 77, 86, 95, 104] as const;

type Row = readonly (number | null)[];
const _ = null;

/** Mean days to emergence per column of EMERGENCE_TEMPS_F, keyed by the crop library's key. */
export const EMERGENCE_DAYS: Readonly<Record<string, Row>> = {
  lettuce: [49, 14.9, 7, 3.9, 2.6, 2.2, 2.6, _, _],
  spinach: [62.6, 22.5, 11.7, 6.9, 5.7, 5.1, 6.4, _, _],
  tomato: [_, _, 42.9, 13.6, 8.2, 5.9, 5.9, 9.2, _],
  onion: [135.8, 30.6, 13.4, 7.1, 4.6, 3.6, 3.9, 12.5, _],
  radish: [_, 29, 11.2, 6.3, 4.2, 3.5, 3, _, _],
  'sweet-corn': [_, _, 21.6, 12.4, 6.9, 4, 3.7, 3.4, _],
  'snap-bean': [_, _, _, 16.1, 11.4, 8.1, 6.4, 6.2, _],
  pea: [_, 36, 13.5, 9.4, 7.5, 6.2, 5.9, _, _],
  carrot: [_, 50.6, 17.3, 10.1, 6.9, 6.2, 6, 8.6, _],
  beet: [_, 42, 16.7, 9.7, 6.2, 5, 4.5, 4.6, _],
  cabbage: [_, _, 14.6, 8.7, 5.8, 4.5, 3.5, _, _],
  cucumber: [_, _, _, 12.5, 6.2, 4, 3.1, 3, _],
  pepper: [_, _, _, 25, 12.5, 8.4, 7.6, 8.8, _],
  watermelon: [_, _, _, _, 11.8, 4.7, 3.5, 3, _],
};

export const EMERGENCE_SOURCE =
  'Harrington & Minges 1954, days to emergence at constant soil temperature, as reprinted in Knott’s Handbook for Vegetable Growers; interpolated between the table’s temperatures';

export interface Emergence {
  /** Mean days to emergence, interpolated between the table's temperatures. */
  days: number;
  /** The table columns (°F) it lies between; equal when the temperature is a column. */
  betweenF: [number, number];
  interpolated: boolean;
}

/**
 * Days to emergence for `cropKey` at a soil temperature in °C; null when the crop is not in the
 * table, or the temperature is outside the columns where it emerged (including any span that
 * touches a "no emergence" cell: the table does not say where between the two it stops).
 */
export function emergenceDays(cropKey: string, soilC: number): Emergence | null {
  if (!Number.isFinite(soilC)) throw new RangeError('soilC must be a finite number');
  const row = EMERGENCE_DAYS[cropKey];
  if (!row) return null;
  const f = cToF(soilC);
  const temps = EMERGENCE_TEMPS_F;
  // Within a hair of a column counts as that column: °C → °F arithmetic is not exact, and a
  // reading is stored to 0.01 °C (0.018 °F).
  const exact = temps.findIndex((t) => Math.abs(t - f) < 0.011);
  if (exact >= 0) {
    const days = row[exact];
    return days == null ? null : { days, betweenF: [temps[exact], temps[exact]], interpolated: false };
  }
  const hi = temps.findIndex((t) => t > f);
  if (hi <= 0) return null;
  const lo = hi - 1;
  const a = row[lo];
  const b = row[hi];
  if (a == null || b == null) return null;
  const share = (f - temps[lo]) / (temps[hi] - temps[lo]);
  return { days: a + (b - a) * share, betweenF: [temps[lo], temps[hi]], interpolated: true };
}

/** How far past a germination limit still counts as at it: the rounding of a stored reading. */
const LIMIT_SLACK_C = 0.006;

export type SoilSowingStatus = 'too-cold' | 'cool' | 'good' | 'too-warm' | 'unknown';

export interface SoilSowingInput {
  cropKey: string;
  /** Germination soil temperatures, °C (the crop's effective values); null when not known. */
  germMinC: number | null;
  germOptC: number | null;
  germMaxC: number | null;
}

export interface SoilSowing {
  status: SoilSowingStatus;
  emergence: Emergence | null;
}

/**
 * Whether a soil temperature suits sowing the crop now: below its germination minimum it is
 * `too-cold`, above the maximum `too-warm`; in range it is `cool` below halfway from the minimum
 * to the optimum and `good` from there (that halfway line is ours: common practice, no source).
 */
export function soilSowing(input: SoilSowingInput, soilC: number): SoilSowing {
  if (!Number.isFinite(soilC)) throw new RangeError('soilC must be a finite number');
  const emergence = emergenceDays(input.cropKey, soilC);
  const { germMinC: min, germOptC: opt, germMaxC: max } = input;
  let status: SoilSowingStatus;
  // A reading typed at the limit in °F is stored to 0.01 °C (40 °F → 4.44 °C): it is at the limit, not past it.
  if (min === null || max === null) status = 'unknown';
  else if (soilC < min - LIMIT_SLACK_C) status = 'too-cold';
  else if (soilC > max + LIMIT_SLACK_C) status = 'too-warm';
  else if (opt !== null && soilC < (min + opt) / 2) status = 'cool';
  else status = 'good';
  return { status, emergence };
}
