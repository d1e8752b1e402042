/**
 * Bolt risk for cool-season crops — Heatclock's own heuristic, not a published model.
 *
 * Each day gets points from the crop's editable triggers (SCIENCE §3 grades the figures):
 *   heat          highs strictly above heatThresholdC: a streak of ≥ heatStreakDays days in a row
 *                 scores `heatStreak` (2); a shorter run of hot days scores `heatDay` (1).
 *                 Forecast days count and are marked as forecast in the reason.
 *   day length    CBM day length at the garden latitude (+ an optional twilight allowance for the
 *                 effective photoperiod) at or above criticalPhotoperiodH scores `photoperiod` (2);
 *                 within `photoperiodNearH` (0.5 h) below it scores `photoperiodNear` (1).
 *   vernalization biennials only, and only after the juvenile phase (juvenileGdd degree days since
 *                 the start event): days whose mean lies in [minC, maxC] are counted (not
 *                 necessarily in a row); ≥ requiredDays scores `vernalized` (2), ≥ half scores 1.
 *   maturity      a plant past `nearMaturityFraction` (0.75) of its degree-day target scores
 *                 `nearMaturity` (1): a full-grown plant bolts more readily when triggered.
 * The sum is multiplied by the variety's bolt-tolerance factor (rating 1 = bolts readily … 5 =
 * very slow to bolt: ×1.5, ×1.25, ×1, ×0.75, ×0.5), then read as high at ≥ `highAt` (4),
 * elevated at ≥ `elevatedAt` (2), else low. So a heat streak alone is elevated, a heat streak
 * under long days is high, and a slow-bolting variety needs a third trigger to reach high.
 * Every weight is in BoltScoring and can be overridden; the figures are our choice (common
 * practice, no source) and every level carries its reasons.
 */
import { dayOfYearOfDayNumber, fromDayNumber, toDayNumber } from './dates';
import { dayLengthHours } from './day-length';
import { validateMethod } from './degree-days';
import { degreeDaysAt, toDenseSeries } from './series';
import type { DailyTemp, DegreeDayMethod } from './types';
import { formatDegreeDays, formatTemp } from './units';
import type { TempUnit } from './units';

export type BoltRiskLevel = 'low' | 'elevated' | 'high';

export interface VernalizationTrigger {
  /** Daily mean range (°C) that counts as vernalizing cold. */
  minC: number;
  maxC: number;
  requiredDays: number;
  /** Degree days (crop method, °C-days) since the start event before cold counts. */
  juvenileGdd: number;
}

export interface BoltTriggers {
  heatThresholdC?: number;
  /** Days in a row above heatThresholdC that make a streak (default 3, common practice, no source). */
  heatStreakDays?: number;
  criticalPhotoperiodH?: number;
  /** Added to sunrise-to-sunset day length: effective photoperiod is ≈0.5–1 h longer (from memory). */
  twilightAllowanceH?: number;
  vernalization?: VernalizationTrigger;
  nearMaturityFraction?: number;
}

export interface BoltScoring {
  heatStreak: number;
  heatDay: number;
  photoperiod: number;
  photoperiodNear: number;
  photoperiodNearH: number;
  vernalized: number;
  vernalizing: number;
  nearMaturity: number;
  elevatedAt: number;
  highAt: number;
  /** Multipliers for tolerance ratings 1…5. */
  toleranceFactors: readonly [number, number, number, number, number];
}

export const DEFAULT_BOLT_SCORING: BoltScoring = {
  heatStreak: 2,
  heatDay: 1,
  photoperiod: 2,
  photoperiodNear: 1,
  photoperiodNearH: 0.5,
  vernalized: 2,
  vernalizing: 1,
  nearMaturity: 1,
  elevatedAt: 2,
  highAt: 4,
  toleranceFactors: [1.5, 1.25, 1, 0.75, 0.5],
};

export type BoltTrigger = 'heat' | 'day-length' | 'vernalization' | 'maturity' | 'tolerance';

export interface BoltReason {
  trigger: BoltTrigger;
  points: number;
  message: string;
  /** True when a forecast day contributed. */
  forecast: boolean;
}

