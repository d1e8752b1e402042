/**
 * The weather pipeline as the rest of the app sees it: cells shared by nearby gardens, nightly
 * refresh, history backfill in yearly batches, gap repair and marked fills, and the garden's
 * series. Each operation is its own command in commands/; this facade holds what they share
 * (settings, clock, leases) and the background work of this instance, so shutdown can wait for it.
 */
import { hostname } from 'node:os';
import { randomUUID } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import type { Garden } from '../../db/models';
import { addDays } from '#shared/thermal/dates';
import type { Logger } from '../../lib/logger';
import { localDate } from '../../lib/local-date';
import type { WeatherClient } from '../../integrations/weather/open-meteo';
import { WeatherRepository } from './weather.repository';
import type { CellRow } from './weather.repository';
import { DEFAULT_WEATHER_SETTINGS } from './weather-context';
import type { WeatherContext, WeatherSettings } from './weather-context';
import { loadGardenWeather } from './garden-weather';
import type { GardenDay, WeatherGarden } from './garden-weather';
import { backfillStatus } from './backfill-status';
import { refreshCells, sweepStaleRuns } from './commands/refresh-cells';
import type { RefreshOptions } from './commands/refresh-cells';
import { backfillCell } from './commands/backfill-cell';
import { repairOldGaps } from './commands/repair-gaps';
import { fillShortGaps } from './commands/fill-gaps';
import { locateGarden } from './commands/locate-garden';

/** Called after a cell's days were refreshed, with the gardens it serves. */
export type CellRefreshedListener = (cellId: number, gardenIds: number[]) => Promise<void>;

export class WeatherService {
  readonly repo: WeatherRepository;
  readonly instance = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  private readonly ctx: WeatherContext;
  private readonly listeners: CellRefreshedListener[] = [];
  private readonly eventListeners: Array<() => void> = [];
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
    this.ctx = {
      sequelize: deps.sequelize,
      repo: this.repo,
      client: deps.client,
      logger: deps.logger,
      settings: this.settings,
      instance: this.instance,
      now: () => this.now(),
      today: (cell) => this.today(cell),
      leaseToken: () => `${this.instance}:${randomUUID().slice(0, 8)}`,
      eventsCommitted: () => this.eventsCommitted(),
    };
  }

  get settings(): WeatherSettings {
    return { ...DEFAULT_WEATHER_SETTINGS, ...this.deps.settings };
  }

  now(): Date {
    return this.deps.now?.() ?? new Date();
  }

  today(cell: Pick<CellRow, 'timeZone'>): string {
    return localDate(cell.timeZone, this.now());
  }

  onCellRefreshed(listener: CellRefreshedListener) {
    this.listeners.push(listener);
  }

  /** For the worker's kick: events committed by this instance are taken at once, not at the next poll. */
  onEventsCommitted(listener: () => void) {
    this.eventListeners.push(listener);
  }

  /** Runs after a commit: a failing listener must not make the committed write look failed. */
  eventsCommitted() {
    for (const listener of this.eventListeners) {
      try {
        listener();
      } catch (err) {
        this.deps.logger.error('weather event listener failed', { error: (err as Error).message });
      }
    }
  }

  /** The nightly job, and "refresh now" for one garden's cell. Records a job run either way. */
  runRefresh(opts: RefreshOptions = { kind: 'nightly' }) {
    return this.track(refreshCells(this.ctx, opts, (cellId) => this.notify(cellId)));
  }

  /** Closes job runs left `running` by an instance that stopped mid-run (boot, and each run's start). */
  sweepStaleRuns(): Promise<number> {
    return sweepStaleRuns(this.ctx);
  }

  /** Hands a refreshed cell to the listeners; their failures are theirs, not the refresh's. */
  private async notify(cellId: number) {
    if (!this.listeners.length) return;
    const gardens = await this.repo.gardensOfCell(cellId);
    for (const listener of this.listeners) {
      await listener(cellId, gardens).catch((err: Error) =>
        this.deps.logger.error('weather listener failed', { cellId, error: err.message }),
      );
    }
  }

  /** One backfill per cell at a time in this instance; the cell lease covers other instances. */
  backfill(cellId: number): Promise<void> {
    const running = this.backfills.get(cellId);
    if (running) return running;
    const job = backfillCell(this.ctx, cellId).finally(() => this.backfills.delete(cellId));
    this.backfills.set(cellId, job);
    return job;
  }

  /** Backfills every cell in use whose history is incomplete (after a failure or a restart). */
  async backfillPending() {
    for (const id of await this.repo.cellsNeedingBackfill()) await this.backfill(id);
  }

  backfillStatus(cellId: number | null) {
    return backfillStatus(this.ctx, cellId, (id) => this.backfills.has(id));
  }

  repairOldGaps(maxPerCell = 3): Promise<number> {
    return repairOldGaps(this.ctx, maxPerCell);
  }

  fillShortGaps(cellId: number, from: string, to: string): Promise<number> {
    return fillShortGaps(this.ctx, cellId, from, to);
  }

  locateGarden(garden: Garden): Promise<number | null> {
    return locateGarden(this.ctx, garden);
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

  /** Resolves when background work started by this instance has finished (tests, shutdown). */
  async idle() {
    while (this.pending.size || this.backfills.size) {
      await Promise.allSettled([...this.pending, ...this.backfills.values()]);
    }
  }

  /** A garden's daily series (see garden-weather.ts for which value wins). */
  async gardenSeries(garden: WeatherGarden, from: string, to: string): Promise<GardenDay[]> {
    return (await loadGardenWeather(this.deps.sequelize, garden, { from, to })).days;
  }

  /** Every past day known for a garden (observed, filled or its own station's), oldest first. */
  async gardenHistory(garden: WeatherGarden & { timeZone: string }): Promise<GardenDay[]> {
    const now = this.now();
    const yesterday = addDays(localDate(garden.timeZone, now), -1);
    return (await loadGardenWeather(this.deps.sequelize, garden, { from: '1900-01-01', to: yesterday, now })).history;
  }
}
