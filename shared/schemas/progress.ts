/**
 * Progress of a planting in heat, as the API answers it. Every temperature and degree-day figure
 * is in the garden's display unit (`unit`): °F and °F-days, or °C and °C-days — never mixed.
 * Calendar dates are 'YYYY-MM-DD' strings in the garden's own calendar.
 */
import type { AttentionDto } from '../plantings/attention';
import type { DisplayUnit } from './gardens';
import type { PlantingStatus } from './plantings';

export type BoltLevel = 'low' | 'elevated' | 'high';
/** 'none': the crop does not bolt within its garden season (e.g. peas), or has no bolt trigger. */
export type BoltLevelOrNone = BoltLevel | 'none';

export type StartEventKind = 'sowing' | 'transplant' | 'planned-sowing' | 'planned-transplant';

export interface StartEventDto {
  kind: StartEventKind;
  on: string;
}

/** Where the degree-day target comes from. */
export type TargetBasis = 'packet' | 'calibrated' | 'grower';

/**
 * How a maturity window was made: 'observed' (the target is already reached in recorded weather),
 * 'forecast' (reached within the forecast), 'analog' (continued through N past years of this garden),
 * 'recorded' (a harvest is on record), 'none' (cannot be projected; `note` says why).
 */
export type MaturityBasisKind = 'observed' | 'forecast' | 'analog' | 'recorded' | 'none';

export interface MaturityDto {
  p10: string | null;
  p50: string | null;
  p90: string | null;
  basis: {
    kind: MaturityBasisKind;
    /** Days of recorded weather used since the start event. */
    observedDays: number;
    /** Forecast days used. */
    forecastDays: number;
    /** Past seasons used as analogs. */
    analogYears: number;
    /** Share of analog seasons that do not reach the target within a year (0…1). */
    neverMatureShare: number;
    /** A plain sentence: how the window was made, or why there is none. */
    note: string;
  };
}

export interface BoltReasonDto {
  trigger: 'heat' | 'day-length' | 'vernalization' | 'maturity' | 'tolerance';
  message: string;
  forecast: boolean;
}

export interface BoltRiskDto {
  level: BoltLevelOrNone;
  /** Why there is no level ('none'), or what is left out of it; null when nothing needs saying. */
  note: string | null;
  reasons: BoltReasonDto[];
  /** The first day (today or later, forecast included) whose level is high; null if none. */
  highFrom: string | null;
  /** Level per day from the start event through the last forecast day, for the chart's strip. */
  days: { date: string; level: BoltLevel; forecast: boolean }[];
}

export interface StressDto {
  kind: 'frost' | 'chilling' | 'blossom-drop' | 'pollination-heat';
  severity: 'possible' | 'light' | 'moderate' | 'severe' | 'watch' | 'warning';
  start: string;
  end: string;
  days: number;
  forecast: boolean;
  /** In the garden's unit. */
  lowestMin: number | null;
  highestMax: number | null;
  threshold: number;
  message: string;
}

export interface ProgressSeriesDay {
  date: string;
  tmax: number;
  tmin: number;
  /** Degree days of the day and since the start event, in °F-days or °C-days (`unit`). */
  dd: number;
  cumulative: number;
  source: 'observed' | 'forecast' | 'imported' | 'filled';
}

export interface ProgressProjectionDay {
  date: string;
  /** Cumulative degree days across analog scenarios on that date (10th, 50th, 90th percentile). */
  p10: number;
  p50: number;
  p90: number;
}