export interface BoltRiskDay {
  date: string;
  level: BoltRiskLevel;
  score: number;
  forecast: boolean;
  reasons: BoltReason[];
}

export interface BoltRiskInput {
  /** First day judged and counted: for a planting, firstCountedDay(start event) (start-event.ts). */
  start: string;
  /** Observed then forecast days from start on (source 'forecast' marks forecast days). */
  days: readonly DailyTemp[];
  latitude: number;
  triggers: BoltTriggers;
  method: DegreeDayMethod;
  /** Degree-day target to maturity, for closeness; closeness is ignored without it. */
  target?: number;
  /** 1 (bolts readily) … 5 (very slow to bolt); 3 when unknown. */
  boltTolerance?: number;
  scoring?: Partial<BoltScoring>;
  /** Unit of the temperatures and degree days in the reasons' words (computation stays °C). */
  unit?: TempUnit;
}

export interface BoltRiskAssessment {
  days: BoltRiskDay[];
  /** Dates with no temperature: they break a heat streak and add no degree days. */
  missingDates: string[];
}

/** The state of one day that the score depends on. */
export interface BoltDayState {
  tmax: number;
  /** Hot days in a row ending today, and how many of them are forecast. */
  heatRun: number;
  heatRunForecast: number;
  dayLengthH: number;
  /** Vernalizing days counted so far; null while still juvenile or without the trigger. */
  coldDays: number | null;
  /** Share of the degree-day target reached; null without a target. */
  maturityFraction: number | null;
  forecast: boolean;
}

const fmt = (x: number) => String(Number(x.toFixed(1)));

function toleranceFactor(scoring: BoltScoring, tolerance: number): number {
  if (!Number.isInteger(tolerance) || tolerance < 1 || tolerance > 5) {
    throw new RangeError(`boltTolerance (${tolerance}) must be an integer 1…5`);
  }
  return scoring.toleranceFactors[tolerance - 1];
}

/** Points, level and (when `explain`) reasons for one day. */
export function scoreBoltDay(
  s: BoltDayState,
  triggers: BoltTriggers,
  scoring: BoltScoring,
  tolerance: number,
  explain: boolean,
  unit: TempUnit = 'C',
): { score: number; level: BoltRiskLevel; reasons: BoltReason[] } {
  const reasons: BoltReason[] = [];
  let raw = 0;
  const add = (trigger: BoltTrigger, points: number, forecast: boolean, message: () => string) => {
    raw += points;
    if (explain) reasons.push({ trigger, points, forecast, message: message() });
  };
  const streakDays = triggers.heatStreakDays ?? 3;
  if (triggers.heatThresholdC !== undefined && s.heatRun > 0) {
    const fc = s.heatRunForecast > 0;
    const note = fc ? ` (${s.heatRunForecast} of them forecast)` : '';
    if (s.heatRun >= streakDays) {
      add('heat', scoring.heatStreak, fc, () => `${s.heatRun} days in a row with highs above ${formatTemp(triggers.heatThresholdC!, unit)}${note}`);
    } else {
      add('heat', scoring.heatDay, fc, () => `${s.heatRun} of ${streakDays} days in a row with highs above ${formatTemp(triggers.heatThresholdC!, unit)} so far${note} (a high of ${formatTemp(s.tmax, unit)} that day)`);
    }
  }
  if (triggers.criticalPhotoperiodH !== undefined) {
    const allowance = triggers.twilightAllowanceH ?? 0;
    const eff = s.dayLengthH + allowance;
    const what = allowance ? `effective day length ${fmt(eff)} h (${fmt(s.dayLengthH)} h + ${fmt(allowance)} h twilight)` : `day length ${fmt(eff)} h`;
    const crit = triggers.criticalPhotoperiodH;
    if (eff >= crit) {
      add('day-length', scoring.photoperiod, false, () => `${what} is ${eff > crit ? 'above' : 'at'} the critical ${fmt(crit)} h`);
    } else if (eff >= crit - scoring.photoperiodNearH) {
      add('day-length', scoring.photoperiodNear, false, () => `${what} is within ${fmt(scoring.photoperiodNearH)} h of the critical ${fmt(crit)} h`);
    }
  }
  const v = triggers.vernalization;
  if (v && s.coldDays !== null && s.coldDays > 0) {
    const msg = () => `${s.coldDays} days with a mean between ${formatTemp(v.minC, unit)} and ${formatTemp(v.maxC, unit)} after the juvenile phase (${formatDegreeDays(v.juvenileGdd, unit)}); ${v.requiredDays} needed`;
    if (s.coldDays >= v.requiredDays) add('vernalization', scoring.vernalized, s.forecast, msg);
    else if (s.coldDays >= v.requiredDays / 2) add('vernalization', scoring.vernalizing, s.forecast, msg);
  }
  const near = triggers.nearMaturityFraction ?? 0.75;
  if (s.maturityFraction !== null && s.maturityFraction >= near && raw > 0) {
    add('maturity', scoring.nearMaturity, false, () => `${Math.round(s.maturityFraction! * 100)} % of the degree-day target reached (from ${Math.round(near * 100)} % a triggered plant bolts more readily)`);
  }
  const factor = toleranceFactor(scoring, tolerance);
  const score = raw * factor;
  if (explain && factor !== 1 && raw > 0) {
    const kind = factor < 1 ? 'slow-bolting' : 'quick-bolting';
    reasons.push({ trigger: 'tolerance', points: score - raw, forecast: false, message: `${kind} variety (bolt tolerance ${tolerance} of 5) scales the score ${fmt(raw)} by ${factor}` });
  }
  const level: BoltRiskLevel = score >= scoring.highAt ? 'high' : score >= scoring.elevatedAt ? 'elevated' : 'low';
  return { score, level, reasons };
}

