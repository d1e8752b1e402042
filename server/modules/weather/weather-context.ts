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
