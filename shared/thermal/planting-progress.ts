/**
 * A planting's progress in heat: the engine's pieces put together for one planting — degree days
 * since its start event, the maturity window, bolt risk today and ahead, and stress in the
 * forecast. Pure: the server loads the inputs and caches the answer; °C and °C-days throughout,
 * with reasons worded in the garden's unit.
 */
import { addDays, daysBetween } from './dates';
import { accumulateDegreeDays } from './series';
import type { AccumulatedDay } from './series';
import { projectMaturity } from './projection';
import type { BandDay } from './projection';
import { assessBoltRisk } from './bolt-risk';
import type { BoltReason, BoltRiskLevel, BoltTriggers } from './bolt-risk';
import { stressEvents } from './stress';
import type { StressEvent, StressProfile } from './stress';
import { firstCountedDay } from './start-event';
import type { StartEvent } from './start-event';
import type { DailyTemp, DegreeDayMethod } from './types';
import type { TempUnit } from './units';
import { formatDegreeDays } from './units';

/** How far back a stress spell that reaches today may have begun. */
const STRESS_LOOKBACK_DAYS = 7;

export type ProgressStatus = 'planned' | 'growing' | 'harvested' | 'bolted' | 'failed';
export type MaturityKind = 'observed' | 'forecast' | 'analog' | 'recorded' | 'none';

export interface PlantingProgressInput {
  /** The garden's local date: days before it are recorded weather, from it on the forecast. */
  today: string;
  latitude: number;
  status: ProgressStatus;
  event: StartEvent;
  recorded: { firstHarvestOn: string | null; boltedOn: string | null };
  /** °C-days from the start event; null when none could be set. */
  target: number | null;
  /** Why there is no target, when there is none (shown instead of a window). */
  targetMissing?: string;
  method: DegreeDayMethod;
  /** The garden's series from the start event on: recorded days, then forecast days. */
  weather: readonly DailyTemp[];
  /** Past days of the garden for analog seasons. */
  history: readonly DailyTemp[];
  /** null: the crop does not bolt (or has no trigger). */
  boltTriggers: BoltTriggers | null;
  boltTolerance?: number;
  stressProfile: StressProfile | null;
  unit: TempUnit;
  /** How far past the last known day the projection band runs when the window has no end. */
  bandDaysWithoutWindow?: number;
}

export interface PlantingProgress {
  accumulated: number;
  percent: number | null;
  /** Recorded days, then forecast days, cumulative from the first counted day. */
  series: AccumulatedDay[];
  band: BandDay[];
  maturity: {
    p10: string | null;
    p50: string | null;
    p90: string | null;
    kind: MaturityKind;
    observedDays: number;
    forecastDays: number;
    analogYears: number;
    neverMatureShare: number;
    note: string;
  };
  bolt: {
    level: BoltRiskLevel | 'none';
    reasons: BoltReason[];
    highFrom: string | null;
    /** The reasons on the first high day, when it lies ahead. */
    highReasons: BoltReason[];
    /**
     * The first day of the spell of elevated-or-high risk that today is in, or else the next such
     * day in the forecast; null when none. A worsening spell keeps this date, so it names one alert.
     */
    riskFrom: string | null;
    days: { date: string; level: BoltRiskLevel; forecast: boolean }[];
  };
  stress: StressEvent[];
  missingDates: string[];
}

const noMaturity = (note: string): PlantingProgress['maturity'] => ({ p10: null, p50: null, p90: null, kind: 'none', observedDays: 0, forecastDays: 0, analogYears: 0, neverMatureShare: 0, note });

/** The last day whose weather counts: recorded ends stop the count, a growing planting runs through the forecast. */
function countEnd(input: PlantingProgressInput): string | null {
  const { status, recorded } = input;
  if (status === 'harvested') return recorded.firstHarvestOn;
  if (status === 'bolted') return recorded.firstHarvestOn && recorded.boltedOn && recorded.firstHarvestOn < recorded.boltedOn ? recorded.firstHarvestOn : recorded.boltedOn;
  return null;
}

