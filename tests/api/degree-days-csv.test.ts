import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { gardenWithClients, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays, daysBetween } from '#shared/thermal/dates';
import type { ProgressDto } from '#shared/schemas/progress';

const TODAY = '2026-06-10';
const app = testApp({}, testWeather({}, () => new Date(`${TODAY}T17:00:00Z`)));
const { sequelize } = testDb();

describe('degree days CSV', () => {
  it('when a viewer downloads a planting’s degree days, then there is one row per day from the start event with the progress series’ figures in the garden’s unit', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, [
      ...steadyDays('2021-01-01', '2026-05-31', 21, 8),
      ...steadyDays('2026-06-01', addDays(TODAY, -1), 26, -2, 'filled'),
      ...steadyDays(TODAY, addDays(TODAY, 6), 30, 14, 'forecast'),
    ]);
    const variety = await makeVariety(garden.id, { dtmDays: 60, dtmFrom: 'sowing' });
    const p = await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-05-01' });
    const progress = (await clients.viewer.get(`${base}/plantings/${p.id}/progress`)).body as ProgressDto;
    const res = await clients.viewer.get(`${base}/plantings/${p.id}/degree-days.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="degree-days-planting-\d+-2026-06-10\.csv"$/);
    const rows = parse(res.text, { bom: true }) as string[][];
    expect(rows[0]).toEqual(['date', 'tmax_F', 'tmin_F', 'source', 'gdd_F_days', 'cumulative_gdd_F_days']);
    const body = rows.slice(1);
    expect(body).toHaveLength(progress.series.length);
    // The start day is day 0 (counted from the next day, as the progress series does): recorded days
    // from the day after sowing through yesterday, then the forecast days.
    expect(progress.startEvent!.on).toBe('2026-05-01');
    expect(body.filter((r) => r[3] !== 'forecast')).toHaveLength(daysBetween('2026-05-01', TODAY) - 1);
    expect(body[0][0]).toBe('2026-05-02');
    expect(body.at(-1)![0]).toBe(addDays(TODAY, 6));
    body.forEach((r, k) => {
      const d = progress.series[k];
      expect(r).toEqual([d.date, String(d.tmax), String(d.tmin), d.source, String(d.dd), String(d.cumulative)]);
    });
    expect(new Set(body.map((r) => r[3]))).toEqual(new Set(['observed', 'filled', 'forecast']));
  });

  it('when the garden counts in °C, then the header names °C', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, steadyDays('2021-01-01', addDays(TODAY, -1), 20, 20));
    const p = await makePlanting(garden.id, { sownOn: '2026-05-20' });
    const res = await clients.viewer.get(`${base}/plantings/${p.id}/degree-days.csv`);
    expect(res.status).toBe(200);
    expect(res.text.split('\r\n')[0]).toBe('\uFEFFdate,tmax_C,tmin_C,source,gdd_C_days,cumulative_gdd_C_days');
  });

  it('when the planting belongs to another garden, then it is not found', async () => {
    const a = await gardenWithClients(app);
    const b = await gardenWithClients(app);
    const p = await makePlanting(b.garden.id, { sownOn: '2026-05-20' });
    expect((await a.clients.viewer.get(`${a.base}/plantings/${p.id}/degree-days.csv`)).status).toBe(404);
  });
});
