/**
 * The sowing plan of one variety at a garden: every seventh day of the planned season tried as a
 * start day against the garden's past years (the engine's sowing sweep), each judged by the frost
 * rules at the chosen risk and by bolt risk in its harvest window. The inputs are the same ones a
 * planting's progress uses (progress-loader.ts: the garden's weather, varietyTarget, cropMethod,
 * cropBoltTriggers): one rule, one place. The prepared climatology (≈27 ms) is kept per weather
 * cell and inputs in a small LRU, so a plan at another risk or for another variety of the same
 * crop only runs the sweep (≈1 ms). The garden's loaded weather (≈30 years of days, 45–110 ms to
 * read and merge) is kept too, per garden, keyed by the garden's progress epoch (every weather
 * write — station import, refresh, backfill, gap fill, a new location — moves it in the write's
 * own transaction, weather-events.ts; record changes move it too), its weather cell, time zone and
 * local day. The epoch is read before the days are, so a plan never uses days older than a change
 * committed before it began; a new variety or bed (which only move the read cache's revision) does
 * not reload 30 years of days.
 */
import { addDays, daysBetween, isLeapYear } from '#shared/thermal/dates';
import { frostDatesOfSeries } from '#shared/thermal/frost-dates';
import type { FrostDates, FrostWindow } from '#shared/thermal/frost-dates';
import { seasonOf, seasonOfYear } from '#shared/thermal/season';
import type { Season } from '#shared/thermal/season';
import { prepareSowingSweep, sowingWindowSweep } from '#shared/thermal/sowing-sweep';
import type { SowingCandidate, SweepClimatology } from '#shared/thermal/sowing-sweep';
import type { DailyTemp } from '#shared/thermal/types';
import type { HardinessClass } from '#shared/thermal/stress';
import type { FrostRisk } from '#shared/schemas/plan';
import { Garden, Variety } from '../../db/models';
import { AppError } from '../../errors';
import type { WeatherService } from '../weather/weather.service';
import { effectiveValues, getCrop } from '../crops/crops.service';
import { cropBoltTriggers, cropMethod } from '../crops/crop-thermal';
import { varietyTarget } from '../varieties/variety-target';
import { loadGardenWeather } from '../progress/progress-loader';
import type { GardenWeather } from '../progress/progress-loader';
import { ProgressRepository } from '../progress/progress.repository';
import { localDate } from '../../lib/local-date';

/** Start days tried: one a week (common practice, no source). */
export const CANDIDATE_STEP_DAYS = 7;

/** A start day is recommended when fewer than half of the past years had high bolt risk at harvest (common practice, no source). */
export const BOLT_SHARE_LIMIT = 0.5;

/**
 * Earliest start against the last spring frost by planting hardiness class: Purdue HO-203 (from
 * Illinois VC-14) classes; the week offsets are from memory (very hardy 4–6 weeks before the
 * frost-free date, frost tolerant 2–3 weeks before, tender on it, warm-loving a week or more after).
 */
export const HARDINESS_START_OFFSET_DAYS: Record<HardinessClass, number> = {
  'very-hardy': -42,
  'frost-tolerant': -21,
  tender: 1,
  'warm-loving': 7,
};

export const FROST_TENDER: ReadonlySet<HardinessClass> = new Set(['tender', 'warm-loving']);

export type FailKind = 'data' | 'early' | 'autumn' | 'bolt';

export interface JudgedCandidate {
  sowOn: string;
  sweep: SowingCandidate;
  frostOk: boolean;
  /** First rule it fails, or null when recommended. */
  fail: FailKind | null;
  /** Sown after the season's first autumn frost at this risk (counted as not ready). */
  afterFrost: boolean;
}

export interface PlanComputation {
  garden: Garden;
  variety: Variety;
  cropName: string;
  hardiness: HardinessClass;
  tender: boolean;
  startKind: 'sowing' | 'transplant';
  season: Season;
  frostRisk: FrostRisk;
  frost: { lastSpring: string | null; firstFall: string | null; seasons: number };
  /** Earliest start day allowed by the hardiness rule, null when past springs had no frost to set it. */
  earliestStart: string | null;
  candidates: JudgedCandidate[];
  /** Why there is no plan at all (no location, no target), else null. */
  missing: string | null;
}

