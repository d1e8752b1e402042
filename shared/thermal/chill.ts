/**
 * Winter chill for fruit (SCIENCE §8): chill hours (hours at or below 7.2 °C, 45 °F; Weinberger
 * 1950) and Utah chill units (Richardson, Seeley & Walker 1974, HortScience 9(4):331), over hourly
 * temperatures — measured ones where a series has them, otherwise estimated from the daily highs
 * and lows by Linvill's (1990, HortScience 25(1):14) day/night curve.
 */
import { addDays } from './dates';
import { dayLengthHours } from './day-length';
import { isSouthern } from './season';
import type { DailyTemp } from './types';

/** Weinberger's threshold: an hour at or below 7.2 °C (45 °F) is a chill hour. */
export const CHILL_HOUR_MAX_C = 7.2;

export function isChillHour(tempC: number): boolean {
  return tempC <= CHILL_HOUR_MAX_C;
}

/**
 * Utah chill units of one hour at `tempC`, by the published bands (°C, one decimal): ≤ 1.4 → 0;
 * 1.5–2.4 → 0.5; 2.5–9.1 → 1; 9.2–12.4 → 0.5; 12.5–15.9 → 0; 16–18 → −0.5; > 18 → −1.
 * A temperature between two published bands (e.g. 1.45) belongs to the warmer band: each band is
 * read as "up to and including its upper figure".
 */
export function utahWeight(tempC: number): number {
  if (tempC <= 1.4) return 0;
  if (tempC <= 2.4) return 0.5;
  if (tempC <= 9.1) return 1;
  if (tempC <= 12.4) return 0.5;
  if (tempC <= 15.9) return 0;
  if (tempC <= 18) return -0.5;
  return -1;
}

/**
 * Linvill (1990) hourly temperatures for one calendar day at hours 0…23 (local solar time; hour h
 * is the temperature at h:00). Day length DL from the CBM model (shared/thermal/day-length.ts);
 * sunrise 12 − DL/2, sunset 12 + DL/2.
 *   day (sunrise ≤ h ≤ sunset):  T = Tn + (Tx − Tn) · sin(π · (h − sunrise) / (DL + 4))
 *   night (hours after sunset, H' ≥ 1):  T = Ts − (Ts − Tn') / ln(24 − DL) · ln(H')
 * where Ts is the day's sunset temperature and Tn' the next morning's low, so the night curve
 * reaches that low at the next sunrise. Hours before sunrise continue the previous night.
 * The two formulas are Linvill's as recalled (from memory, the paper not read here); the tests
 * check the shape they must have: the low at sunrise, the high 2 h after solar noon, continuity at
 * sunset and a fall through the night that slows.
 */
export function linvillHours(latitude: number, date: string, today: DailyTemp, previous: DailyTemp | null, next: DailyTemp | null): number[] {
  const dl = clampDayLength(dayLengthHours(latitude, date));
  const prevDl = clampDayLength(dayLengthHours(latitude, addDays(date, -1)));
  const sunrise = 12 - dl / 2;
  const sunset = 12 + dl / 2;
  const day = (d: DailyTemp, len: number, h: number) => d.tmin + (d.tmax - d.tmin) * Math.sin((Math.PI * (h - (12 - len / 2))) / (len + 4));
  const night = (from: DailyTemp, len: number, lowNext: number, hoursAfterSunset: number) => {
    const ts = day(from, len, 12 + len / 2);
    return ts - ((ts - lowNext) / Math.log(24 - len)) * Math.log(Math.max(1, hoursAfterSunset));
  };
  const out: number[] = [];
  for (let h = 0; h < 24; h++) {
    if (h >= sunrise && h <= sunset) out.push(day(today, dl, h));
    else if (h > sunset) out.push(night(today, dl, (next ?? today).tmin, h - sunset));
    else out.push(night(previous ?? today, prevDl, today.tmin, h + 24 - (12 + prevDl / 2)));
  }
  return out;
}

/** Polar days and nights have no sunrise; the curve needs a night of at least 2 h and a day of 2 h. */
function clampDayLength(h: number): number {
  return Math.min(22, Math.max(2, h));
}

export interface ChillTotals {
  hoursAtOrBelow7C: number;
  utahUnits: number;
  /** Hours counted (24 a day for daily estimates). */
  hours: number;
}

/**
 * Chill of a run of hourly temperatures. The Utah total is the running sum of the hourly units,
 * kept from going below zero: warm autumn hours before the chill starts do not leave a debt that
 * later cold must repay (Heatclock's choice, common practice, no source; Richardson et al. start
 * counting at the season's most negative point, which this approximates).
 */
export function chillOfHours(hourly: readonly number[]): ChillTotals {
  let hours = 0;
  let utah = 0;
  for (const t of hourly) {
    if (isChillHour(t)) hours++;
    utah = Math.max(0, utah + utahWeight(t));
  }
  return { hoursAtOrBelow7C: hours, utahUnits: utah, hours: hourly.length };
}

/** Hourly temperatures estimated from daily highs and lows, in date order (gaps are skipped, not filled). */
export function estimatedHours(latitude: number, days: readonly DailyTemp[]): number[] {
  const byDate = new Map(days.map((d) => [d.date, d]));
  const out: number[] = [];
  for (const d of days) {
    out.push(...linvillHours(latitude, d.date, d, byDate.get(addDays(d.date, -1)) ?? null, byDate.get(addDays(d.date, 1)) ?? null));
  }
  return out;
}

/**
 * The chill season a day belongs to: from 1 October in the north and 1 April in the south (the
 * start of autumn's cooling, common practice, no source) to the end of the following April
 * (north) or October (south). Before the season starts, the last one is answered.
 */
export function chillSeasonOf(latitude: number, today: string): { since: string; until: string } {
  const year = Number(today.slice(0, 4));
  const startMonth = isSouthern(latitude) ? '04' : '10';
  const start = (y: number) => `${y}-${startMonth}-01`;
  const since = today >= start(year) ? start(year) : start(year - 1);
  const endYear = Number(since.slice(0, 4)) + (isSouthern(latitude) ? 0 : 1);
  const until = `${endYear}-${isSouthern(latitude) ? '10' : '04'}-${isSouthern(latitude) ? '31' : '30'}`;
  return { since, until };
}
