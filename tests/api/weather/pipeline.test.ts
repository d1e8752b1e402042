import { resolveDates } from '#shared/format/dates';
import { beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { agent, testApp, testDb, testWeather } from '../../helpers/test-app';
import { addMember, createGarden, gardenWithMembers, signIn } from '../../helpers/factories';
import { fakeWeather } from '../../../fixtures/weather/control';
import { syntheticDay } from '../../../fixtures/weather/generator';
import { addDays } from '#shared/thermal/dates';
import type { WeatherService } from '../../../server/modules/weather/weather.service';
import { RANKED_UPDATE } from '../../../server/modules/weather/weather.repository';
import { findGaps } from '../../../server/modules/weather/weather-gaps';

const { sequelize } = testDb();
beforeEach(() => fakeWeather.reset());

/** Coordinates no earlier run used, so each test gets cells of its own. */
function freshPlace(south = false) {
  const lat = (south ? -1 : 1) * (20 + Math.random() * 40);
  const lon = -170 + Math.random() * 340;
  // Near a cell's centre, so nudging by 0.01° stays inside the same 0.1° cell.
  return { latitude: Math.round(lat * 10) / 10 + 0.02, longitude: Math.round(lon * 10) / 10 + 0.02 };
}

async function locatedGarden(weather: WeatherService, timeZone = 'America/Chicago', south = false) {
  const garden = await createGarden({ ...freshPlace(south), timeZone });
  const cellId = (await weather.locateGarden(garden))!;
  return { garden, cellId };
}

async function rows(cellId: number) {
  return sequelize.query<{ date: string; source: string; tmax: number; tmin: number; note: string | null; fetched: Date }>(
    'SELECT date, source, tmax_c AS tmax, tmin_c AS tmin, fill_note AS note, fetched_at AS fetched FROM weather_days WHERE cell_id = ? ORDER BY date',
    { replacements: [cellId], type: QueryTypes.SELECT },
  );
}

describe('weather pipeline', () => {
  it('when a garden gets its location, then at least ten years of history arrive in yearly batches', async () => {
    const app = testApp();
    const { garden, owner } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, owner.email);
    const place = freshPlace(true);
    await c.patch(`/api/gardens/${garden.id}`).send({ ...place, timeZone: 'Australia/Perth' }).expect(200);
    await (app.locals.weather as WeatherService).idle();
    const res = await c.get(`/api/gardens/${garden.id}/weather`).expect(200);
    expect(res.body.history.complete).toBe(true);
    expect(res.body.history.percent).toBeGreaterThanOrEqual(99);
    const [{ n, first }] = await sequelize.query<{ n: number; first: string }>(
      'SELECT COUNT(*) AS n, MIN(date) AS first FROM weather_days d JOIN gardens g ON g.weather_cell_id = d.cell_id WHERE g.id = ?',
      { replacements: [garden.id], type: QueryTypes.SELECT },
    );
    expect(Number(n)).toBeGreaterThan(3650);
    expect(first.endsWith('-01-01')).toBe(true);
    const archive = fakeWeather.requests.filter((r) => r.url.includes('archive'));
    expect(archive.length).toBeGreaterThanOrEqual(10);
    // Every batch spans at most a year (bounded requests).
    for (const r of archive) {
      const u = new URL(r.url);
      const span = (Date.parse(u.searchParams.get('end_date')!) - Date.parse(u.searchParams.get('start_date')!)) / 864e5;
      expect(span).toBeLessThanOrEqual(366);
    }
  });

  it('when a refresh runs, then past days are observed, today on is forecast, and the unit is the garden’s', async () => {
    const app = testApp();
    const weather = app.locals.weather as WeatherService;
    const { garden, owner } = await gardenWithMembers();
    const place = freshPlace();
    const c = agent(app);
    await signIn(c, owner.email);
    await c.patch(`/api/gardens/${garden.id}`).send({ ...place, timeZone: 'America/Chicago', units: 'F' }).expect(200);
    await weather.idle();
    const res = await c.get(`/api/gardens/${garden.id}/weather`).expect(200);
    expect(res.body.unit).toBe('F');
    const today = res.body.today as string;
    const days = res.body.days as Array<{ date: string; tmax: number; tmin: number; source: string }>;
    expect(days.length).toBe(46);
    expect(days.filter((d) => d.date < today).every((d) => d.source === 'observed')).toBe(true);
    expect(days.filter((d) => d.date >= today).every((d) => d.source === 'forecast')).toBe(true);
    // The stored °C value from the fake, shown in °F (°F = °C × 1.8 + 32).
    const yesterday = addDays(today, -1);
    const truth = syntheticDay(Math.round(place.latitude * 10) / 10, Math.round(place.longitude * 10) / 10, yesterday);
    const shown = days.find((d) => d.date === yesterday)!;
    expect(shown.tmax).toBeCloseTo(Math.round((truth.tmax * 1.8 + 32) * 10) / 10, 5);
    expect(res.body.gaps).toEqual([]);
  });

  it('when the same day is fetched again, then nothing is written (idempotent)', async () => {
    const weather = testWeather();
    const { garden, cellId } = await locatedGarden(weather);
    const first = await weather.runRefresh({ kind: 'manual', gardenId: garden.id, cellId });
    expect(first.cellsOk).toBe(1);
    const before = await rows(cellId);
    await sequelize.query('UPDATE weather_cells SET refreshed_at = NULL WHERE id = ?', { replacements: [cellId] });
    const again = await weather.runRefresh({ kind: 'manual', gardenId: garden.id, cellId });
    expect(again.cellsOk).toBe(1);
    expect(again.daysWritten).toBe(0);
    expect(await rows(cellId)).toEqual(before);
  });

  it('when two app instances run the nightly job at once, then each cell is refreshed exactly once', async () => {
    const a = testWeather();
    const b = testWeather();
    const cells = [];
    for (let i = 0; i < 6; i++) cells.push(await locatedGarden(a));
    const coords = new Set(cells.map((c) => c.cellId));
    const [ra, rb] = await Promise.all([a.runRefresh({ kind: 'nightly' }), b.runRefresh({ kind: 'nightly' })]);
    const ours = await sequelize.query<{ id: number; latitude: number; longitude: number; refreshed: Date | null }>(
      `SELECT id, latitude, longitude, refreshed_at AS refreshed FROM weather_cells WHERE id IN (${[...coords].join(',')})`,
      { type: QueryTypes.SELECT },
    );
    expect(ours.every((c) => c.refreshed !== null)).toBe(true);
    for (const cell of ours) {
      const hits = fakeWeather.requests.filter((r) => {
        const u = new URL(r.url);
        return u.pathname.endsWith('/forecast') && Number(u.searchParams.get('latitude')) === cell.latitude && Number(u.searchParams.get('longitude')) === cell.longitude;
      });
      expect(hits, `cell ${cell.id}`).toHaveLength(1);
    }
    expect(ra.cellsOk + rb.cellsOk).toBeGreaterThanOrEqual(6);
    expect(ra.cellsFailed + rb.cellsFailed).toBe(0);
  });

  it('when one or two days are missing, then they are filled by marked interpolation; longer holes stay gaps', async () => {
    const today = '2026-06-20';
    fakeWeather.today = today;
    const weather = testWeather({}, () => new Date('2026-06-20T12:00:00Z'));
    const { garden, cellId } = await locatedGarden(weather, 'UTC');
    fakeWeather.fail({ kind: 'drop-days', dates: ['2026-06-15', '2026-06-10', '2026-06-09', '2026-06-08', '2026-06-07'] });
    await sequelize.query('UPDATE weather_cells SET history_through = ? WHERE id = ?', { replacements: ['2026-06-01', cellId] });
    const run = await weather.runRefresh({ kind: 'manual', gardenId: garden.id, cellId });
    expect(run.cellsOk).toBe(1);
    const stored = new Map((await rows(cellId)).map((r) => [r.date, r]));
    const filled = stored.get('2026-06-15')!;
    expect(filled.source).toBe('filled');
    // Stored with date tokens; every answer words them in the reader's language (shared/format/dates.ts).
    expect(filled.note).toBe('Linear interpolation between the readings of ⟦2026-06-14⟧ and ⟦2026-06-16⟧');
    expect(resolveDates(filled.note!, 'en-GB', '2026-06-20')).toBe('Linear interpolation between the readings of 14 Jun and 16 Jun');
    const lo = stored.get('2026-06-14')!;
    const hi = stored.get('2026-06-16')!;
    expect(Number(filled.tmax)).toBeCloseTo(Math.round(((Number(lo.tmax) + Number(hi.tmax)) / 2) * 10) / 10, 5);
    expect(stored.has('2026-06-08')).toBe(false);

    const series = await weather.gardenSeries({ id: garden.id, weatherCellId: cellId }, '2026-06-05', '2026-06-19');
    const dates = new Set(series.filter((d) => d.source !== 'forecast').map((d) => d.date));
    expect(findGaps(dates, '2026-06-05', '2026-06-19')).toEqual([{ from: '2026-06-07', to: '2026-06-10', days: 4 }]);

    // A later observation replaces the fill.
    await sequelize.query('UPDATE weather_cells SET refreshed_at = NULL WHERE id = ?', { replacements: [cellId] });
    const again = await weather.runRefresh({ kind: 'manual', gardenId: garden.id, cellId });
    expect(again.cellsOk).toBe(1);
    const after = new Map((await rows(cellId)).map((r) => [r.date, r]));
    expect(after.get('2026-06-15')!.source).toBe('observed');
  });

  it('when the service fails for a cell, then the run is recorded as failed and owners see it; viewers cannot', async () => {
    const app = testApp();
    const weather = app.locals.weather as WeatherService;
    const { garden, owner, viewer, grower } = await gardenWithMembers();
    await garden.update(freshPlace());
    const cellId = (await weather.locateGarden(garden))!;
    const grow = agent(app);
    await signIn(grow, grower.email);
    fakeWeather.fail(...Array.from({ length: 4 }, () => ({ kind: 'status' as const, status: 503 })));
    const res = await grow.post(`/api/gardens/${garden.id}/weather/refresh`).set('X-Requested-With', 'heatclock').expect(200);
    expect(res.body.run, JSON.stringify(res.body)).toMatchObject({ cellsFailed: 1 });
    expect(cellId).toBeGreaterThan(0);
    const own = agent(app);
    await signIn(own, owner.email);
    const runs = await own.get(`/api/gardens/${garden.id}/weather/runs`).expect(200);
    expect(runs.body.runs[0]).toMatchObject({ kind: 'manual', status: 'failed', cellsFailed: 1, requests: 4 });
    expect(runs.body.runs[0].message).toMatch(/HTTP 503/);
    const view = agent(app);
    await signIn(view, viewer.email);
    expect((await view.get(`/api/gardens/${garden.id}/weather/runs`)).status).toBe(403);
    expect((await view.post(`/api/gardens/${garden.id}/weather/refresh`).set('X-Requested-With', 'x')).status).toBe(403);
    await weather.idle();
  });

  it('when two gardens sit within the same 0.1° cell, then one request serves both', async () => {
    const weather = testWeather();
    const place = freshPlace();
    const g1 = await createGarden({ ...place, timeZone: 'America/Chicago' });
    const g2 = await createGarden({ latitude: place.latitude + 0.01, longitude: place.longitude - 0.01, timeZone: 'America/Chicago' });
    const c1 = await weather.locateGarden(g1);
    const c2 = await weather.locateGarden(g2);
    expect(c1).toBe(c2);
    const run = await weather.runRefresh({ kind: 'manual', cellId: c1! });
    expect(run.requests).toBe(1);
    const s1 = await weather.gardenSeries({ id: g1.id, weatherCellId: c1 }, '2000-01-01', '2100-01-01');
    const s2 = await weather.gardenSeries({ id: g2.id, weatherCellId: c2 }, '2000-01-01', '2100-01-01');
    expect(s1).toEqual(s2);
    expect(s1.length).toBeGreaterThan(16);
    void addMember;
  });

  it('when the weather query is malformed, then 400 names the parameter', async () => {
    const app = testApp();
    const { garden, viewer } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, viewer.email);
    const res = await c.get(`/api/gardens/${garden.id}/weather?from=2026-13-01&extra=1`);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['extra', 'from']);
    const huge = await c.get(`/api/gardens/${garden.id}/weather?from=1900-01-01`);
    expect(huge.status).toBe(400);
    expect(huge.body.error.fields.from).toMatch(/at most 800 days/);
    expect((await c.get(`/api/gardens/${garden.id}/weather?from=0001-01-01`)).body.error.fields.from).toMatch(/out of range/);
  });
});