interface Prepared {
  clim: SweepClimatology;
  frost: FrostDates;
}

/** Prepared climatologies, least recently used first. */
const PREPARED = new Map<string, Prepared>();
const PREPARED_MAX = 32;
export const preparedStats = { hits: 0, misses: 0 };

/** Loaded weather per weather service (tests build many apps), one entry per garden, least recently used first. */
const LOADED = new WeakMap<WeatherService, Map<number, { key: string; weather: Promise<GardenWeather> }>>();
const LOADED_MAX = 16;
export const loadedWeatherStats = { hits: 0, misses: 0 };

/**
 * The garden's weather as loadGardenWeather reads it, from memory while the garden's progress
 * epoch, weather cell, time zone and local day are those it was read at; concurrent requests
 * share one read.
 */
async function gardenWeather(weather: WeatherService, garden: Garden): Promise<GardenWeather> {
  const epoch = await new ProgressRepository(Garden.sequelize!).epoch(garden.id);
  let held = LOADED.get(weather);
  if (!held) LOADED.set(weather, (held = new Map<number, { key: string; weather: Promise<GardenWeather> }>()));
  const key = [epoch, garden.weatherCellId, garden.timeZone, localDate(garden.timeZone, weather.now())].join('|');
  const found = held.get(garden.id);
  held.delete(garden.id);
  if (found?.key === key) {
    held.set(garden.id, found);
    loadedWeatherStats.hits++;
    return found.weather;
  }
  loadedWeatherStats.misses++;
  const entry = { key, weather: loadGardenWeather(weather, garden) };
  held.set(garden.id, entry);
  for (const id of held.keys()) {
    if (held.size <= LOADED_MAX) break;
    held.delete(id);
  }
  // A failed read is not kept: the next request reads again.
  entry.weather.catch(() => held.get(garden.id) === entry && held.delete(garden.id));
  return entry.weather;
}

/** Fingerprints of loaded histories: the same kept history is not walked again for every plan. */
const FINGERPRINTS = new WeakMap<readonly DailyTemp[], string>();

/** A cheap fingerprint of the days themselves: a garden's own station days or a refill change it. */
function fingerprint(history: readonly DailyTemp[]): string {
  let known = FINGERPRINTS.get(history);
  if (known === undefined) FINGERPRINTS.set(history, (known = fingerprintOf(history)));
  return known;
}

function fingerprintOf(history: readonly DailyTemp[]): string {
  let h = 0x811c9dc5;
  for (const d of history) {
    h = Math.imul(h ^ Math.round(d.tmax * 100), 0x01000193);
    h = Math.imul(h ^ Math.round(d.tmin * 100), 0x01000193);
  }
  return `${history.length}:${history[0]?.date}:${history.at(-1)?.date}:${(h >>> 0).toString(36)}`;
}

function prepared(key: string, make: () => Prepared): Prepared {
  const found = PREPARED.get(key);
  if (found) {
    PREPARED.delete(key);
    PREPARED.set(key, found);
    preparedStats.hits++;
    return found;
  }
  preparedStats.misses++;
  const made = make();
  PREPARED.set(key, made);
  for (const k of PREPARED.keys()) {
    if (PREPARED.size <= PREPARED_MAX) break;
    PREPARED.delete(k);
  }
  return made;
}

/** The season planned: the one holding today while at most half of it is past, else the next one. */
export function plannedSeason(today: string, latitude: number): Season {
  const current = seasonOf(today, latitude);
  return daysBetween(current.start, today) > 182 ? seasonOfYear(current.startYear + 1, latitude) : current;
}

/** A month-day ('MM-DD') as the day it falls on within the season. */
function inSeason(monthDay: string, season: Season): string {
  const startMonth = Number(season.start.slice(5, 7));
  const month = Number(monthDay.slice(0, 2));
  const year = month >= startMonth ? season.startYear : season.startYear + 1;
  const md = monthDay === '02-29' && !isLeapYear(year) ? '02-28' : monthDay;
  return `${year}-${md}`;
}

/**
 * The frost dates at a risk: a last spring frost that 10 % of past seasons still passed (risk 10)
 * is the late p90 date; a first autumn frost that 10 % of seasons had already had is the early p10.
 */
