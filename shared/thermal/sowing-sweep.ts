/**
 * Sowing-window sweep: for every candidate sowing date, the maturity window across the garden's
 * past years and the share of those years with high bolt risk in the harvest window.
 * Work is split so a planner can cache the expensive part: prepareSowingSweep walks the history
 * once (daily degree days, prefix sums, a per-day "high bolt risk" flag and its prefix counts,
 * first-fall-frost days); sowingWindowSweep then answers each (candidate, analog year) pair with
 * index arithmetic: an exponential-then-binary search on the prefix sums, starting from the
 * previous candidate's answer (maturity can only move later when sowing does), and O(1) range
 * counts for missing days and high-risk days.
 */
import { civilToDayNumber, dayNumberToCivil, dayOfYearOfDayNumber, fromDayNumber, isLeapYear, parseIsoDate, toDayNumber } from './dates';
import type { CivilDate } from './dates';
import { dayLengthHours } from './day-length';
import { DEFAULT_BOLT_SCORING, scoreBoltDay } from './bolt-risk';
import type { BoltScoring, BoltTriggers } from './bolt-risk';
import { frostDatesOfSeries } from './frost-dates';
import { seasonOf } from './season';
import { degreeDaysOf, toDenseSeries } from './series';
import type { DenseSeries } from './series';
import type { DailyTemp, DateWindow, DegreeDayMethod } from './types';
import { TARGET_EPSILON } from './projection';

export interface SweepPreparationInput {
  history: readonly DailyTemp[];
  latitude: number;
  method: DegreeDayMethod;
  triggers?: BoltTriggers;
  boltTolerance?: number;
  scoring?: Partial<BoltScoring>;
  /** Low (°C) that ends the season for the 'first-fall-frost' cut-off; default 0. */
  frostThresholdC?: number;
}

export interface SweepClimatology {
  latitude: number;
  method: DegreeDayMethod;
  series: DenseSeries;
  /** prefixDd[i] = degree days of indices 0…i−1. */
  prefixDd: Float64Array;
  prefixMissing: Int32Array;
  prefixHigh: Int32Array;
  /** Indices of each season's first fall frost, ascending. */
  fallFrosts: Int32Array;
}

export type SweepCutoff = { monthDay: string } | 'first-fall-frost';

export interface SweepOptions {
  /** Candidate sowing dates, inclusive. */
  from: string;
  to: string;
  /** Degree days from sowing to maturity (°C-days for stored data). */
  target: number;
  /** Days of harvest after maturity checked for bolting (default 7: common practice, no source). */
  harvestWindowDays?: number;
  /** Fixed month-day (next occurrence on/after sowing) or each analog year's own first fall frost. */
  cutoff?: SweepCutoff;
  maxDays?: number;
}

export interface SowingCandidate {
  sowDate: string;
  /** Analog years with complete data for this candidate. */
  analogYears: number;
  /** Days after sowing (sowing day = day 0 of the offset; maturity on sowDate + n). null: not within maxDays in that share. */
  maturityDays: { p10: number | null; p50: number | null; p90: number | null };
  maturity: DateWindow;
  /** Share of analog years with at least one high-bolt-risk day in the harvest window. */
  highBoltShare: number;
  /** Share of analog years maturing after the cut-off or not at all. */
  missCutoffShare: number;
}

export interface SowingSweep {
  candidates: SowingCandidate[];
}

/**
 * Bolt risk in the sweep looks at the environment of each analog day only — heat streak and day
 * length — with the plant taken as near maturity (it is in its harvest window). Vernalization is
 * left out here: it depends on each planting's own cold history since its juvenile phase ended.
 */
