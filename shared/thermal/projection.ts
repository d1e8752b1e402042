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
  /** The planting's start event (sowing or transplant): day 0; degree days count from the next day (start-event.ts). */
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
  /** When set, `band` holds the 10th/50th/90th percentile of cumulative degree days per day through this date. */
  bandThrough?: string;
}

export interface BandDay {
  date: string;
  p10: number;
  p50: number;
  p90: number;
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
  /** Set when recorded (non-forecast) days reach the target: the planting has matured in heat. */
  maturedOn: string | null;
  /** Set when the target is first reached on a forecast day: a projection, not a record. */
  forecastMaturity: string | null;
  /** False when the garden has no past weather to continue the season with. */
  hasHistory: boolean;
  window: DateWindow;
  scenarios: ScenarioResult[];
  /** Share of scenarios that do not mature on or before the cut-off (or within maxDays). */
  neverMatureFraction: number;
  /** Days since start with no observed or forecast temperature; each scenario fills them from its analog year. */
  missingDates: string[];
  skippedSeasons: { season: string; reason: string }[];
  /** Cumulative degree days across the analog scenarios from the first day without known weather; empty unless asked. */
  band: BandDay[];
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
  const startN = toDayNumber(input.start, 'start') + 1;
  const cutoffN = input.cutoffDate !== undefined ? toDayNumber(input.cutoffDate, 'cutoffDate') : Infinity;
  const known = toDenseSeries(mergeObservedAndForecast(input.observed, input.forecast ?? []));
  const history = toDenseSeries(input.history);

  const lastKnownN = known.length ? known.first + known.length - 1 : startN - 1;
  const missing: number[] = [];
  const knownDd: number[] = [];
  let accumulated = 0;
  let maturedN: number | null = null;
  let maturedOnForecast = false;
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
    // A missing day can only add heat, so passing the target without it is still maturity; the gap is reported.
    if (maturedN === null && accumulated >= target - TARGET_EPSILON) {
      maturedN = n;
      maturedOnForecast = known.source[i] === 'forecast';
    }
  }
  const base = {
    accumulated,
    knownThrough: lastKnownN >= startN ? fromDayNumber(lastKnownN) : null,
    missingDates: missing.map(fromDayNumber),
    hasHistory: history.length > 0,
  };
  if (maturedN !== null) {
    const d = fromDayNumber(maturedN);
    return {
      ...base,
      maturedOn: maturedOnForecast ? null : d,
      forecastMaturity: maturedOnForecast ? d : null,
      window: { p10: d, p50: d, p90: d },
      scenarios: [],
      neverMatureFraction: maturedN <= cutoffN ? 0 : 1,
      skippedSeasons: [],
      band: [],
    };
  }
  if (!base.hasHistory) {
    return { ...base, maturedOn: null, forecastMaturity: null, window: { p10: null, p50: null, p90: null }, scenarios: [], neverMatureFraction: 0, skippedSeasons: [], band: [] };
  }

  const continueN = Math.max(startN, lastKnownN + 1);
  const scenarios: ScenarioResult[] = [];
  const skippedSeasons: { season: string; reason: string }[] = [];
  const matured: number[] = [];
  const throughN = input.bandThrough !== undefined ? toDayNumber(input.bandThrough, 'bandThrough') : continueN - 1;
  const traces: Float64Array[] = [];
  for (let y = 1; ; y++) {
    const a = analogIndex(history, continueN, y);
    if (a < 0) break;
    const season = seasonOf(fromDayNumber(history.first + a), latitude).label;
    const trace = new Float64Array(Math.max(0, throughN - continueN + 1)).fill(NaN);
    const result = runScenario(history, a, y, { ...input, maxDays, startN, continueN, knownDd, trace });
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
    traces.push(trace);
  }
  const never = scenarios.filter((s) => !s.beforeCutoff).length;
  return {
    ...base,
    maturedOn: null,
    forecastMaturity: null,
    window: windowOf(matured),
    scenarios,
    neverMatureFraction: scenarios.length ? never / scenarios.length : 0,
    skippedSeasons,
    band: bandOf(traces, continueN),
  };
}

/** Percentiles across scenarios per day; a day some scenario could not reach (a gap) uses the others. */
function bandOf(traces: Float64Array[], firstN: number): BandDay[] {
  const length = traces[0]?.length ?? 0;
  const out: BandDay[] = [];
  for (let k = 0; k < length; k++) {
    const values = traces.map((t) => t[k]).filter((v) => !Number.isNaN(v)).sort((a, b) => a - b);
    if (!values.length) break;
    out.push({ date: fromDayNumber(firstN + k), p10: nearestRank(values, 10)!, p50: nearestRank(values, 50)!, p90: nearestRank(values, 90)! });
  }
  return out;
}

interface ScenarioContext extends MaturityProjectionInput {
  maxDays: number;
  startN: number;
  continueN: number;
  /** Degree days of each known day from start; NaN where the day is missing. */
  knownDd: number[];
  /** Cumulative degree days per day from continueN, filled as far as it reaches (past maturity too). */
  trace: Float64Array;
}

/**
 * Maturity day number, null when not reached within maxDays, or the reason the analog is
 * unusable. Missing known days take the analog year's same calendar day.
 */
function runScenario(history: DenseSeries, a: number, yearsBack: number, ctx: ScenarioContext): number | null | string {
  let cum = 0;
  let matured: number | null = null;
  const limit = ctx.startN + ctx.maxDays;
  const traceEnd = ctx.continueN + ctx.trace.length;
  for (let n = ctx.startN; ; n++) {
    const searching = matured === null && n < limit;
    if (!searching && n >= traceEnd) break;
    let dd = n < ctx.continueN ? ctx.knownDd[n - ctx.startN] : NaN;
    if (Number.isNaN(dd)) {
      const i = n < ctx.continueN ? analogIndex(history, n, yearsBack) : a + n - ctx.continueN;
      if (i < 0 || i >= history.length || !history.present[i]) {
        // Past maturity a gap only ends the trace; before it, the analog is unusable.
        if (!searching) break;
        return `history has no temperature for ${fromDayNumber(history.first + i)}`;
      }
      dd = degreeDaysAt(history, i, ctx.method);
    }
    cum += dd;
    if (n >= ctx.continueN && n < traceEnd) ctx.trace[n - ctx.continueN] = cum;
    if (searching && cum >= ctx.target - TARGET_EPSILON) matured = n;
  }
  return matured;
}
