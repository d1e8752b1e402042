import { beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { testDb } from '../../helpers/test-app';
import { createGarden } from '../../helpers/factories';
import { fakeWeather } from '../../../fixtures/weather/control';
import { createWeatherClient } from '../../../server/integrations/weather/open-meteo';
import { createLogger } from '../../../server/lib/logger';
import { WeatherService } from '../../../server/modules/weather/weather.service';
import type { WeatherSettings } from '../../../server/modules/weather/weather-context';

/**
 * The nightly run when several instances share the database (one server or a Galera cluster):
 * runs are always closed, a dead instance's cells are taken over, and claims lost to another
 * claimer are counted apart from failed cells.
 */
const { sequelize, config } = testDb();
const made: WeatherService[] = [];
beforeEach(() => fakeWeather.reset());

function service(settings: Partial<WeatherSettings> = {}) {
  const logger = createLogger('silent');
  const client = createWeatherClient({ timeoutMs: config.weather.timeoutMs, retries: config.weather.retries, backoffMs: config.weather.backoffMs, logger });
  const s = new WeatherService({ sequelize, client, logger, settings: { historyYears: 1, concurrency: 2, ...settings } });
  made.push(s);
  return s;
}

function freshPlace() {
  const lat = 20 + Math.random() * 40;
  const lon = -170 + Math.random() * 340;
  return { latitude: Math.round(lat * 10) / 10 + 0.02, longitude: Math.round(lon * 10) / 10 + 0.02 };
}

async function run(id: number) {
  const [row] = await sequelize.query<{ status: string; message: string | null; finished: Date | null; cellsOk: number; cellsFailed: number; claimConflicts: number }>(
    `SELECT status, message, finished_at AS finished, cells_ok AS cellsOk, cells_failed AS cellsFailed, claim_conflicts AS claimConflicts FROM job_runs WHERE id = ?`,
    { replacements: [id], type: QueryTypes.SELECT },
  );
  return row;
}

describe('nightly runs on several instances', () => {
  it('when an instance died mid-run, then the next run closes its row as failed and leaves a live run alone', async () => {
    const insert = async (heartbeatAgo: string) => {
      const [id] = (await sequelize.query(
        `INSERT INTO job_runs (kind, instance, started_at, heartbeat_at, status) VALUES ('nightly', 'gone:1', UTC_TIMESTAMP(3) - INTERVAL 1 HOUR, UTC_TIMESTAMP(3) - INTERVAL ${heartbeatAgo}, 'running')`,
      )) as unknown as [number];
      return id;
    };
    const dead = await insert('10 MINUTE');
    const alive = await insert('5 SECOND');
    const weather = service();
    await weather.runRefresh({ kind: 'manual', cellId: 2_000_000_000 });
    const closed = await run(dead);
    expect(closed.status).toBe('failed');
    expect(closed.finished).not.toBeNull();
    expect(closed.message).toMatch(/abandoned: no heartbeat since/);
    expect((await run(alive)).status).toBe('running');
    await sequelize.query("UPDATE job_runs SET status = 'failed', finished_at = UTC_TIMESTAMP(3) WHERE id = ?", { replacements: [alive] });
  });

  it('when a cell is still leased by an instance that died, then a run going on elsewhere takes it once the short lease lapses', async () => {
    const weather = service({ runLeaseMs: 1500, awaitOthersMs: 8000 });
    const garden = await createGarden(freshPlace());
    const cellId = (await weather.locateGarden(garden))!;
    await weather.idle();
    // As the dead instance left it: claimed a moment ago, never released, never refreshed.
    await sequelize.query(
      "UPDATE weather_cells SET refreshed_at = NULL, lease_owner = 'gone:1:abcd', lease_until = UTC_TIMESTAMP(3) + INTERVAL 1 SECOND WHERE id = ?",
      { replacements: [cellId] },
    );
    const started = Date.now();
    const result = await weather.runRefresh({ kind: 'nightly' });
    const [cell] = await sequelize.query<{ refreshed: Date | null; owner: string | null }>(
      'SELECT refreshed_at AS refreshed, lease_owner AS owner FROM weather_cells WHERE id = ?',
      { replacements: [cellId], type: QueryTypes.SELECT },
    );
    expect(cell.refreshed).not.toBeNull();
    expect(cell.owner).toBeNull();
    expect(result.cellsOk).toBeGreaterThanOrEqual(1);
    expect(Date.now() - started).toBeLessThan(8000);
    expect((await run(result.runId)).status).not.toBe('running');
  });

  it('when claims lose to another claimer (1213), then they are retried with backoff and counted apart, and the run stays ok', async () => {
    const weather = service({ concurrency: 1 });
    const garden = await createGarden(freshPlace());
    const cellId = (await weather.locateGarden(garden))!;
    await weather.idle();
    await sequelize.query('UPDATE weather_cells SET refreshed_at = NULL WHERE id = ?', { replacements: [cellId] });
    const claim = weather.repo.claimCell.bind(weather.repo);
    let calls = 0;
    weather.repo.claimCell = (...args) => {
      calls++;
      if (calls <= 3) {
        const err = new Error('Deadlock found when trying to get lock; try restarting transaction') as Error & { original: { errno: number } };
        err.original = { errno: 1213 };
        return Promise.reject(err);
      }
      return claim(...args);
    };
    const result = await weather.runRefresh({ kind: 'manual', cellId });
    expect(result).toMatchObject({ cellsOk: 1, cellsFailed: 0, claimConflicts: 3 });
    expect(await run(result.runId)).toMatchObject({ status: 'ok', cellsOk: 1, cellsFailed: 0, claimConflicts: 3 });
  });

  it('when every claim attempt of a worker loses, then that worker stops without failing a cell, and the run is still closed', async () => {
    const weather = service({ concurrency: 1, claimAttempts: 3 });
    weather.repo.claimCell = () => {
      const err = new Error('certification failed') as Error & { original: { errno: number } };
      err.original = { errno: 1213 };
      return Promise.reject(err);
    };
    const result = await weather.runRefresh({ kind: 'nightly' });
    expect(await run(result.runId)).toMatchObject({ status: 'ok', cellsFailed: 0, claimConflicts: 3 });
  });
});