export function prepareSowingSweep(input: SweepPreparationInput): SweepClimatology {
  const { latitude, method } = input;
  const series = toDenseSeries(input.history);
  const dd = degreeDaysOf(series, method);
  const n = series.length;
  const prefixDd = new Float64Array(n + 1);
  const prefixMissing = new Int32Array(n + 1);
  const prefixHigh = new Int32Array(n + 1);
  const triggers = input.triggers ?? {};
  const scoring = { ...DEFAULT_BOLT_SCORING, ...input.scoring };
  const tolerance = input.boltTolerance ?? 3;
  const dayLength = new Float64Array(367);
  for (let j = 1; j <= 366; j++) dayLength[j] = dayLengthHours(latitude, j);
  let doy = dayOfYearOfDayNumber(series.first);
  let year = dayNumberToCivil(series.first).year;
  let heatRun = 0;
  for (let i = 0; i < n; i++) {
    const present = series.present[i] === 1;
    prefixDd[i + 1] = prefixDd[i] + dd[i];
    prefixMissing[i + 1] = prefixMissing[i] + (present ? 0 : 1);
    const hot = present && triggers.heatThresholdC !== undefined && series.tmax[i] > triggers.heatThresholdC;
    heatRun = hot ? heatRun + 1 : 0;
    let high = false;
    if (present) {
      const state = { tmax: series.tmax[i], heatRun, heatRunForecast: 0, dayLengthH: dayLength[doy], coldDays: null, maturityFraction: 1, forecast: false };
      high = scoreBoltDay(state, triggers, scoring, tolerance, false).level === 'high';
    }
    prefixHigh[i + 1] = prefixHigh[i] + (high ? 1 : 0);
    if (++doy > (isLeapYear(year) ? 366 : 365)) {
      doy = 1;
      year++;
    }
  }
  const frost = frostDatesOfSeries(series, latitude, { thresholdC: input.frostThresholdC ?? 0 });
  // Each season's first frost that was seen, even in an autumn with missing days: skipping that
  // season would make the next year's frost the cut-off of this year's sowings.
  const fallFrosts = Int32Array.from(
    frost.seasons.filter((s) => s.firstFallFrostSeen !== null).map((s) => toDayNumber(s.firstFallFrostSeen!) - series.first),
  );
  return { latitude, method, series, prefixDd, prefixMissing, prefixHigh, fallFrosts };
}

/** Same month-day y years back (Feb 29 → Feb 28), as a series index. */
function analogStart(c: CivilDate, yearsBack: number, first: number): number {
  const year = c.year - yearsBack;
  const day = c.month === 2 && c.day === 29 && !isLeapYear(year) ? 28 : c.day;
  return civilToDayNumber({ year, month: c.month, day }) - first;
}

/** Smallest index m ≥ lo with prefix[m + 1] − prefix[a] ≥ target, or −1 below hi. */
function findMaturity(prefix: Float64Array, a: number, lo: number, hi: number, target: number): number {
  const need = prefix[a] + target - TARGET_EPSILON;
  if (hi < lo || prefix[hi + 1] < need) return -1;
  // Consecutive sowing dates mature on non-decreasing days, so walking on from the previous
  // answer costs about one step per candidate (amortised), cheaper than any search.
  let m = lo;
  while (prefix[m + 1] < need) m++;
  return m;
}

function dateAfter(sowN: number, days: number | null): string | null {
  return days === null ? null : fromDayNumber(sowN + days);
}

function rank(sorted: Float64Array, n: number, p: number): number | null {
  if (n === 0) return null;
  const v = sorted[Math.max(1, Math.ceil((p / 100) * n)) - 1];
  return Number.isFinite(v) ? v : null;
}

function cutoffDayNumber(cutoff: { monthDay: string }, sowN: number): number {
  const sow = dayNumberToCivil(sowN);
  const { month, day } = parseIsoDate(`2000-${cutoff.monthDay}`, 'cutoff.monthDay');
  const at = (year: number) => civilToDayNumber({ year, month, day: month === 2 && day === 29 && !isLeapYear(year) ? 28 : day });
  return at(sow.year) >= sowN ? at(sow.year) : at(sow.year + 1);
}

/**
 * Maturity windows and risk shares for each sowing date from `from` to `to`. Maturity is the
 * first day whose cumulative degree days since sowing (from the day after it) reach the target.
 * An analog year with a gap before maturity is left out of that candidate, never bridged.
 * The loop runs analog year by analog year over consecutive candidates so that each search
 * starts from the previous candidate's answer; the per-candidate percentiles then reuse the
 * previous candidate's order, which is nearly sorted already.
 */