/**
 * The day the count starts from: the start event; for a plan whose date has passed unsown, today
 * (it is projected as if sown now, never credited with heat it was not in the ground for).
 */
function countStart(input: PlantingProgressInput): string {
  return input.status === 'planned' && input.event.on < input.today ? input.today : input.event.on;
}

/**
 * The days that count: recorded days before today and forecast days from today on. A forecast
 * left behind for a past day (its observation never came) is a gap, not recorded heat.
 */
function countedDays(input: PlantingProgressInput, first: string, end: string | null): DailyTemp[] {
  const planned = input.status === 'planned';
  return input.weather.filter((d) => {
    if (d.date < first || (end !== null && d.date > end)) return false;
    if (d.source === 'forecast') return d.date >= input.today;
    return !planned && d.date < input.today;
  });
}

export function plantingProgress(input: PlantingProgressInput): PlantingProgress {
  const { today, target, method, unit } = input;
  const event = { ...input.event, on: countStart(input) };
  const first = firstCountedDay(event.on);
  const end = countEnd(input);
  const days = countedDays(input, first, end);
  const lastDay = end ?? days.at(-1)?.date ?? addDays(today, -1);
  const acc = daysBetween(first, lastDay) >= 0 ? accumulateDegreeDays(days, method, { start: first, end: lastDay }) : null;
  const series = acc?.days ?? [];
  const recordedDays = series.filter((d) => d.source !== 'forecast' && d.date < today);
  const accumulated = end !== null ? (acc?.total ?? 0) : (recordedDays.at(-1)?.cumulative ?? 0);
  const missingDates = (acc?.missingDates ?? []).filter((d) => d < today);
  const percent = target ? (accumulated / target) * 100 : null;
  const base = { accumulated, percent, series, missingDates };

  if (input.status === 'failed') return { ...base, band: [], maturity: noMaturity('This planting failed; nothing is projected for it.'), bolt: noBolt(), stress: [] };
  if (end !== null) return { ...base, band: [], maturity: recordedMaturity(input, accumulated), bolt: noBolt(), stress: [] };
  // Harvest has begun: the record answers "when", while bolting and stress still matter in the ground.
  const harvestStarted = input.recorded.firstHarvestOn && input.recorded.firstHarvestOn <= today ? input.recorded.firstHarvestOn : null;
  if (harvestStarted) {
    const atHarvest = series.filter((d) => d.date <= harvestStarted).at(-1)?.cumulative ?? 0;
    return { ...base, band: [], maturity: recordedMaturity(input, atHarvest), bolt: assessBolt(input, days), stress: stressAhead(input, days) };
  }
  if (!target) return { ...base, band: [], maturity: noMaturity(input.targetMissing ?? 'No degree-day target yet, so no window can be projected.'), bolt: assessBolt(input, days), stress: stressAhead(input, days) };

  const observed = days.filter((d) => d.source !== 'forecast');
  const forecast = days.filter((d) => d.source === 'forecast');
  const bandLength = input.bandDaysWithoutWindow ?? 120;
  const probe = projectMaturity({ start: event.on, target, method, observed, forecast, history: input.history, latitude: input.latitude });
  const bandThrough = probe.window.p90 ? addDays(probe.window.p90, 7) : addDays(probe.knownThrough ?? event.on, bandLength);
  const p = probe.maturedOn || probe.forecastMaturity || !probe.scenarios.length
    ? probe
    : projectMaturity({ start: event.on, target, method, observed, forecast, history: input.history, latitude: input.latitude, bandThrough });
  const knownRecorded = observed.filter((d) => d.date < today).length;
  const maturity = ((): PlantingProgress['maturity'] => {
    const counts = { observedDays: knownRecorded, forecastDays: forecast.length, analogYears: p.scenarios.length, neverMatureShare: p.neverMatureFraction };
    if (p.maturedOn) return { ...p.window, kind: 'observed', ...counts, note: `The target of ${formatDegreeDays(target, unit)} was reached in recorded weather.` };
    if (p.forecastMaturity) return { ...p.window, kind: 'forecast', ...counts, note: `The forecast reaches the target of ${formatDegreeDays(target, unit)}: a projection from the forecast, not a record.` };
    if (!p.hasHistory) return { ...noMaturity('This garden has no past weather yet, so there are no past seasons to continue the forecast with; the window appears once its history has arrived.'), ...counts };
    const skipped = p.skippedSeasons.length ? `; ${p.skippedSeasons.length} more left out for gaps in their weather` : '';
    const never = p.neverMatureFraction > 0 ? ` In ${Math.round(p.neverMatureFraction * 100)} % of them it does not reach the target within a year.` : '';
    return {
      ...p.window,
      kind: 'analog',
      ...counts,
      note: `${knownRecorded} recorded days and ${forecast.length} forecast days, then continued through ${p.scenarios.length} past seasons of this garden’s weather${skipped}.${never}`,
    };
  })();
  if (event.on !== input.event.on) maturity.note = `The planned date has passed without a sowing; projected as if started today. ${maturity.note}`;
  return { ...base, band: p.band, maturity, bolt: assessBolt(input, days), stress: stressAhead(input, days) };
}

