import { beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { addDays, cToF, fToC } from '#shared/thermal';
import type { GardenSoilResponse } from '#shared/schemas/soil';
import type { WeatherResponse } from '#shared/schemas/weather';
import { agent, testApp, testDb, testWeather } from '../../helpers/test-app';
import { createGarden, gardenWithMembers, signIn } from '../../helpers/factories';
import { gardenWithClients } from '../../helpers/garden-records';
import { fakeWeather } from '../../../fixtures/weather/control';
import { syntheticSoil } from '../../../fixtures/weather/generator';
import { SOIL_MIN_HOURS, parseSoilDaily } from '../../../server/integrations/weather/open-meteo';
import { localDate } from '../../../server/lib/local-date';

const { sequelize } = testDb();
beforeEach(() => fakeWeather.reset());

const place = () => ({ latitude: Math.round((25 + Math.random() * 30) * 10) / 10 + 0.02, longitude: Math.round((-120 + Math.random() * 60) * 10) / 10 + 0.02 });

describe('soil temperature from the weather service (hourly soil_temperature_6cm → daily mean)', () => {
  it('when a response carries hourly soil values, then each local day’s mean is kept in °C, and a day short of hours or a broken value is left out', () => {
    const time: string[] = [];
    const values: unknown[] = [];
    // °F: 23 hours at 50 and one at 95 (a sensor spike the service passed on), mean 51.9 °F = 11.1 °C;
    // the spike's hour is then broken, so the mean of the other 23 is 50 °F = 10.0 °C.
    for (let h = 0; h < 24; h++) {
      time.push(`2026-05-01T${String(h).padStart(2, '0')}:00`);
      values.push(h === 3 ? 95 : 50);
    }
    for (let h = 0; h < SOIL_MIN_HOURS - 1; h++) {
      time.push(`2026-05-02T${String(h).padStart(2, '0')}:00`);
      values.push(60);
    }
    const body = (v: unknown[]) => ({ hourly_units: { time: 'iso8601', soil_temperature_6cm: '°F' }, hourly: { time, soil_temperature_6cm: v } });
    expect(parseSoilDaily(body(values)).get('2026-05-01')).toBeCloseTo(Math.round(fToC((23 * 50 + 95) / 24) * 10) / 10, 6);
    values[3] = 'warm'; // one broken hour on the 1st: 23 hours still stand
    const soil = parseSoilDaily(body(values));
    expect([...soil.keys()]).toEqual(['2026-05-01']);
    expect(soil.get('2026-05-01')).toBe(10);
    expect(parseSoilDaily({ daily: {} }).size).toBe(0);
  });

  it('when the nightly refresh runs, then soil days are stored and the weather API’s days carry soil in the garden’s unit, damped against the air, a thermometer reading winning', async () => {
    const weather = testWeather();
    const garden = await createGarden({ ...place(), timeZone: 'America/Denver' });
    await garden.update({ units: 'F' });
    const cellId = (await weather.locateGarden(garden))!;
    await weather.runRefresh({ kind: 'manual', gardenId: garden.id, cellId });
    const asked = fakeWeather.requests.map((r) => new URL(r.url)).find((u) => u.pathname.endsWith('/forecast'))!;
    expect(asked.searchParams.get('hourly')).toBe('soil_temperature_6cm');
    const stored = await sequelize.query<{ date: string; soil: string; source: string }>('SELECT date, soil_c AS soil, source FROM soil_days WHERE cell_id = ? ORDER BY date', {
      replacements: [cellId],
      type: QueryTypes.SELECT,
    });
    expect(stored.length).toBeGreaterThan(20);
    const today = localDate('America/Denver');
    const yesterday = stored.find((d) => d.date === addDays(today, -1))!;
    expect(yesterday.source).toBe('observed');
    const cell = { latitude: garden.latitude!, longitude: garden.longitude! };
    // The fake's own daily mean, as the service would give it (the hours average to it within rounding).
    expect(Number(yesterday.soil)).toBeCloseTo(syntheticSoil(cell.latitude, cell.longitude, yesterday.date), 0);

    const app = testApp({}, weather);
    const { owner } = await gardenWithMembers();
    await sequelize.query("INSERT INTO memberships (user_id, garden_id, role, created_at, updated_at) VALUES (?, ?, 'owner', NOW(), NOW())", { replacements: [owner.id, garden.id] });
    const c = agent(app);
    await signIn(c, owner.email);
    const res = await c.get(`/api/gardens/${garden.id}/weather`).expect(200);
    const body = res.body as WeatherResponse;
    const day = body.days.find((d) => d.date === yesterday.date)!;
    expect(day.soilSource).toBe('observed');
    expect(day.soil).toBeCloseTo(Math.round(cToF(Number(yesterday.soil)) * 10) / 10, 5);
    // Soil swings less than the air from day to day (the fake damps it; a check of the fake, not of the world).
    const withSoil = body.days.filter((d) => d.soil != null);
    const spread = (xs: number[]) => Math.max(...xs) - Math.min(...xs);
    const steps = (xs: number[]) => xs.slice(1).reduce((s, x, i) => s + Math.abs(x - xs[i]!), 0);
    expect(steps(withSoil.map((d) => d.soil!))).toBeLessThan(steps(withSoil.map((d) => (d.tmax + d.tmin) / 2)));
    expect(spread(withSoil.map((d) => d.soil!))).toBeLessThan(spread(withSoil.map((d) => d.tmax)));
    // The grower's thermometer wins over the service for its day.
    await c.post(`/api/gardens/${garden.id}/soil/readings`).set('X-Requested-With', 'heatclock-test').send({ readOn: yesterday.date, temperature: 40 }).expect(201);
    const after = (await c.get(`/api/gardens/${garden.id}/weather`).expect(200)).body as WeatherResponse;
    expect(after.days.find((d) => d.date === yesterday.date)).toMatchObject({ soil: 40, soilSource: 'reading' });
  });
});

describe('the grower’s thermometer and sowing by soil temperature (/api/gardens/:gardenId/soil)', () => {
  it('when a grower logs 48.2 °F in a °F garden, then today reads it, spinach comes up in about 14 days and beans wait for 60 °F', async () => {
    const app = testApp();
    const ctx = await gardenWithClients(app);
    await ctx.garden.update({ units: 'F', timeZone: 'UTC' });
    const today = localDate('UTC');
    const res = await ctx.clients.grower.post(`${ctx.base}/soil/readings`).send({ readOn: today, temperature: 48.2, depthCm: 5, note: 'north bed, 8 am' });
    expect(res.status).toBe(201);
    expect(res.body.reading).toMatchObject({ readOn: today, temperature: 48.2, depthCm: 5, note: 'north bed, 8 am' });
    expect(res.body.reading.by).toBeTruthy();

    const soil = (await ctx.clients.viewer.get(`${ctx.base}/soil`).expect(200)).body as GardenSoilResponse;
    expect(soil.current).toEqual({ date: today, temperature: 48.2, source: 'reading' });
    const spinach = soil.crops.find((c) => c.key === 'spinach')!;
    // 48.2 °F lies between the table's 41 °F (22.5 d) and 50 °F (11.7 d): 13.9 days.
    expect(spinach).toMatchObject({ status: 'cool', interpolated: true });
    expect(spinach.emergenceDays).toBeCloseTo(22.5 + (11.7 - 22.5) * (7.2 / 9), 1);
    expect(spinach.words).toBe('Slow but sowable: comes up in about 14 days.');
    const bean = soil.crops.find((c) => c.key === 'snap-bean')!;
    expect(bean).toMatchObject({ status: 'too-cold', emergenceDays: null, germ: { min: 60, opt: 80, max: 95 } });
    expect(bean.words).toBe('Too cold: below its 60 °F minimum the seed is likely to rot — wait for 60 °F.');
    expect(soil.emergenceSource).toMatch(/Harrington & Minges 1954/);
    // Two readings on one day: their mean stands for the day.
    await ctx.clients.grower.post(`${ctx.base}/soil/readings`).send({ readOn: today, temperature: 51.8 }).expect(201);
    const again = (await ctx.clients.viewer.get(`${ctx.base}/soil`).expect(200)).body as GardenSoilResponse;
    expect(again.current?.temperature).toBeCloseTo(50, 1);
    expect(again.readings.map((r) => r.temperature)).toEqual([51.8, 48.2]);
  });

  it('when a reading is typed exactly at a crop’s limit in °F, then it counts as at the limit, not past it', async () => {
    const app = testApp();
    const ctx = await gardenWithClients(app);
    await ctx.garden.update({ units: 'F', timeZone: 'UTC' });
    await ctx.clients.grower.post(`${ctx.base}/soil/readings`).send({ readOn: localDate('UTC'), temperature: 40 }).expect(201);
    const soil = (await ctx.clients.viewer.get(`${ctx.base}/soil`).expect(200)).body as GardenSoilResponse;
    expect(soil.current?.temperature).toBe(40);
    // Beet sprouts from 40 °F (Oregon State Ext.); the table has 41 °F as its nearest column, so no day figure.
    expect(soil.crops.find((c) => c.key === 'beet')?.status).toBe('cool');
    // Lettuce at 41 °F would be a column (14.9 d); at 40 °F it is read between 32 and 41.
    expect(soil.crops.find((c) => c.key === 'lettuce')?.emergenceDays).toBeCloseTo(49 + (14.9 - 49) * (8 / 9), 1);
  });

  it('when a reading is out of range, in the future or not a number, then 4xx names the field and nothing is stored', async () => {
    const app = testApp();
    const ctx = await gardenWithClients(app);
    await ctx.garden.update({ units: 'C', timeZone: 'UTC' });
    const today = localDate('UTC');
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ readOn: today, temperature: 75 }, 'temperature'],
      [{ readOn: today, temperature: 'cold' }, 'temperature'],
      [{ readOn: addDays(today, 2), temperature: 10 }, 'readOn'],
      [{ readOn: 'yesterday', temperature: 10 }, 'readOn'],
      [{ readOn: today, temperature: 10, depthCm: -3 }, 'depthCm'],
    ];
    for (const [body, field] of cases) {
      const res = await ctx.clients.grower.post(`${ctx.base}/soil/readings`).send(body);
      expect([400, 422], JSON.stringify(body)).toContain(res.status);
      expect(Object.keys(res.body.error.fields), JSON.stringify(body)).toEqual([field]);
    }
    const [{ n }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM soil_readings WHERE garden_id = ?', { replacements: [ctx.garden.id], type: QueryTypes.SELECT });
    expect(Number(n)).toBe(0);
  });

  it('when a reading is deleted, then it is gone; another garden’s reading is a 404', async () => {
    const app = testApp();
    const a = await gardenWithClients(app);
    const b = await gardenWithClients(app);
    const today = localDate(a.garden.timeZone);
    const made = await a.clients.grower.post(`${a.base}/soil/readings`).send({ readOn: today, temperature: 12 }).expect(201);
    await b.clients.grower.delete(`${b.base}/soil/readings/${made.body.reading.id}`).expect(404);
    await a.clients.grower.delete(`${a.base}/soil/readings/${made.body.reading.id}`).expect(204);
    expect(((await a.clients.viewer.get(`${a.base}/soil`).expect(200)).body as GardenSoilResponse).readings).toEqual([]);
  });

  it('when nothing is known of the soil, then current is null and no crop advice is made up', async () => {
    const app = testApp();
    const ctx = await gardenWithClients(app);
    const soil = (await ctx.clients.viewer.get(`${ctx.base}/soil`).expect(200)).body as GardenSoilResponse;
    expect(soil.current).toBeNull();
    expect(soil.crops).toEqual([]);
  });
});