export interface ProgressDto {
  plantingId: number;
  status: PlantingStatus;
  /** 'F' → temperatures in °F and degree days in °F-days; 'C' → °C and °C-days. */
  unit: DisplayUnit;
  method: string;
  base: number;
  upper: number | null;
  cutoff: string;
  /** Degree days to maturity from the start event; null when none can be set (no packet days, no history). */
  target: number | null;
  targetBasis: TargetBasis | null;
  /** A sentence on where the target comes from. */
  targetNote: string;
  accumulated: number;
  /** 0…100+ (past 100 once the target is passed); null without a target. */
  percent: number | null;
  startEvent: StartEventDto | null;
  /** The packet's calendar date (start event + days to maturity), beside the degree-day window. */
  packetDate: string | null;
  maturity: MaturityDto;
  boltRisk: BoltRiskDto;
  stress: StressDto[];
  series: ProgressSeriesDay[];
  projection: ProgressProjectionDay[];
  /** The garden's today, the day the figures were computed for. */
  today: string;
  /** Dates since the start event without any temperature (the gap is reported, never bridged). */
  missingDates: string[];
  /** Recorded events, for the chart. */
  recorded: { firstHarvestOn: string | null; boltedOn: string | null };
  /** One plain sentence with units, e.g. "412 of 950 °F-days (43 %); likely ready 14–22 June; …". */
  summary: string;
}

/** One planting's row on Today and in the Plantings list. */
export interface ProgressSummaryDto {
  plantingId: number;
  /** The unit of `accumulated` and `target` (°F-days or °C-days). */
  unit: DisplayUnit;
  accumulated: number;
  target: number | null;
  percent: number | null;
  maturity: { p10: string | null; p50: string | null; p90: string | null; kind: MaturityBasisKind };
  boltLevel: BoltLevelOrNone;
  boltHighFrom: string | null;
  /** The first reason's words, for a one-line row. */
  boltReason: string | null;
  /** First day of the current (or next) spell of elevated-or-high risk; its reasons, worst day first. */
  boltRiskFrom: string | null;
  boltReasons: string[];
  stress: { kind: StressDto['kind']; severity: StressDto['severity']; start: string; end: string; message: string }[];
  summary: string;
}

export type TodayActionKind = 'bolt-high' | 'bolt-elevated' | 'stress' | 'window-open' | 'data-gap';

/** An open alert as Today lists it (alerts are the one source of "needs attention"). */
export interface TodayActionDto {
  kind: TodayActionKind;
  alertId: number;
  /** Plain words for a careful worker where the job can hurt (heat, frost heaters); null otherwise. */
  caution: string | null;
  /** Which stress, for 'stress' actions. */
  stressKind?: 'frost' | 'heat' | 'chilling';
  /** null for a garden-wide action. */
  plantingId: number | null;
  /** Every planting the action concerns; empty for a garden-wide one (a weather data gap). */
  plantingIds: number[];
  title: string;
  /** What the grower could do, in plain words (with the usual caution where it applies). */
  advice: string;
  /** The figures behind it, with units. */
  detail: string;
  date: string | null;
}

export interface TodayPlantingDto {
  plantingId: number;
  crop: { key: string; name: string; season: 'cool' | 'warm' };
  variety: { id: number; name: string };
  bed: { id: number; name: string };
  status: PlantingStatus;
  progress: ProgressSummaryDto;
  attention: AttentionDto;
}

export interface TodayWeatherDay {
  date: string;
  tmax: number;
  tmin: number;
  source: 'observed' | 'forecast' | 'imported' | 'filled';
}

/** How many actions and growing plantings Today lists; the rest are a link away. */
export const TODAY_LIMIT = 30;

/** GET /api/gardens/:gardenId/today */
export interface TodayDto {
  today: string;
  unit: DisplayUnit;
  /** The most pressing open alerts, at most TODAY_LIMIT; `actionsTotal` counts them all. */
  actions: TodayActionDto[];
  actionsTotal: number;
  /** The growing plantings that need the grower soonest (bolt risk, then readiness), at most TODAY_LIMIT. */
  plantings: TodayPlantingDto[];
  /** Every growing planting, shown or not. */
  growingTotal: number;
  /** The last 7 and next 7 days (missing days are absent). */
  weather: TodayWeatherDay[];
}
