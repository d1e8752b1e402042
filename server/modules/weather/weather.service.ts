/**
 * The weather pipeline: cells shared by nearby gardens, nightly refresh (yesterday's observation
 * plus the forecast, one request per cell), history backfill in yearly batches, gap detection and
 * marked interpolation of short gaps. Several instances can run it at once: each cell is claimed
 * through a lease taken under FOR UPDATE SKIP LOCKED (see WeatherRepository.claimCell).
 */
import { hostname } from 'node:os';
import { randomUUID } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import type { Garden } from '../../db/models';
import { addDays, daysBetween } from '#shared/thermal/dates';
import type { DailyTemp } from '#shared/thermal/types';
import type { Logger } from '../../lib/logger';
import { localDate } from '../../lib/local-date';
import type { WeatherClient, FetchedDay } from '../../integrations/weather/open-meteo';
import { requestsOf } from '../../integrations/weather/open-meteo';
import { WeatherRepository } from './weather.repository';
import type { CellRow, RunTotals } from './weather.repository';

export interface WeatherSettings {
  historyYears: number;
  forecastDays: number;
  concurrency: number;
  /** A cell refreshed more recently than this is left alone by the nightly run. */
  minRefreshMinutes: number;
  leaseMs: number;
  /** The archive lags the present by a few days; backfill stops this many days before today. */
  archiveLagDays: number;
}

export const DEFAULT_WEATHER_SETTINGS: WeatherSettings = {
  historyYears: 11,
  forecastDays: 16,
  concurrency: 8,
  minRefreshMinutes: 60,
  leaseMs: 5 * 60_000,
  archiveLagDays: 7,
};

/** Called after a cell's days changed, for the steps that evaluate plantings and alerts. */
export type CellRefreshedListener = (cellId: number, gardenIds: number[]) => Promise<void>;

export interface Gap {
  from: string;
  to: string;
  days: number;
}

const MAX_FILL_RUN = 2;

function emptyTotals(): RunTotals {
  return { cellsOk: 0, cellsFailed: 0, cellsSkipped: 0, daysWritten: 0, daysRejected: 0, requests: 0 };
}

/** Runs of consecutive dates in [from, to] that have no value. */
export function findGaps(have: ReadonlySet<string>, from: string, to: string): Gap[] {
  const gaps: Gap[] = [];
  let start: string | null = null;
  for (let d = from; daysBetween(d, to) >= 0; d = addDays(d, 1)) {
    if (!have.has(d)) start ??= d;
    else if (start) {
      gaps.push({ from: start, to: addDays(d, -1), days: daysBetween(start, d) });
      start = null;
    }
  }
  if (start) gaps.push({ from: start, to, days: daysBetween(start, to) + 1 });
  return gaps;
}

export class WeatherService {
  readonly repo: WeatherRepository;
  readonly instance = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  private readonly listeners: CellRefreshedListener[] = [];
  private readonly backfills = new Map<number, Promise<void>>();
  private readonly pending = new Set<Promise<void>>();

  constructor(
    private readonly deps: {
      sequelize: Sequelize;
      client: WeatherClient;
      logger: Logger;
      settings?: Partial<WeatherSettings>;
      now?: () => Date;
    },
  ) {
    this.repo = new WeatherRepository(deps.sequelize);
  }

  get settings(): WeatherSettings {
    return { ...DEFAULT_WEATHER_SETTINGS, ...this.deps.settings };
  }

  now(): Date {
    return this.deps.now?.() ?? new Date();
  }

  onCellRefreshed(listener: CellRefreshedListener) {
    this.listeners.push(listener);
  }

  today(cell: Pick<CellRow, 'timeZone'>): string {
    return localDate(cell.timeZone, this.now());
  }

  /** A lease belongs to one job, not to the instance, so two jobs of one instance never share a cell. */
  private leaseToken(): string {
    return `${this.instance}:${randomUUID().slice(0, 8)}`;
  }