function frostAt(window: FrostWindow, percentile: 10 | 50 | 90, season: Season): string | null {
  const q = window[`p${percentile}`];
  return q ? inSeason(q.monthDay, season) : null;
}

export async function computePlan(weather: WeatherService, gardenId: number, input: { varietyId: number; frostRisk: FrostRisk }): Promise<PlanComputation> {
  const garden = await Garden.findByPk(gardenId);
  if (!garden) throw AppError.notFound('That garden');
  const variety = await Variety.findOne({ where: { id: input.varietyId, gardenId } });
  if (!variety) throw new AppError(400, 'validation_failed', 'Please check the fields: varietyId.', { varietyId: 'Choose a variety of this garden.' });
  const crop = await getCrop(gardenId, variety.cropKey);
  const effective = effectiveValues(crop);
  const hardiness = effective.hardiness as HardinessClass;
  const startKind = variety.dtmFrom === 'transplant' ? 'transplant' : 'sowing';
  const risk = Number(input.frostRisk) as 10 | 50 | 90;
  const w = await gardenWeather(weather, garden);
  const latitude = garden.latitude;
  const season = plannedSeason(w.today, latitude ?? 0);
  const base: PlanComputation = {
    garden,
    variety,
    cropName: crop.crop.name,
    hardiness,
    tender: FROST_TENDER.has(hardiness),
    startKind,
    season,
    frostRisk: input.frostRisk,
    frost: { lastSpring: null, firstFall: null, seasons: 0 },
    earliestStart: null,
    candidates: [],
    missing: null,
  };
  if (latitude === null) return { ...base, missing: 'The garden has no location yet, so it has no past weather to plan from.' };
  if (!w.history.length) return { ...base, missing: 'The garden has no past weather yet to plan from.' };
  const target = await varietyTarget(garden, variety, effective, () => Promise.resolve(w.history));
  if (target.valueC === null) return { ...base, missing: target.explanation };

  const method = cropMethod(effective);
  const bolt = cropBoltTriggers(variety.cropKey, effective, crop.overrides, garden.units);
  const triggers = bolt && Object.keys(bolt.triggers).length ? bolt.triggers : undefined;
  const tolerance = variety.boltTolerance ?? undefined;
  const key = [garden.weatherCellId ?? `g${garden.id}`, fingerprint(w.history), latitude, JSON.stringify(method), JSON.stringify(triggers ?? null), tolerance].join('|');
  const { clim, frost } = prepared(key, () => {
    const c = prepareSowingSweep({ history: w.history, latitude, method, triggers, boltTolerance: tolerance });
    return { clim: c, frost: frostDatesOfSeries(c.series, latitude) };
  });

  // Frost dates come from complete half-seasons only (frost-dates.ts), so a season with missing
  // autumn days never stands in for the next one's frost.
  const lastSpring = frostAt(frost.lastSpring, (100 - risk) as 10 | 50 | 90, season);
  const firstFall = frostAt(frost.firstFall, risk, season);
  const earliestStart = lastSpring ? addDays(lastSpring, HARDINESS_START_OFFSET_DAYS[hardiness] ?? 0) : null;
  const sweep = sowingWindowSweep(clim, {
    from: season.start,
    to: season.end,
    target: target.valueC,
    ...(firstFall ? { cutoff: { monthDay: firstFall.slice(5) } } : {}),
  });
  const candidates: JudgedCandidate[] = [];
  for (let k = 0; k < sweep.candidates.length; k += CANDIDATE_STEP_DAYS) {
    const c = sweep.candidates[k];
    const afterFrost = firstFall !== null && c.sowDate >= firstFall;
    const early = earliestStart !== null && c.sowDate < earliestStart;
    const autumn = afterFrost || c.missCutoffShare >= 0.5;
    const frostOk = !early && !autumn;
    const noData = c.analogYears === 0 || c.maturity.p50 === null;
    const fail: FailKind | null = noData ? 'data' : early ? 'early' : autumn ? 'autumn' : c.highBoltShare >= BOLT_SHARE_LIMIT ? 'bolt' : null;
    candidates.push({ sowOn: c.sowDate, sweep: c, frostOk, fail, afterFrost });
  }
  return {
    ...base,
    frost: { lastSpring, firstFall, seasons: Math.max(frost.lastSpring.seasons, frost.firstFall.seasons) },
    earliestStart,
    candidates,
  };
}
