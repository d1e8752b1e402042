/**
 * Loads what a garden's plantings' progress is computed from — the garden, its plantings with
 * their varieties, the crops as this garden has them, and its weather (one read) — and runs the
 * engine for each planting. The caller stores the answers (progress.service.ts).
 */
import { Op } from 'sequelize';
import { addDays } from '#shared/thermal/dates';
import { plantingProgress } from '#shared/thermal/planting-progress';
import { startEvent } from '#shared/thermal/start-event';
import { prepareSowingSweep, sowingWindowSweep } from '#shared/thermal/sowing-sweep';
import type { DailyTemp } from '#shared/thermal/types';
import { Bed, Garden, Planting, Variety } from '../../db/models';
import { AppError } from '../../errors';
import { localDate } from '../../lib/local-date';
import type { WeatherService } from '../weather/weather.service';
import { effectiveValues, getCrop, listCrops } from '../crops/crops.service';
import type { CropWithOverrides } from '../crops/crops.service';
import { cropBoltTriggers, cropMethod, cropStressProfile } from '../crops/crop-thermal';
import { varietyTarget } from '../varieties/variety-target';
import type { Computed } from './progress.presenter';

/** How far the stored forecast reaches (the service's forecast days). */
const FORECAST_DAYS = 16;

export interface GardenWeather {
  today: string;
  /** Recorded days then forecast days, oldest first. */
  all: DailyTemp[];
  /** Recorded days before today: the analog seasons and the climatology of targets. */
  history: DailyTemp[];
}

export async function loadGardenWeather(weather: WeatherService, garden: Garden): Promise<GardenWeather> {
  const today = localDate(garden.timeZone, weather.now());
  const all = (await weather.gardenSeries(garden, '1900-01-01', addDays(today, FORECAST_DAYS))).map(({ date, tmax, tmin, source }) => ({ date, tmax, tmin, source }));
  const history = all.filter((d) => d.source !== 'forecast' && d.date < today);
  return { today, all, history };
}

export interface GardenComputation {
  garden: Garden;
  today: string;
  results: Computed[];
}

/** Progress of the given plantings (all of the garden's when none are named). */
export async function computeGardenProgress(weather: WeatherService, gardenId: number, plantingIds?: number[]): Promise<GardenComputation> {
  const garden = await Garden.findByPk(gardenId);
  if (!garden) throw AppError.notFound('That garden');
  const plantings = await Planting.findAll({
    where: plantingIds ? { gardenId, id: { [Op.in]: plantingIds } } : { gardenId },
    include: [
      { model: Variety, as: 'variety', required: true },
      { model: Bed, as: 'bed', required: true },
    ],
  });
  const w = await loadGardenWeather(weather, garden);
  const crops = new Map((await listCrops(gardenId, {})).map((c) => [c.crop.key, c]));
  // Plantings of a variety share a target unless their start events count different days.
  const targets = new Map<string, ReturnType<typeof varietyTarget>>();
  const results: Computed[] = [];
  for (const p of plantings) {
    const crop = crops.get(p.variety!.cropKey);
    if (!crop) continue;
    const variety = p.variety!;
    const e = startEvent(p, variety).event;
    const own = e?.packetDays ? { days: e.packetDays, from: e.kind } : undefined;
    const key = `${variety.id}:${own?.days}:${own?.from}`;
    if (!targets.has(key)) targets.set(key, varietyTarget(garden, variety, effectiveValues(crop), () => Promise.resolve(w.history), own));
    results.push(computeOne(garden, p, crop, await targets.get(key)!, w));
  }
  return { garden, today: w.today, results };
}

