import { fromDayNumber, toDayNumber } from './dates';
import { degreeDaysUnchecked, validateMethod } from './degree-days';
import type { DailyTemp, DegreeDayMethod, TempSource } from './types';

/**
 * Daily temperatures laid out by day number so that lookups, prefix sums and analog-year
 * offsets are index arithmetic. Missing days are NaN and `present` 0 — never bridged.
 */
export interface DenseSeries {
  /** Day number (days since 1970-01-01) of index 0. */
  first: number;
  length: number;
  tmax: Float64Array;
  tmin: Float64Array;
  present: Uint8Array;
  source: (TempSource | undefined)[];
}

function checkDay(d: DailyTemp): number {
  const n = toDayNumber(d.date, 'date');
  if (!Number.isFinite(d.tmax) || !Number.isFinite(d.tmin)) {
    throw new RangeError(`temperatures on ${d.date} (${d.tmax}/${d.tmin}) are not finite numbers`);
  }
  if (d.tmin > d.tmax) throw new RangeError(`tmin (${d.tmin}) is above tmax (${d.tmax}) on ${d.date}`);
  return n;
}

/**
 * One garden's history feeds every planting's projection and target in a batch: the same array is
 * laid out once. Callers never mutate a series they have handed over.
 */
const laidOut = new WeakMap<readonly DailyTemp[], DenseSeries>();

/** Throws a RangeError on an invalid day or a date given twice. */
export function toDenseSeries(days: readonly DailyTemp[]): DenseSeries {
  const cached = laidOut.get(days);
  if (cached) return cached;
  const s = layOut(days);
  laidOut.set(days, s);
  return s;
}

function layOut(days: readonly DailyTemp[]): DenseSeries {
  if (days.length === 0) {
    return { first: 0, length: 0, tmax: new Float64Array(0), tmin: new Float64Array(0), present: new Uint8Array(0), source: [] };
  }
  const numbers = days.map(checkDay);
  let first = Infinity;
  let last = -Infinity;
  for (const n of numbers) {
    if (n < first) first = n;
    if (n > last) last = n;
  }
  const length = last - first + 1;
  const s: DenseSeries = {
    first,
    length,
    tmax: new Float64Array(length).fill(NaN),
    tmin: new Float64Array(length).fill(NaN),
    present: new Uint8Array(length),
    source: new Array<TempSource | undefined>(length),
  };
  days.forEach((d, k) => {
    const i = numbers[k] - first;
    if (s.present[i]) throw new RangeError(`date (${d.date}) appears twice in the series`);
    s.present[i] = 1;
    s.tmax[i] = d.tmax;
    s.tmin[i] = d.tmin;
    s.source[i] = d.source;
  });
  return s;
}

/** Observed (and imported/filled) days win over forecast days for the same date. */
export function mergeObservedAndForecast(observed: readonly DailyTemp[], forecast: readonly DailyTemp[]): DailyTemp[] {
  const seen = new Set(observed.map((d) => d.date));
  return [...observed, ...forecast.filter((d) => !seen.has(d.date))];
}

/** Degree days of index i; tomorrow's low feeds the double methods when it is present. */
export function degreeDaysAt(s: DenseSeries, i: number, method: DegreeDayMethod): number {
  const next = i + 1 < s.length && s.present[i + 1] ? s.tmin[i + 1] : s.tmin[i];
  return degreeDaysUnchecked(s.tmax[i], s.tmin[i], next, method.base, method.upper ?? Infinity, method.method, method.cutoff ?? 'horizontal');
}

/** Degree days for every index of the series (0 where missing), method validated once. */
export function degreeDaysOf(s: DenseSeries, method: DegreeDayMethod): Float64Array {
  validateMethod(method);
  const dd = new Float64Array(s.length);
  for (let i = 0; i < s.length; i++) if (s.present[i]) dd[i] = degreeDaysAt(s, i, method);
  return dd;
}

export interface AccumulatedDay {
  date: string;
  tmax: number;
  tmin: number;
  dd: number;
  cumulative: number;
  source: TempSource;
}

export interface Accumulation {
  method: DegreeDayMethod;
  start: string;
  end: string;
  days: AccumulatedDay[];
  /** Dates between start and end with no temperatures: they add nothing and are listed here. */
  missingDates: string[];
  total: number;
}

/**
 * Cumulative degree days from `start` (counted as day 1) through `end` (default: the last day
 * of the series). Units follow the temperatures and thresholds (°C → °C-days).
 */
export function accumulateDegreeDays(
  series: readonly DailyTemp[],
  method: DegreeDayMethod,
  range: { start: string; end?: string },
): Accumulation {
  validateMethod(method);
  const s = toDenseSeries(series);
  const startN = toDayNumber(range.start, 'start');
  const endN = range.end !== undefined ? toDayNumber(range.end, 'end') : s.first + s.length - 1;
  if (endN < startN) throw new RangeError(`end (${fromDayNumber(endN)}) is before start (${range.start})`);
  const days: AccumulatedDay[] = [];
  const missingDates: string[] = [];
  let total = 0;
  for (let n = startN; n <= endN; n++) {
    const i = n - s.first;
    if (i < 0 || i >= s.length || !s.present[i]) {
      missingDates.push(fromDayNumber(n));
      continue;
    }
    const dd = degreeDaysAt(s, i, method);
    total += dd;
    days.push({ date: fromDayNumber(n), tmax: s.tmax[i], tmin: s.tmin[i], dd, cumulative: total, source: s.source[i] as TempSource });
  }
  return { method, start: range.start, end: fromDayNumber(endN), days, missingDates, total };
}
