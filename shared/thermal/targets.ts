/**
 * From a packet's days to maturity (DTM) to a degree-day target, and back from harvest records.
 */
import { civilToDayNumber, dayNumberToCivil, isLeapYear, parseIsoDate } from './dates';
import { nearestRank, median } from './quantiles';
import { degreeDaysOf, toDenseSeries } from './series';
import type { DailyTemp, DegreeDayMethod } from './types';

export type DtmCountsFrom = 'sowing' | 'emergence' | 'transplant';

export interface DtmTargetInput {
  daysToMaturity: number;
  countsFrom: DtmCountsFrom;
  /** Required when DTM counts from emergence. */
  daysToEmergence?: number;
  /** The garden's past daily temperatures (°C). */
  history: readonly DailyTemp[];
  method: DegreeDayMethod;
  /** Typical start dates as month-days 'MM-DD', inclusive; may wrap past New Year (e.g. '11-15'…'02-15'). */
  window: { from: string; to: string };
}

export interface DtmTarget {
  /** Median over past years and window days of the degree days in the `days` days after the start event. */
  target: number;
  /** The planting event the target counts from: sowing (for sowing and emergence DTMs) or transplant. */
  countsFrom: 'sowing' | 'transplant';
  /** Days from that event the packet figure stands for. */
  days: number;
  p10: number;
  p90: number;
  samples: number;
}

function monthDay(md: string, name: string): { month: number; day: number } {
  const { month, day } = parseIsoDate(`2000-${md}`, name);
  return { month, day };
}

/**
 * Converts DTM into degree days from the garden's own climatology over the sowing window:
 * every past year × every window day whose whole span is present contributes one sample.
 * Common practice (no source): when DTM counts from emergence, the days to emergence are added
 * and the target counts from sowing; a transplant DTM counts from the transplant date.
 */
export function degreeDayTargetFromDtm(input: DtmTargetInput): DtmTarget {
  const { daysToMaturity, countsFrom } = input;
  if (!Number.isInteger(daysToMaturity) || daysToMaturity < 1) {
    throw new RangeError(`daysToMaturity (${daysToMaturity}) must be a whole number ≥ 1`);
  }
  let days = daysToMaturity;
  if (countsFrom === 'emergence') {
    const e = input.daysToEmergence;
    if (e === undefined || !Number.isInteger(e) || e < 0) {
      throw new RangeError(`daysToEmergence (${String(e)}) must be a whole number ≥ 0 when days to maturity count from emergence`);
    }
    days += e;
  } else if (countsFrom !== 'sowing' && countsFrom !== 'transplant') {
    throw new RangeError(`countsFrom (${String(countsFrom)}) is unknown`);
  }
  const from = monthDay(input.window.from, 'window.from');
  const to = monthDay(input.window.to, 'window.to');
  const s = toDenseSeries(input.history);
  const dd = degreeDaysOf(s, input.method);
  const prefix = new Float64Array(s.length + 1);
  const missing = new Int32Array(s.length + 1);
  for (let i = 0; i < s.length; i++) {
    prefix[i + 1] = prefix[i] + dd[i];
    missing[i + 1] = missing[i] + (s.present[i] ? 0 : 1);
  }
  const samples: number[] = [];
  if (s.length) {
    const firstYear = dayNumberToCivil(s.first).year - 1;
    const lastYear = dayNumberToCivil(s.first + s.length - 1).year;
    const wraps = to.month * 100 + to.day < from.month * 100 + from.day;
    for (let y = firstYear; y <= lastYear; y++) {
      const fromDay = Math.min(from.day, from.month === 2 && !isLeapYear(y) ? 28 : 31);
      const start = civilToDayNumber({ year: y, month: from.month, day: fromDay }) - s.first;
      const endYear = wraps ? y + 1 : y;
      const toDay = Math.min(to.day, to.month === 2 && !isLeapYear(endYear) ? 28 : 31);
      const end = civilToDayNumber({ year: endYear, month: to.month, day: toDay }) - s.first;
      // The start day is day 0 (start-event.ts): a sample sums the `days` days after it.
      for (let a = Math.max(0, start); a <= end && a + 1 + days <= s.length; a++) {
        if (missing[a + 1 + days] - missing[a + 1] === 0) samples.push(prefix[a + 1 + days] - prefix[a + 1]);
      }
    }
  }
  if (samples.length === 0) throw new RangeError('history has no complete span of that length in the sowing window');
  const sorted = samples.sort((a, b) => a - b);
  return {
    target: median(sorted),
    countsFrom: countsFrom === 'transplant' ? 'transplant' : 'sowing',
    days,
    p10: nearestRank(sorted, 10)!,
    p90: nearestRank(sorted, 90)!,
    samples: sorted.length,
  };
}

export interface RecalibratedTarget {
  target: number;
  prior: number;
  records: number;
  observedMedian: number | null;
  rule: string;
}

/**
 * Our own rule (no source): the prior counts as `priorWeight` harvests (default 3) and the
 * median of the recorded degree days to harvest as one harvest per record:
 *   target = (priorWeight × prior + n × median) / (priorWeight + n).
 * The median resists one odd record; the weighting lets three records outvote the packet half-way.
 */
export function recalibrateTarget(prior: number, observedToHarvest: readonly number[], priorWeight = 3): RecalibratedTarget {
  if (!(prior > 0) || !Number.isFinite(prior)) throw new RangeError(`prior (${prior}) must be a positive number`);
  if (!(priorWeight >= 0) || !Number.isFinite(priorWeight)) throw new RangeError(`priorWeight (${priorWeight}) must be ≥ 0`);
  observedToHarvest.forEach((v, i) => {
    if (!Number.isFinite(v) || v <= 0) throw new RangeError(`observedToHarvest[${i}] (${v}) must be a positive number`);
  });
  const n = observedToHarvest.length;
  const rule = `(${priorWeight} × prior + n × median of records) / (${priorWeight} + n)`;
  if (n === 0 || priorWeight + n === 0) return { target: prior, prior, records: n, observedMedian: n ? median(observedToHarvest) : null, rule };
  const m = median(observedToHarvest);
  return { target: (priorWeight * prior + n * m) / (priorWeight + n), prior, records: n, observedMedian: m, rule };
}
