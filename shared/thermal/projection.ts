import { civilToDayNumber, dayNumberToCivil, fromDayNumber, sameDayInYear, toDayNumber } from './dates';
import { validateMethod } from './degree-days';
import { nearestRank } from './quantiles';
import { seasonOf } from './season';
import { degreeDaysAt, mergeObservedAndForecast, toDenseSeries } from './series';
import type { DenseSeries } from './series';
import type { DailyTemp, DateWindow, DegreeDayMethod } from './types';

/** Floating sums of exact steps (10 × 10.0) must still land on the target day. */
export const TARGET_EPSILON = 1e-9;

export interface MaturityProjectionInput {
  /** The planting's start event (sowing or transplant); it counts as day 1. */
  start: string;
  /** Degree-day target in the unit of the temperatures (°C-days for stored data). */
  target: number;
  method: DegreeDayMethod;
  observed: readonly DailyTemp[];
  forecast?: readonly DailyTemp[];
  /** The garden's own past daily temperatures: the analog years. */
  history: readonly DailyTemp[];
  latitude: number;
  /** e.g. the median first fall frost; maturity after it counts in neverMatureFraction. */
  cutoffDate?: string;
  /** Longest continuation simulated per scenario (default 366 days). */
  maxDays?: number;
}

export interface ScenarioResult {
  /** The analog season the continuation was taken from, e.g. '2019' or '2019–20'. */
  season: string;
  /** The analog day that stands in for the first day without known weather. */
  analogStart: string;
  maturityDate: string | null;
  beforeCutoff: boolean;
}

export interface MaturityProjection {
  /** Degree days from observed and forecast days since start. */
  accumulated: number;
  knownThrough: string | null;
  /** Set when observed/forecast days alone reach the target. */
  maturedOn: string | null;
  window: DateWindow;
  scenarios: ScenarioResult[];
  /** Share of scenarios that do not mature on or before the cut-off (or within maxDays). */
  neverMatureFraction: number;
  /** Days since start with no observed or forecast temperature; each scenario fills them from its analog year. */
  missingDates: string[];
  skippedSeasons: { season: string; reason: string }[];
}

function analogIndex(history: DenseSeries, dayNumber: number, yearsBack: number): number {
  const c = dayNumberToCivil(dayNumber);
  return civilToDayNumber(sameDayInYear(c, c.year - yearsBack)) - history.first;
}

function windowOf(dayNumbers: number[]): DateWindow {
  const sorted = [...dayNumbers].sort((a, b) => a - b);
  const pick = (p: number) => {
    const v = nearestRank(sorted, p);
    return v === null ? null : fromDayNumber(v);
  };
  return { p10: pick(10), p50: pick(50), p90: pick(90) };
}

/**
 * Maturity from observed days, then the forecast, then each past year of the garden as an
 * analog: the analog continues the season from the same calendar day (Feb 29 → Feb 28) over its
 * own consecutive days, so a southern season crossing New Year continues through the analog's
 * own January. An analog with a gap before maturity is skipped and reported, never bridged.
 */
export function projectMaturity(input: MaturityProjectionInput): MaturityProjection {
  const { target, method, latitude } = input;
  if (!(target > 0)) throw new RangeError(`target (${target}) must be a positive number of degree days`);
  validateMethod(method);
  const maxDays = input.maxDays ?? 366;
  const startN = toDayNumber(input.start, 'start');
  const cutoffN = input.cutoffDate !== undefined ? toDayNumber(input.cutoffDate, 'cutoffDate') : Infinity;
  const known = toDenseSeries(mergeObservedAndForecast(input.observed, input.forecast ?? []));
  const history = toDenseSeries(input.history);

  const lastKnownN = known.length ? known.first + known.length - 1 : startN - 1;
  const missing: number[] = [];
  const knownDd: number[] = [];
  let accumulated = 0;
  let maturedN: number | null = null;
  for (let n = startN; n <= lastKnownN; n++) {
    const i = n - known.first;
    if (i < 0 || !known.present[i]) {
      missing.push(n);
      knownDd.push(NaN);
      continue;
    }
    const dd = degreeDaysAt(known, i, method);
    knownDd.push(dd);
    accumulated += dd;
    if (maturedN === null && missing.length === 0 && accumulated >= target - TARGET_EPSILON) maturedN = n;
  }
  const base = {
    accumulated,
    knownThrough: lastKnownN >= startN ? fromDayNumber(lastKnownN) : null,
    missingDates: missing.map(fromDayNumber),
  };
  if (maturedN !== null) {
    const d = fromDayNumber(maturedN);
    return { ...base, maturedOn: d, window: { p10: d, p50: d, p90: d }, scenarios: [], neverMatureFraction: maturedN <= cutoffN ? 0 : 1, skippedSeasons: [] };
  }

  const continueN = Math.max(startN, lastKnownN + 1);
  const scenarios: ScenarioResult[] = [];
  const skippedSeasons: { season: string; reason: string }[] = [];
  const matured: number[] = [];
  for (let y = 1; ; y++) {
    const a = analogIndex(history, continueN, y);
    if (a < 0) break;
    const season = seasonOf(fromDayNumber(history.first + a), latitude).label;
    const result = runScenario(history, a, y, { ...input, maxDays, startN, continueN, knownDd });
    if (typeof result === 'string') {
      skippedSeasons.push({ season, reason: result });
      continue;
    }
    scenarios.push({
      season,
      analogStart: fromDayNumber(history.first + a),
      maturityDate: result === null ? null : fromDayNumber(result),
      beforeCutoff: result !== null && result <= cutoffN,
    });
    matured.push(result ?? Infinity);
  }
  const never = scenarios.filter((s) => !s.beforeCutoff).length;
  return {
    ...base,
    maturedOn: null,
    window: windowOf(matured),
    scenarios,
    neverMatureFraction: scenarios.length ? never / scenarios.length : 0,
    skippedSeasons,
  };
}

interface ScenarioContext extends MaturityProjectionInput {
  maxDays: number;
  startN: number;
  continueN: number;
  /** Degree days of each known day from start; NaN where the day is missing. */
  knownDd: number[];
}

/**
 * Maturity day number, null when not reached within maxDays, or the reason the analog is
 * unusable. Missing known days take the analog year's same calendar day.
 */
function runScenario(history: DenseSeries, a: number, yearsBack: number, ctx: ScenarioContext): number | null | string {
  let cum = 0;
  const limit = ctx.startN + ctx.maxDays;
  for (let n = ctx.startN; n < limit; n++) {
    let dd = n < ctx.continueN ? ctx.knownDd[n - ctx.startN] : NaN;
    if (Number.isNaN(dd)) {
      const i = n < ctx.continueN ? analogIndex(history, n, yearsBack) : a + n - ctx.continueN;
      if (i < 0 || i >= history.length || !history.present[i]) {
        return `history has no temperature for ${fromDayNumber(history.first + i)}`;
      }
      dd = degreeDaysAt(history, i, ctx.method);
    }
    cum += dd;
    if (cum >= ctx.target - TARGET_EPSILON) return n;
  }
  return null;
}