function recordedMaturity(input: PlantingProgressInput, accumulated: number): PlantingProgress['maturity'] {
  const { firstHarvestOn, boltedOn } = input.recorded;
  const heat = formatDegreeDays(accumulated, input.unit);
  if (firstHarvestOn && !(boltedOn && boltedOn < firstHarvestOn)) {
    return { p10: firstHarvestOn, p50: firstHarvestOn, p90: firstHarvestOn, kind: 'recorded', observedDays: 0, forecastDays: 0, analogYears: 0, neverMatureShare: 0, note: `First harvest recorded after ${heat}.` };
  }
  return noMaturity(`Bolted before any harvest was recorded, after ${heat}.`);
}

function noBolt(): PlantingProgress['bolt'] {
  return { level: 'none', reasons: [], highFrom: null, highReasons: [], riskFrom: null, days: [] };
}

function assessBolt(input: PlantingProgressInput, days: readonly DailyTemp[]): PlantingProgress['bolt'] {
  if (!input.boltTriggers || input.status !== 'growing' || !days.length) return noBolt();
  const a = assessBoltRisk({
    start: firstCountedDay(input.event.on),
    days,
    latitude: input.latitude,
    triggers: input.boltTriggers,
    method: input.method,
    target: input.target ?? undefined,
    boltTolerance: input.boltTolerance,
    unit: input.unit,
  });
  const upToToday = a.days.filter((d) => d.date <= input.today);
  const now = upToToday.at(-1) ?? a.days[0];
  const high = a.days.find((d) => d.date >= input.today && d.level === 'high');
  const risky = (d: { level: BoltRiskLevel }) => d.level !== 'low';
  let k = now && risky(now) ? a.days.indexOf(now) : -1;
  while (k > 0 && risky(a.days[k - 1])) k--;
  const riskFrom = k >= 0 ? a.days[k].date : (a.days.find((d) => d.date > input.today && risky(d))?.date ?? null);
  return {
    riskFrom,
    level: now?.level ?? 'low',
    reasons: now?.reasons ?? [],
    highFrom: high?.date ?? null,
    highReasons: high && high.date > (now?.date ?? '') ? high.reasons : [],
    days: a.days.map((d) => ({ date: d.date, level: d.level, forecast: d.forecast })),
  };
}

function stressAhead(input: PlantingProgressInput, days: readonly DailyTemp[]): StressEvent[] {
  if (!input.stressProfile || input.status !== 'growing') return [];
  // A spell already under way keeps its real first day (and its nights so far count), so it stays one event.
  const events = stressEvents(days.filter((d) => d.date >= addDays(input.today, -STRESS_LOOKBACK_DAYS)), input.stressProfile, undefined, input.unit);
  return events.filter((e) => e.end >= input.today);
}
