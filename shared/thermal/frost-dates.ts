import { civilToDayNumber, fromDayNumber, parseIsoDate } from './dates';
import { hardinessZone } from './hardiness';
import { nearestRank } from './quantiles';
import { isSouthern, monthDayOfOrdinal, seasonOfYear, seasonOrdinal, seasonStartYear } from './season';
import { toDenseSeries } from './series';
import type { DenseSeries } from './series';
import type { DailyTemp } from './types';
import { countOf } from '../format/count-words';

export interface SeasonFrost {
  season: string;
  /** Last day with a low ≤ threshold in the spring half; null if none (or the half is incomplete). */
  lastSpringFrost: string | null;
  firstFallFrost: string | null;
  /**
   * First day with a low ≤ threshold among the fall half's recorded days, complete or not: a frost
   * that was seen happened even if later days are missing (a planting's own cut-off uses it; the
   * frost-date statistics use only complete halves).
   */
  firstFallFrostSeen: string | null;
  springComplete: boolean;
  fallComplete: boolean;
}

/** A month-day ('MM-DD') with its slot in the season's fixed 366-day calendar. */
export interface FrostQuantile {
  monthDay: string;
  ordinal: number;
}

export interface FrostWindow {
  p10: FrostQuantile | null;
  p50: FrostQuantile | null;
  p90: FrostQuantile | null;
  seasons: number;
}

export interface ExtremeMinimum {
  /** Mean over complete winters of each winter's lowest tmin, °C. */
  meanC: number | null;
  zone: string | null;
  winters: { label: string; minC: number }[];
  estimate: boolean;
  reason?: string;
}

export interface FrostDates {
  thresholdC: number;
  seasons: SeasonFrost[];
  lastSpring: FrostWindow;
  firstFall: FrostWindow;
  extremeMinimum: ExtremeMinimum;
}

export interface FrostDateOptions {
  /** Low at or below which a day is a frost day; 0 °C (32 °F) per SCIENCE §4. */
  thresholdC?: number;
  /** Share of a half-season's days that must be present for it to count (default 0.95). */
  minCoverage?: number;
}

/** USDA zones rest on 30-year normals; fewer than 10 winters is flagged (SCIENCE §6). */
const MIN_WINTERS = 10;

/**
 * The spring half runs from the season start to the end of its 7th month (north Jan–Jul, south
 * Jul–Jan), the fall half from there to the season end (north Aug–Dec, south Feb–Jun): the split
 * sits a month after midsummer, so no spring frost is mistaken for a fall one.
 */
function halves(startYear: number, south: boolean): [number, number, number] {
  const start = civilToDayNumber({ year: startYear, month: south ? 7 : 1, day: 1 });
  const fall = civilToDayNumber(south ? { year: startYear + 1, month: 2, day: 1 } : { year: startYear, month: 8, day: 1 });
  const end = civilToDayNumber({ year: startYear + 1, month: south ? 7 : 1, day: 1 });
  return [start, fall, end];
}

function coverage(s: DenseSeries, from: number, to: number): number {
  let n = 0;
  for (let d = from; d < to; d++) {
    const i = d - s.first;
    if (i >= 0 && i < s.length && s.present[i]) n++;
  }
  return n / (to - from);
}

function frostDays(s: DenseSeries, from: number, to: number, thresholdC: number): number[] {
  const out: number[] = [];
  for (let d = Math.max(from, s.first); d < Math.min(to, s.first + s.length); d++) {
    const i = d - s.first;
    if (s.present[i] && s.tmin[i] <= thresholdC) out.push(d);
  }
  return out;
}

function ordinalOf(dayNumber: number, latitude: number): number {
  const { month, day } = parseIsoDate(fromDayNumber(dayNumber));
  return seasonOrdinal(month, day, latitude);
}

function window(values: number[], latitude: number): FrostWindow {
  const sorted = [...values].sort((a, b) => a - b);
  const pick = (p: number): FrostQuantile | null => {
    const v = nearestRank(sorted, p);
    return v === null ? null : { ordinal: v, monthDay: monthDayOfOrdinal(v, latitude) };
  };
  return { p10: pick(10), p50: pick(50), p90: pick(90), seasons: values.length };
}

