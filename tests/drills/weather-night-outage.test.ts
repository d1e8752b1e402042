/**
 * Drill: the weather service is down for a whole night. Three nights on a moved clock, through the
 * nightly run itself (refreshCells with kind 'nightly'), limited to the drill's own cell because
 * other test files share the database and their cells must not be claimed or failed by this one.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { testDb, testWeather } from '../helpers/test-app';
import { createGarden } from '../helpers/factories';
import { fakeWeather } from '../../fixtures/weather/control';
import type { Fault } from '../../fixtures/weather/control';
import { addDays } from '#shared/thermal/dates';
import { findGaps } from '../../server/modules/weather/weather-gaps';

const { sequelize } = testDb();
beforeEach(() => fakeWeather.reset());

const RETRIES = 3;

interface StoredDay {
  date: string;
  source: string;
  tmax: number;
  tmin: number;
  fetched: Date;
}

async function storedDays(cellId: number) {
  return sequelize.query<StoredDay>('SELECT date, source, tmax_c AS tmax, tmin_c AS tmin, fetched_at AS fetched FROM weather_days WHERE cell_id = ? ORDER BY date', {
    replacements: [cellId],
    type: QueryTypes.SELECT,
  });
}

async function jobRun(id: number) {
  const [row] = await sequelize.query<{ kind: string; status: string; finished: Date | null; cellsOk: number; cellsFailed: number; requests: number; daysWritten: number; message: string | null }>(
    `SELECT kind, status, finished_at AS finished, cells_ok AS cellsOk, cells_failed AS cellsFailed, requests, days_written AS daysWritten, message
       FROM job_runs WHERE id = ?`,
    { replacements: [id], type: QueryTypes.SELECT },
  );
  return row;
}

/** A night of the nightly run: the clock at 04:20 UTC (WEATHER_CRON) of the given garden-local day. */
function night(day: string) {
  fakeWeather.today = day;
  return `${day}T04:20:00Z`;
}

describe('drill: the weather service fails for a whole night', () => {
  it('when every request of a night fails, then the run is failed, every stored value stays, and the next night backfills the missed days', async () => {
    // Nights after the real today: the nightly cutoff compares with refresh times the database wrote.
    const realToday = new Date().toISOString().slice(0, 10);
    const first = addDays(realToday, 2);
    let clock = night(first);
    const weather = testWeather({ retries: RETRIES, backoffMs: 1 }, () => new Date(clock));
    const lat = Math.round((25 + Math.random() * 30) * 10) / 10 + 0.02;
    const lon = Math.round((-170 + Math.random() * 340) * 10) / 10 + 0.02;
    const garden = await createGarden({ latitude: lat, longitude: lon, timeZone: 'UTC' });
    const cellId = (await weather.locateGarden(garden))!;
    expect(cellId).toBeGreaterThan(0);

    // Night 1: the service answers.
    const ok = await weather.runRefresh({ kind: 'nightly', cellId });
    expect(await jobRun(ok.runId)).toMatchObject({ kind: 'nightly', status: 'ok', cellsOk: 1, cellsFailed: 0 });
    const before = await storedDays(cellId);
    const yesterday = addDays(first, -1);
    expect(before.find((d) => d.date === yesterday)?.source).toBe('observed');
    expect(before.find((d) => d.date === first)?.source).toBe('forecast');

    // Night 2: down all night, in every way it fails: every try of the run is refused.
    const secondNight = addDays(first, 1);
    clock = night(secondNight);
    const outage: Fault[] = [
      { kind: 'status', status: 503 },
      { kind: 'status', status: 502 },
      { kind: 'status', status: 500 },
      { kind: 'status', status: 503 },
    ];
    expect(outage).toHaveLength(RETRIES + 1);
    fakeWeather.fail(...outage);
    fakeWeather.requests = [];
    const down = await weather.runRefresh({ kind: 'nightly', cellId });
    expect(fakeWeather.faults).toEqual([]);
    expect(fakeWeather.requests).toHaveLength(RETRIES + 1);
    const failedRun = await jobRun(down.runId);
    expect(failedRun).toMatchObject({ kind: 'nightly', status: 'failed', cellsOk: 0, cellsFailed: 1, requests: RETRIES + 1, daysWritten: 0 });
    expect(failedRun.finished).not.toBeNull();
    expect(failedRun.message).toMatch(/HTTP 503/);
    // Nothing stored was dropped or rewritten: forecasts stay until observations replace them.
    expect(await storedDays(cellId)).toEqual(before);
    const [{ leased }] = await sequelize.query<{ leased: number }>('SELECT lease_owner IS NOT NULL AS leased FROM weather_cells WHERE id = ?', {
      replacements: [cellId],
      type: QueryTypes.SELECT,
    });
    expect(Number(leased)).toBe(0);

    // Night 3: the service is back; the run reaches back over the missed night.
    const thirdNight = addDays(first, 2);
    clock = night(thirdNight);
    fakeWeather.requests = [];
    const back = await weather.runRefresh({ kind: 'nightly', cellId });
    expect(await jobRun(back.runId)).toMatchObject({ kind: 'nightly', status: 'ok', cellsOk: 1, cellsFailed: 0 });
    const asked = fakeWeather.requests.map((r) => new URL(r.url)).filter((u) => u.pathname.endsWith('/forecast'));
    expect(asked).toHaveLength(1);
    expect(Number(asked[0].searchParams.get('past_days'))).toBeGreaterThanOrEqual(2);

    const after = await storedDays(cellId);
    const byDate = new Map(after.map((d) => [d.date, d]));
    // The two days the outage left as forecasts are observations now, and no day is missing or estimated.
    expect(byDate.get(first)?.source).toBe('observed');
    expect(byDate.get(secondNight)?.source).toBe('observed');
    const history = new Set(after.filter((d) => d.date < thirdNight).map((d) => d.date));
    expect(findGaps(history, before[0].date, addDays(thirdNight, -1))).toEqual([]);
    expect(after.filter((d) => d.date < thirdNight).every((d) => d.source === 'observed')).toBe(true);
    expect(after.find((d) => d.date === thirdNight)?.source).toBe('forecast');
    // Every observation stored before the outage is still there, unchanged.
    for (const day of before.filter((d) => d.source === 'observed')) {
      expect(byDate.get(day.date), day.date).toMatchObject({ source: 'observed', tmax: day.tmax, tmin: day.tmin });
    }
    await weather.idle();
  });
});