  /** Fetches recent days and the forecast for one leased cell, stores them, fills short gaps. */
  private async refreshLeasedCell(cell: CellRow, totals: RunTotals, token: string) {
    const today = this.today(cell);
    const yesterday = addDays(today, -1);
    const s = this.settings;
    try {
      const pastDays = await this.pastDaysToAsk(cell, today);
      const res = await this.deps.client.recent({
        latitude: cell.latitude,
        longitude: cell.longitude,
        timeZone: cell.timeZone,
        pastDays,
        forecastDays: s.forecastDays,
      });
      totals.requests += res.requests;
      totals.daysRejected += res.rejected.length;
      const rows = res.days.map((d) => ({ ...d, source: d.date < today ? ('observed' as const) : ('forecast' as const) }));
      // Await first, then add: `total += await …` would read the total before other workers' updates.
      const written = await this.repo.upsertCellDays(cell.id, rows);
      const filled = await this.fillShortGaps(cell.id, addDays(today, -pastDays), yesterday);
      totals.daysWritten += written + filled;
      const observed = rows.filter((r) => r.source === 'observed').map((r) => r.date);
      await this.repo.releaseCell(cell.id, token, {
        refreshed: true,
        historyThrough: observed.length ? observed[observed.length - 1] : undefined,
      });
      totals.cellsOk++;
    } catch (err) {
      totals.requests += requestsOf(err);
      totals.cellsFailed++;
      totals.message = `cell ${cell.id}: ${(err as Error).message}`;
      this.deps.logger.error('weather refresh failed', { cellId: cell.id, error: (err as Error).message });
      await this.repo.releaseCell(cell.id, token).catch(() => undefined);
      return;
    }
    await this.notify(cell.id);
  }

  /** Hands a refreshed cell to the evaluation steps; their failures are theirs, not the refresh's. */
  private async notify(cellId: number) {
    if (!this.listeners.length) return;
    const gardens = await this.repo.gardensOfCell(cellId);
    for (const listener of this.listeners) {
      await listener(cellId, gardens).catch((err: Error) =>
        this.deps.logger.error('weather listener failed', { cellId, error: err.message }),
      );
    }
  }

  /**
   * Reach back far enough (up to the service's 92 days) to replace what is not yet observed:
   * missing days, filled days and stale forecasts; at least the last two days.
   */
  private async pastDaysToAsk(cell: CellRow, today: string): Promise<number> {
    const from = addDays(today, -92);
    const have = await this.repo.cellDays(cell.id, from, addDays(today, -1));
    const observed = new Set(have.filter((d) => d.source === 'observed').map((d) => d.date));
    const start = cell.historyFrom && cell.historyFrom > from ? cell.historyFrom : from;
    let first = addDays(today, -2);
    for (let d = start; d < first; d = addDays(d, 1)) {
      if (!observed.has(d)) {
        first = d;
        break;
      }
    }
    return Math.min(92, daysBetween(first, today));
  }

  /**
   * One- and two-day holes between known days get a straight line between the neighbours,
   * stored as 'filled' with a note saying so; longer holes stay gaps and are shown.
   */
  async fillShortGaps(cellId: number, from: string, to: string): Promise<number> {
    const days = await this.repo.cellDays(cellId, addDays(from, -1), addDays(to, 1));
    const known = new Map(days.filter((d) => d.source !== 'forecast').map((d) => [d.date, d]));
    const fills: Array<{ date: string; tmax: number; tmin: number; source: 'filled'; note: string }> = [];
    for (const gap of findGaps(new Set(known.keys()), from, to)) {
      const before = known.get(addDays(gap.from, -1));
      const after = known.get(addDays(gap.to, 1));
      if (gap.days > MAX_FILL_RUN || !before || !after) continue;
      const span = gap.days + 1;
      for (let k = 1; k <= gap.days; k++) {
        const f = k / span;
        const r1 = (x: number) => Math.round(x * 10) / 10;
        fills.push({
          date: addDays(gap.from, k - 1),
          tmax: r1(before.tmax + (after.tmax - before.tmax) * f),
          tmin: r1(before.tmin + (after.tmin - before.tmin) * f),
          source: 'filled',
          note: `Linear interpolation between ${before.date} and ${after.date}`,
        });
      }
    }
    return this.repo.upsertCellDays(cellId, fills);
  }

  /** The nightly job, and "refresh now" for one garden's cell. Records a job run either way. */
  runRefresh(opts: { kind: 'nightly' | 'manual'; gardenId?: number; cellId?: number } = { kind: 'nightly' }) {
    return this.track(this.runRefreshNow(opts));
  }