describe('provenance is enforced by the database too', () => {
  it('when a fill is written over an observed day (as a racing writer would), then the observation stays', async () => {
    const weather = testWeather();
    const { cellId } = await locatedGarden(weather);
    await sequelize.transaction((t) => weather.repo.upsertCellDays(cellId, [{ date: '2020-03-03', tmax: 12.5, tmin: 1.5, source: 'observed' }], t));
    // A writer whose read saw no observation yet: its statement reaches the row after the observation did.
    await sequelize.query(
      `INSERT INTO weather_days (cell_id, date, tmax_c, tmin_c, source, fill_note, fetched_at)
       VALUES (?, '2020-03-03', 9.9, 0.1, 'filled', 'racing fill', UTC_TIMESTAMP(3))
       ON DUPLICATE KEY UPDATE ${RANKED_UPDATE}`,
      { replacements: [cellId] },
    );
    const [row] = (await rows(cellId)).filter((r) => r.date === '2020-03-03');
    expect(row.source).toBe('observed');
    expect(Number(row.tmax)).toBe(12.5);
  });
});

describe('old gaps are asked for again', () => {
  it('when a day more than 92 days back is missing, then the nightly repair fetches it from the archive', async () => {
    const weather = testWeather();
    const { cellId } = await locatedGarden(weather);
    await weather.backfill(cellId);
    const hole = addDays(weather.today({ timeZone: 'America/Chicago' }), -200);
    await sequelize.query('DELETE FROM weather_days WHERE cell_id = ? AND date BETWEEN ? AND ?', {
      replacements: [cellId, hole, addDays(hole, 4)],
    });
    fakeWeather.requests = [];
    const repaired = await weather.repairOldGaps();
    expect(repaired).toBeGreaterThanOrEqual(5);
    const stored = new Map((await rows(cellId)).map((r) => [r.date, r]));
    expect(stored.get(hole)?.source).toBe('observed');
    const asked = fakeWeather.requests.map((r) => new URL(r.url)).filter((u) => u.searchParams.get('start_date') === hole);
    expect(asked).toHaveLength(1);
    expect(asked[0].searchParams.get('end_date')).toBe(addDays(hole, 4));
  });
});