function computeOne(garden: Garden, p: Planting, crop: CropWithOverrides, target: Awaited<ReturnType<typeof varietyTarget>>, w: GardenWeather): Computed {
  const variety = p.variety!;
  const effective = effectiveValues(crop);
  const method = cropMethod(effective);
  const unit = garden.units;
  const start = startEvent(p, variety);
  const base: Omit<Computed, 'progress' | 'event'> = {
    planting: p,
    cropName: crop.crop.name,
    season: effective.season,
    unit,
    today: w.today,
    method,
    target: target.valueC,
    targetBasis: target.basis === 'override' ? 'grower' : target.basis === 'derived' ? 'packet' : null,
    targetNote: target.explanation,
    startReason: start.reason ?? null,
    boltNotes: [],
  };
  if (!start.event || garden.latitude === null) {
    return { ...base, event: start.event, progress: null, startReason: start.reason ?? 'The garden has no location yet, so it has no weather.' };
  }
  const bolt = cropBoltTriggers(variety.cropKey, effective, crop.overrides, unit);
  const first = start.event.on;
  const progress = plantingProgress({
    today: w.today,
    latitude: garden.latitude,
    status: p.status,
    event: start.event,
    recorded: { firstHarvestOn: p.firstHarvestOn, boltedOn: p.boltedOn },
    target: target.valueC,
    targetMissing: target.explanation,
    method,
    weather: w.all.filter((d) => d.date > first),
    history: w.history,
    boltTriggers: bolt && Object.keys(bolt.triggers).length ? bolt.triggers : null,
    boltTolerance: variety.boltTolerance ?? undefined,
    stressProfile: cropStressProfile(variety.cropKey, effective),
    unit,
  });
  const boltNotes = !bolt ? [`${crop.crop.name} does not bolt within its garden season.`] : (bolt.notes.length ? bolt.notes : p.status === 'growing' ? [] : ['Bolt risk is judged while a planting is growing.']);
  return { ...base, event: start.event, progress, boltNotes };
}

export interface PreviewInput {
  varietyId: number;
  method: Planting['method'];
  sownOn: string | null;
  transplantedOn: string | null;
}

export interface PreviewComputation {
  computed: Computed;
  /** The garden's past seasons sown on the start day: share with high bolt risk in the harvest window. */
  boltSeason: { highShare: number; years: number } | null;
}

/**
 * What a planting not yet saved would do: the same progress computation as a stored one (the
 * planting built in memory, never saved), and, for a crop that bolts, how often the garden's past
 * seasons brought high bolt risk into the harvest window of a crop started that day.
 */
export async function previewProgress(weather: WeatherService, gardenId: number, input: PreviewInput): Promise<PreviewComputation> {
  const garden = await Garden.findByPk(gardenId);
  if (!garden) throw AppError.notFound('That garden');
  const variety = await Variety.findOne({ where: { id: input.varietyId, gardenId } });
  if (!variety) throw new AppError(400, 'validation_failed', 'Please check the fields: varietyId.', { varietyId: 'Choose a variety of this garden.' });
  const crop = await getCrop(gardenId, variety.cropKey);
  const w = await loadGardenWeather(weather, garden);
  const start = input.method === 'direct-sow' ? input.sownOn : input.transplantedOn;
  const planting = Planting.build({
    gardenId,
    bedId: 0,
    varietyId: variety.id,
    seedLotId: null,
    method: input.method,
    status: start && start <= w.today ? 'growing' : 'planned',
    quantity: null,
    quantityUnit: 'plants',
    sownOn: input.sownOn,
    emergedOn: null,
    thinnedOn: null,
    transplantedOn: input.transplantedOn,
    firstHarvestOn: null,
    lastHarvestOn: null,
    boltedOn: null,
    notes: '',
  });
  planting.variety = variety;
  const e = startEvent(planting, variety).event;
  const own = e?.packetDays ? { days: e.packetDays, from: e.kind } : undefined;
  const target = await varietyTarget(garden, variety, effectiveValues(crop), () => Promise.resolve(w.history), own);
  const computed = computeOne(garden, planting, crop, target, w);
  let boltSeason: PreviewComputation['boltSeason'] = null;
  const effective = effectiveValues(crop);
  const bolt = cropBoltTriggers(variety.cropKey, effective, crop.overrides, garden.units);
  if (e && target.valueC !== null && garden.latitude !== null && bolt && Object.keys(bolt.triggers).length && w.history.length) {
    const climatology = prepareSowingSweep({ history: w.history, latitude: garden.latitude, method: cropMethod(effective), triggers: bolt.triggers, boltTolerance: variety.boltTolerance ?? undefined });
    const [candidate] = sowingWindowSweep(climatology, { from: e.on, to: e.on, target: target.valueC }).candidates;
    if (candidate && candidate.analogYears > 0) boltSeason = { highShare: candidate.highBoltShare, years: candidate.analogYears };
  }
  return { computed, boltSeason };
}