  private async runRefreshNow(opts: { kind: 'nightly' | 'manual'; gardenId?: number; cellId?: number }) {
    const s = this.settings;
    const runId = await this.repo.startRun(opts.kind, this.instance, opts.gardenId ?? null);
    const totals = emptyTotals();
    const cutoff = new Date(this.now().getTime() - (opts.kind === 'manual' ? 30_000 : s.minRefreshMinutes * 60_000));
    const worker = async () => {
      for (;;) {
        const token = this.leaseToken();
        const cell = await this.repo.claimCell(token, cutoff, s.leaseMs, opts.cellId);
        if (!cell) return;
        await this.refreshLeasedCell(cell, totals, token);
        if (opts.cellId) return;
      }
    };
    try {
      await Promise.all(Array.from({ length: opts.cellId ? 1 : s.concurrency }, worker));
      if (opts.cellId && totals.cellsOk + totals.cellsFailed === 0) totals.cellsSkipped = 1;
    } catch (err) {
      totals.message = (err as Error).message;
      totals.cellsFailed++;
    } finally {
      await this.repo.finishRun(runId, totals);
    }
    return { runId, ...totals };
  }

  /** Keeps work in flight visible to idle(), so shutdown waits for it to release its leases. */
  private track<T>(work: Promise<T>): Promise<T> {
    const settled = work.then(
      () => undefined,
      () => undefined,
    );
    this.pending.add(settled);
    void settled.finally(() => this.pending.delete(settled));
    return work;
  }

  /**
   * Fetches history for analog years in yearly batches, newest first, so the recent seasons are
   * there soonest. Resumable: progress lives in history_from / history_through on the cell.
   */
  backfill(cellId: number): Promise<void> {
    const running = this.backfills.get(cellId);
    if (running) return running;
    const job = this.backfillNow(cellId).finally(() => this.backfills.delete(cellId));
    this.backfills.set(cellId, job);
    return job;
  }

  private async backfillNow(cellId: number) {
    const s = this.settings;
    const token = this.leaseToken();
    let targetFrom: string | undefined;
    try {
      if (!(await this.repo.leaseCell(cellId, token, s.leaseMs))) return;
      const cell = (await this.repo.cell(cellId))!;
      const today = this.today(cell);
      targetFrom = `${Number(today.slice(0, 4)) - s.historyYears}-01-01`;
      let historyFrom = cell.historyFrom;
      let historyThrough = cell.historyThrough;
      // Continue below what is already stored; on a first run start at the archive's end.
      let to = historyFrom && historyThrough ? addDays(historyFrom, -1) : addDays(today, -s.archiveLagDays);
      while (daysBetween(targetFrom, to) >= 0) {
        const from = [addDays(to, -365), targetFrom].sort().pop()!;
        const res = await this.deps.client.history({ latitude: cell.latitude, longitude: cell.longitude, timeZone: cell.timeZone, from, to });
        const rows = res.days.map((d: FetchedDay) => ({ ...d, source: 'observed' as const }));
        await this.repo.upsertCellDays(cellId, rows);
        historyFrom = from;
        historyThrough = historyThrough && historyThrough > to ? historyThrough : to;
        await this.repo.leaseCell(cellId, token, s.leaseMs);
        await this.repo.recordHistory(cellId, { historyFrom, historyThrough, targetFrom });
        to = addDays(from, -1);
      }
      await this.repo.releaseCell(cellId, token, { backfillTargetFrom: targetFrom, backfillError: null });
    } catch (err) {
      this.deps.logger.error('weather backfill failed', { cellId, error: (err as Error).message });
      await this.repo
        .releaseCell(cellId, token, { backfillTargetFrom: targetFrom, backfillError: (err as Error).message.slice(0, 500) })
        .catch(() => undefined);
    }
  }