/**
 * Frost dates from the garden's own history, hemisphere-aware.
 * Percentiles read "by this month-day, p % of seasons had it": last spring frost p90 is the date
 * by which 90 % of seasons had seen their last spring frost (10 % still froze later); first fall
 * frost p10 is the date by which 10 % of seasons had already had their first fall frost.
 * A season with no spring frost counts as earliest of all, one with no fall frost as latest;
 * a percentile that falls on such a season is null ("no frost in that share of seasons").
 */
export function frostDates(history: readonly DailyTemp[], latitude: number, opts: FrostDateOptions = {}): FrostDates {
  return frostDatesOfSeries(toDenseSeries(history), latitude, opts);
}

/** frostDates on an already laid-out series, for callers that hold one. */
export function frostDatesOfSeries(s: DenseSeries, latitude: number, opts: FrostDateOptions = {}): FrostDates {
  const thresholdC = opts.thresholdC ?? 0;
  const minCoverage = opts.minCoverage ?? 0.95;
  const south = isSouthern(latitude);
  const seasons: SeasonFrost[] = [];
  const spring: number[] = [];
  const fall: number[] = [];
  if (s.length > 0) {
    const firstYear = seasonStartYear(parseIsoDate(fromDayNumber(s.first)), latitude);
    const lastYear = seasonStartYear(parseIsoDate(fromDayNumber(s.first + s.length - 1)), latitude);
    for (let y = firstYear; y <= lastYear; y++) {
      const [start, mid, end] = halves(y, south);
      const springComplete = coverage(s, start, mid) >= minCoverage;
      const fallComplete = coverage(s, mid, end) >= minCoverage;
      const springFrosts = frostDays(s, start, mid, thresholdC);
      const fallFrosts = frostDays(s, mid, end, thresholdC);
      const last = springComplete && springFrosts.length ? springFrosts[springFrosts.length - 1] : null;
      const first = fallComplete && fallFrosts.length ? fallFrosts[0] : null;
      if (springComplete) spring.push(last === null ? -Infinity : ordinalOf(last, latitude));
      if (fallComplete) fall.push(first === null ? Infinity : ordinalOf(first, latitude));
      seasons.push({
        season: seasonOfYear(y, latitude).label,
        lastSpringFrost: last === null ? null : fromDayNumber(last),
        firstFallFrost: first === null ? null : fromDayNumber(first),
        firstFallFrostSeen: fallFrosts.length ? fromDayNumber(fallFrosts[0]) : null,
        springComplete,
        fallComplete,
      });
    }
  }
  return {
    thresholdC,
    seasons,
    lastSpring: window(spring, latitude),
    firstFall: window(fall, latitude),
    extremeMinimum: extremeMinimum(s, south, minCoverage),
  };
}

/**
 * Each winter's lowest tmin over a 12-month span centred on winter (north Jul–Jun, south
 * Jan–Dec), so one winter is never split between two years; spans below minCoverage are left out.
 */
function extremeMinimum(s: DenseSeries, south: boolean, minCoverage: number): ExtremeMinimum {
  const winters: { label: string; minC: number }[] = [];
  if (s.length > 0) {
    const firstYear = parseIsoDate(fromDayNumber(s.first)).year - 1;
    const lastYear = parseIsoDate(fromDayNumber(s.first + s.length - 1)).year;
    for (let y = firstYear; y <= lastYear; y++) {
      const from = civilToDayNumber({ year: y, month: south ? 1 : 7, day: 1 });
      const to = civilToDayNumber({ year: y + 1, month: south ? 1 : 7, day: 1 });
      if (coverage(s, from, to) < minCoverage) continue;
      let min = Infinity;
      for (let d = Math.max(from, s.first); d < Math.min(to, s.first + s.length); d++) {
        const i = d - s.first;
        if (s.present[i] && s.tmin[i] < min) min = s.tmin[i];
      }
      winters.push({ label: south ? String(y) : `${y}–${String((y + 1) % 100).padStart(2, '0')}`, minC: min });
    }
  }
  if (winters.length === 0) {
    return { meanC: null, zone: null, winters, estimate: true, reason: 'no complete winter in the history' };
  }
  const meanC = winters.reduce((a, w) => a + w.minC, 0) / winters.length;
  const estimate = winters.length < MIN_WINTERS;
  return {
    meanC,
    zone: hardinessZone(meanC, 'C'),
    winters,
    estimate,
    ...(estimate ? { reason: `only ${countOf(winters.length, 'complete winter')} of the garden's own data (fewer than ${MIN_WINTERS})` } : {}),
  };
}