export function sowingWindowSweep(clim: SweepClimatology, opts: SweepOptions): SowingSweep {
  const { series, prefixDd, prefixMissing, prefixHigh, fallFrosts } = clim;
  if (!(opts.target > 0)) throw new RangeError(`target (${opts.target}) must be a positive number of degree days`);
  const harvestDays = opts.harvestWindowDays ?? 7;
  const maxDays = opts.maxDays ?? 366;
  const fromN = toDayNumber(opts.from, 'from');
  const toN = toDayNumber(opts.to, 'to');
  if (toN < fromN) throw new RangeError(`to (${opts.to}) is before from (${opts.from})`);
  const len = series.length;
  const count = toN - fromN + 1;
  const years = Math.max(0, dayNumberToCivil(toN).year - dayNumberToCivil(series.first).year);
  const civil = Array.from({ length: count }, (_, k) => dayNumberToCivil(fromN + k));
  const fixedCutoff = opts.cutoff && opts.cutoff !== 'first-fall-frost' ? opts.cutoff : null;
  const cutoffs = Float64Array.from(civil, (_, k) => (fixedCutoff ? cutoffDayNumber(fixedCutoff, fromN + k) : Infinity));
  const byFrost = opts.cutoff === 'first-fall-frost';
  // offsets[k * years + y − 1]: days from sowing to maturity; NaN = analog unusable, Infinity = never.
  const offsets = new Float64Array(count * years).fill(NaN);
  const high = new Int32Array(count);
  const miss = new Int32Array(count);
  // Only Feb 29 and Mar 1 can break "next candidate = next analog day" (leap vs common years).
  const recompute = Uint8Array.from(civil, (c, k) => (k === 0 || (c.month === 2 && c.day === 29) || (c.month === 3 && c.day === 1) ? 1 : 0));
  for (let y = 1; y <= years; y++) {
    let previous = -1;
    let a = 0;
    let frostIdx = -1;
    for (let k = 0; k < count; k++) {
      a = recompute[k] ? analogStart(civil[k], y, series.first) : a + 1;
      if (a < 0 || a >= len) continue;
      if (byFrost && !(frostIdx >= a)) frostIdx = firstAtOrAfter(fallFrosts, a);
      const hi = Math.min(len, a + 1 + maxDays) - 1;
      // The sowing day is day 0 (start-event.ts): degree days count from index a + 1.
      const m = findMaturity(prefixDd, a + 1, Math.max(a + 1, previous), hi, opts.target);
      const end = m >= 0 ? m : hi;
      if (prefixMissing[end + 1] - prefixMissing[a + 1] > 0 || (m < 0 && a + 1 + maxDays > len)) continue;
      previous = m;
      offsets[k * years + y - 1] = m >= 0 ? m - a : Infinity;
      if (m >= 0 && prefixHigh[Math.min(len, m + harvestDays)] - prefixHigh[m] > 0) high[k]++;
      if (m < 0 || fromN + k + (m - a) > cutoffs[k] || (byFrost && m >= frostIdx)) miss[k]++;
    }
  }
  return { candidates: summarize(offsets, years, count, fromN, high, miss) };
}

function summarize(offsets: Float64Array, years: number, count: number, fromN: number, high: Int32Array, miss: Int32Array): SowingCandidate[] {
  const order = Int32Array.from({ length: years }, (_, y) => y);
  const values = new Float64Array(years);
  const slots = new Int32Array(years);
  const candidates: SowingCandidate[] = [];
  for (let k = 0; k < count; k++) {
    let used = 0;
    for (let j = 0; j < years; j++) {
      const v = offsets[k * years + order[j]];
      if (Number.isNaN(v)) continue;
      let i = used++;
      while (i > 0 && values[i - 1] > v) {
        values[i] = values[i - 1];
        slots[i] = slots[i - 1];
        i--;
      }
      values[i] = v;
      slots[i] = order[j];
    }
    if (used === years) order.set(slots);
    const days = { p10: rank(values, used, 10), p50: rank(values, used, 50), p90: rank(values, used, 90) };
    const sowN = fromN + k;
    candidates.push({
      sowDate: fromDayNumber(sowN),
      analogYears: used,
      maturityDays: days,
      maturity: { p10: dateAfter(sowN, days.p10), p50: dateAfter(sowN, days.p50), p90: dateAfter(sowN, days.p90) },
      highBoltShare: used ? high[k] / used : 0,
      missCutoffShare: used ? miss[k] / used : 0,
    });
  }
  return candidates;
}

/** The first value ≥ x, or Infinity. */
function firstAtOrAfter(sorted: Int32Array, x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo < sorted.length ? sorted[lo] : Infinity;
}

/** The season a sweep usually plans: every day of the season that contains `date`. */
export function seasonCandidates(date: string, latitude: number): { from: string; to: string } {
  const s = seasonOf(date, latitude);
  return { from: s.start, to: s.end };
}
