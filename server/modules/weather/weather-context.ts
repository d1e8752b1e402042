/** What every weather command works with; the WeatherService facade builds it once. */
import type { Sequelize } from 'sequelize';
import type { Logger } from '../../lib/logger';
import type { WeatherClient } from '../../integrations/weather/open-meteo';
import type { CellRow, WeatherRepository } from './weather.repository';

export interface WeatherSettings {
  historyYears: number;
  forecastDays: number;
  concurrency: number;
  /** A cell refreshed more recently than this is left alone by the nightly run. */
  minRefreshMinutes: number;
  /** Backfill's lease on a cell (its yearly batches are long). */
  leaseMs: number;
  /**
   * A nightly or manual refresh's lease on one cell, renewed every third of it while the cell's
   * work goes on: an instance that dies lets its cells go within this time, not the next night.
   */
  runLeaseMs: number;
  /** How long a run waits, at most, for due cells other instances hold under a refresh lease. */
  awaitOthersMs: number;
  /** A run's heartbeat (job_runs.heartbeat_at) moves this often while it works. */
  heartbeatMs: number;
  /** A `running` run whose heartbeat is older than this is closed as failed (start of each run, boot). */
  staleRunMs: number;
  /** A worker's claim attempts in a row that may lose to another claimer (1213) before it stops. */
  claimAttempts: number;
  /** The archive lags the present by a few days; backfill stops this many days before today. */
  archiveLagDays: number;
}

export const DEFAULT_WEATHER_SETTINGS: WeatherSettings = {
  historyYears: 11,
  forecastDays: 16,
  concurrency: 8,
  minRefreshMinutes: 60,
  leaseMs: 5 * 60_000,
  runLeaseMs: 30_000,
  awaitOthersMs: 45_000,
  heartbeatMs: 15_000,
  staleRunMs: 3 * 60_000,
  claimAttempts: 8,
  archiveLagDays: 7,
};

export interface WeatherContext {
  sequelize: Sequelize;
  repo: WeatherRepository;
  client: WeatherClient;
  logger: Logger;
  settings: WeatherSettings;
  /** This instance's name in job runs and leases. */
  instance: string;
  now(): Date;
  today(cell: Pick<CellRow, 'timeZone'>): string;
  /** A lease belongs to one job, not to the instance, so two jobs of one instance never share a cell. */
  leaseToken(): string;
  /** Called after a commit that recorded garden events, so a worker can take them at once. */
  eventsCommitted(): void;
}
