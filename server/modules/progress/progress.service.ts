/**
 * Progress reads: served from the cache when it holds the garden's today, computed and stored
 * otherwise (one weather read for every planting missing). The Today page is assembled here too.
 */
import type { Sequelize } from 'sequelize';
import { TODAY_LIMIT } from '#shared/schemas/progress';
import type { ProgressSummaryDto, TodayDto, TodayPlantingDto } from '#shared/schemas/progress';
import { findCrop } from '#shared/crops/library';
import { plantingAttention } from '#shared/plantings/attention';
import { addDays } from '#shared/thermal/dates';
import { tempIn } from '#shared/thermal/units';
import { Garden } from '../../db/models';
import { AppError } from '../../errors';
import { localDate } from '../../lib/local-date';
import type { WeatherService } from '../weather/weather.service';
import { computeGardenProgress, previewProgress } from './progress-loader';
import type { PreviewInput } from './progress-loader';
import type { PlantingPreviewDto } from '#shared/schemas/plantings';
import { presentPreview, progressRow } from './progress.presenter';
import { ProgressRepository } from './progress.repository';

const BOLT_ORDER = { high: 0, elevated: 1, low: 2, none: 3 } as const;

/** Highest bolt risk first, then the soonest likely harvest; undated last; then the oldest start. */
function byUrgency(a: TodayPlantingDto, b: TodayPlantingDto): number {
  const bolt = BOLT_ORDER[a.progress.boltLevel] - BOLT_ORDER[b.progress.boltLevel];
  if (bolt) return bolt;
  const ra = a.progress.maturity.p50 ?? '9999';
  const rb = b.progress.maturity.p50 ?? '9999';
  return ra < rb ? -1 : ra > rb ? 1 : 0;
}

function cropOf(key: string) {
  const crop = findCrop(key);
  return { key, name: crop?.name ?? key, season: crop?.params.season.value ?? 'cool' };
}

export class ProgressService {
  readonly repo: ProgressRepository;

  constructor(
    sequelize: Sequelize,
    private readonly weather: WeatherService,
  ) {
    this.repo = new ProgressRepository(sequelize);
  }

  /** The clock every garden's "today" is read from (the weather service's, so tests can move it). */
  now(): Date {
    return this.weather.now();
  }

  async gardenToday(gardenId: number): Promise<{ garden: Garden; today: string }> {
    const garden = await Garden.findByPk(gardenId, { attributes: ['id', 'timeZone', 'units', 'latitude', 'weatherCellId', 'name'], raw: true });
    if (!garden) throw AppError.notFound('That garden');
    return { garden, today: localDate(garden.timeZone, this.weather.now()) };
  }

  /**
   * Computes and stores; the garden's counter is noted first, so an answer computed while a change
   * landed is returned to this caller but not stored over the change.
   */
  private async computeAndStore(gardenId: number, plantingIds?: number[]) {
    const epoch = await this.repo.epoch(gardenId);
    const rows = (await computeGardenProgress(this.weather, gardenId, plantingIds)).results.map(progressRow);
    await this.repo.save(gardenId, epoch, rows);
    return rows;
  }

  /** The planting's ProgressDto as JSON text, ready to send. */
  async plantingProgress(gardenId: number, plantingId: number): Promise<string> {
    const stored = await this.repo.body(gardenId, plantingId);
    if (!stored) throw AppError.notFound('That planting');
    if (stored.body && stored.computedFor === localDate(stored.timeZone, this.weather.now())) return stored.body;
    const [row] = await this.computeAndStore(gardenId, [plantingId]);
    if (!row) throw AppError.notFound('That planting’s crop');
    return row.body;
  }

  /** Computes and stores every planting of the garden without a row for its today (all, when `all`). */
  async refreshGarden(gardenId: number, opts: { all?: boolean; status?: string } = {}): Promise<number> {
    const { today } = await this.gardenToday(gardenId);
    const ids = opts.all ? undefined : await this.repo.stale(gardenId, today, { status: opts.status });
    if (ids && !ids.length) return 0;
    return (await this.computeAndStore(gardenId, ids)).length;
  }

  /** Summaries for these plantings of the garden, computing the missing ones first. */
  async summaries(gardenId: number, plantingIds: number[]): Promise<Map<number, ProgressSummaryDto>> {
    const { today } = await this.gardenToday(gardenId);
    const have = await this.repo.summaries(gardenId, plantingIds, today);
    const missing = plantingIds.filter((id) => !have.has(id));
    if (missing.length) for (const r of await this.computeAndStore(gardenId, missing)) have.set(r.plantingId, r.summary);
    return have;
  }

  /** What a planting not yet saved would do (the new-planting form's preview). */
  async preview(gardenId: number, input: PreviewInput): Promise<PlantingPreviewDto> {
    return presentPreview(await previewProgress(this.weather, gardenId, input));
  }

  /** Today's plantings and weather; `actions` are the garden's open alerts, filled in by the alerts module. */
  async today(gardenId: number): Promise<Omit<TodayDto, 'actions' | 'actionsTotal'>> {
    const { garden, today } = await this.gardenToday(gardenId);
    const [rows, weather] = await Promise.all([this.repo.growing(gardenId, today), this.weather.gardenSeries(garden, addDays(today, -7), addDays(today, 7))]);
    const missing = rows.filter((r) => !r.summary).map((r) => r.plantingId);
    const computed = missing.length ? await this.summaries(gardenId, missing) : new Map<number, ProgressSummaryDto>();
    const all = rows.flatMap((r) => {
      const progress = r.summary ?? computed.get(r.plantingId);
      if (!progress) return [];
      return [{ plantingId: r.plantingId, crop: cropOf(r.cropKey), variety: { id: r.varietyId, name: r.varietyName }, bed: { id: r.bedId, name: r.bedName }, status: r.status, progress, attention: plantingAttention({ ...r, maturity: progress.maturity }, today) }];
    });
    const unit = garden.units;
    const toUnit = (c: number) => Math.round(tempIn(c, unit) * 100) / 100;
    return {
      today,
      unit,
      plantings: [...all].sort(byUrgency).slice(0, TODAY_LIMIT),
      growingTotal: all.length,
      weather: weather.map((d) => ({ date: d.date, tmax: toUnit(d.tmax), tmin: toUnit(d.tmin), source: d.source })),
    };
  }
}