  /**
   * Days still missing further back than the nightly refresh reaches (rejected days, long
   * outages) are asked of the archive again; at most a few holes per cell and night, so a cell
   * with a permanent hole cannot swamp the service.
   */
  async repairOldGaps(maxPerCell = 3): Promise<number> {
    let repaired = 0;
    for (const cellId of await this.repo.cellsInUse()) {
      const token = this.leaseToken();
      try {
        if (!(await this.repo.leaseCell(cellId, token, this.settings.leaseMs))) continue;
        const cell = (await this.repo.cell(cellId))!;
        if (!cell.historyFrom) continue;
        const to = addDays(this.today(cell), -(92 + 1));
        if (daysBetween(cell.historyFrom, to) < 0) continue;
        const have = await this.repo.knownDates(cellId, cell.historyFrom, to);
        if (have.size === daysBetween(cell.historyFrom, to) + 1) continue;
        for (const gap of findGaps(have, cell.historyFrom, to).slice(0, maxPerCell)) {
          const res = await this.deps.client.history({ latitude: cell.latitude, longitude: cell.longitude, timeZone: cell.timeZone, from: gap.from, to: gap.to });
          repaired += await this.repo.upsertCellDays(cellId, res.days.map((d) => ({ ...d, source: 'observed' as const })));
          repaired += await this.fillShortGaps(cellId, gap.from, gap.to);
        }
      } catch (err) {
        this.deps.logger.error('weather gap repair failed', { cellId, error: (err as Error).message });
      } finally {
        await this.repo.releaseCell(cellId, token).catch(() => undefined);
      }
    }
    return repaired;
  }

  /**
   * Puts a garden in the weather cell of its location (creating the cell if new). Returns the
   * cell id when it changed, so the caller can start fetching that cell's history.
   */
  async locateGarden(garden: Garden): Promise<number | null> {
    if (garden.latitude === null || garden.longitude === null) return null;
    const cellId = await this.repo.findOrCreateCell(garden.latitude, garden.longitude, garden.timeZone);
    if (cellId === garden.weatherCellId) return null;
    await garden.update({ weatherCellId: cellId });
    return cellId;
  }

  /** History first, then recent days and the forecast; failures are logged and retried nightly. */
  prepareCell(cellId: number, gardenId: number): Promise<void> {
    return this.track(
      this.backfill(cellId)
        .then(() => this.runRefresh({ kind: 'manual', gardenId, cellId }))
        .then(() => undefined)
        .catch((err: Error) => this.deps.logger.error('weather preparation failed', { cellId, error: err.message })),
    );
  }

  /** Resolves when background work started by this instance has finished (tests, shutdown). */
  async idle() {
    while (this.pending.size || this.backfills.size) {
      await Promise.allSettled([...this.pending, ...this.backfills.values()]);
    }
  }

  /** Backfills every cell in use whose history is incomplete (after a failure or a restart). */
  async backfillPending() {
    for (const id of await this.repo.cellsNeedingBackfill()) await this.backfill(id);
  }

  /** A garden's daily series: its own station imports win over the cell's values. */
  async gardenSeries(garden: { id: number; weatherCellId: number | null }, from: string, to: string): Promise<Array<DailyTemp & { note: string | null }>> {
    const byDate = new Map<string, DailyTemp & { note: string | null }>();
    if (garden.weatherCellId) {
      for (const d of await this.repo.cellDays(garden.weatherCellId, from, to)) byDate.set(d.date, d);
    }
    for (const d of await this.repo.gardenDays(garden.id, from, to)) byDate.set(d.date, { ...d, source: 'imported', note: null });
    return [...byDate.values()].sort((a, b) => (a.date < b.date ? -1 : 1));
  }

  /** Every past day known for a garden (observed, filled or its own station's), oldest first. */
  async gardenHistory(garden: { id: number; weatherCellId: number | null; timeZone: string }) {
    const yesterday = addDays(localDate(garden.timeZone, this.now()), -1);
    return (await this.gardenSeries(garden, '1900-01-01', yesterday)).filter((d) => d.source !== 'forecast');
  }

  async backfillStatus(cellId: number | null) {
    if (!cellId) return null;
    const cell = await this.repo.cell(cellId);
    if (!cell) return null;
    const today = this.today(cell);
    const targetFrom = cell.backfillTargetFrom ?? `${Number(today.slice(0, 4)) - this.settings.historyYears}-01-01`;
    const wanted = Math.max(1, daysBetween(targetFrom, today));
    const have = cell.historyFrom && cell.historyThrough ? daysBetween(cell.historyFrom, cell.historyThrough) + 1 : 0;
    return {
      historyFrom: cell.historyFrom,
      historyThrough: cell.historyThrough,
      targetFrom,
      percent: Math.min(100, Math.round((have / wanted) * 100)),
      complete: !!cell.historyFrom && cell.historyFrom <= targetFrom,
      error: cell.backfillError,
      refreshedAt: cell.refreshedAt,
      running: this.backfills.has(cellId),
    };
  }
}
