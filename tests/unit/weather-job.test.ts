import { describe, expect, it } from 'vitest';
import { scheduleWeatherJob } from '../../server/jobs/weather-job';
import { createLogger } from '../../server/lib/logger';
import type { WeatherService } from '../../server/modules/weather/weather.service';

const logger = createLogger('silent');

describe('nightly weather schedule (node-cron)', () => {
  it('when the cron expression is malformed, then start-up fails naming WEATHER_CRON', () => {
    expect(() => scheduleWeatherJob({} as WeatherService, { cron: 'at night', timeZone: 'UTC', logger })).toThrow(/WEATHER_CRON/);
  });

  it('when the schedule fires while a slow run is still going, then runs never overlap', async () => {
    let running = 0;
    let maxRunning = 0;
    let runs = 0;
    const weather = {
      runRefresh: async () => {
        running++;
        runs++;
        maxRunning = Math.max(maxRunning, running);
        await new Promise((r) => setTimeout(r, 2500));
        running--;
        return { runId: runs, cellsOk: 0, cellsFailed: 0, cellsSkipped: 0, daysWritten: 0, daysRejected: 0, requests: 0 };
      },
      backfillPending: async () => undefined,
      repairOldGaps: async () => 0,
      sweepStaleRuns: async () => 0,
    } as unknown as WeatherService;
    const task = scheduleWeatherJob(weather, { cron: '* * * * * *', timeZone: 'UTC', logger });
    await new Promise((r) => setTimeout(r, 3600));
    await task.stop();
    expect(runs).toBeGreaterThanOrEqual(1);
    expect(maxRunning).toBe(1);
  });
});