/** Daily bolt-risk level with reasons from the start event through the last given day. */
export function assessBoltRisk(input: BoltRiskInput): BoltRiskAssessment {
  const scoring = { ...DEFAULT_BOLT_SCORING, ...input.scoring };
  const tolerance = input.boltTolerance ?? 3;
  toleranceFactor(scoring, tolerance);
  const { triggers, method, target } = input;
  validateMethod(method);
  const s = toDenseSeries(input.days);
  const startN = toDayNumber(input.start, 'start');
  const endN = s.first + s.length - 1;
  const out: BoltRiskDay[] = [];
  const missingDates: string[] = [];
  let gdd = 0;
  let heatRun = 0;
  let heatRunForecast = 0;
  let coldDays = 0;
  for (let n = startN; n <= endN; n++) {
    const i = n - s.first;
    if (i < 0 || !s.present[i]) {
      missingDates.push(fromDayNumber(n));
      heatRun = 0;
      heatRunForecast = 0;
      continue;
    }
    const forecast = s.source[i] === 'forecast';
    const tmax = s.tmax[i];
    const juvenile = gdd < (triggers.vernalization?.juvenileGdd ?? Infinity);
    gdd += degreeDaysAt(s, i, method);
    const hot = triggers.heatThresholdC !== undefined && tmax > triggers.heatThresholdC;
    heatRun = hot ? heatRun + 1 : 0;
    heatRunForecast = hot ? heatRunForecast + (forecast ? 1 : 0) : 0;
    const v = triggers.vernalization;
    const mean = (tmax + s.tmin[i]) / 2;
    if (v && !juvenile && mean >= v.minC && mean <= v.maxC) coldDays++;
    const state: BoltDayState = {
      tmax,
      heatRun,
      heatRunForecast,
      dayLengthH: dayLengthHours(input.latitude, dayOfYearOfDayNumber(n)),
      coldDays: v && !juvenile ? coldDays : null,
      maturityFraction: target ? gdd / target : null,
      forecast,
    };
    const r = scoreBoltDay(state, triggers, scoring, tolerance, true, input.unit);
    out.push({ date: fromDayNumber(n), forecast, ...r });
  }
  return { days: out, missingDates };
}

/** The first day whose projected level is high, with its reasons; null if none. */
export function firstHighBoltRiskDate(input: BoltRiskInput): BoltRiskDay | null {
  return assessBoltRisk(input).days.find((d) => d.level === 'high') ?? null;
}
