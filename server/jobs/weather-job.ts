import cron from 'node-cron';
import type { Logger } from '../lib/logger';
import type { WeatherService } from '../modules/weather/weather.service';

/**
 * The nightly weather pull. noOverlap keeps one run per process at a time; across processes the
 * per-cell leases make sure each cell is refreshed once (see commands/refresh-cells.ts). At boot,
 * runs left `running` by an instance that stopped mid-run are closed as failed.
 */
export function scheduleWeatherJob(weather: WeatherService, opts: { cron: string; timeZone: string; logger: Logger }) {
  if (!cron.validate(opts.cron)) throw new Error(`Invalid configuration: WEATHER_CRON "${opts.cron}" is not a cron expression`);
  void weather.sweepStaleRuns();
  return cron.schedule(
    opts.cron,
    async () => {
      const run = await weather.runRefresh({ kind: 'nightly' });
      opts.logger.info('weather run finished', { ...run });
      await weather.backfillPending();
      const repaired = await weather.repairOldGaps();
      if (repaired) opts.logger.info('weather gaps repaired', { days: repaired });
    },
    { timezone: opts.timeZone, noOverlap: true, name: 'weather-nightly' },
  );
}
