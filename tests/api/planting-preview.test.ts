import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { gardenWithClients, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import { fToC } from '#shared/thermal/units';
import type { PlantingPreviewDto } from '#shared/schemas/plantings';

const TODAY = '2026-04-10';
const app = testApp({}, testWeather({}, () => new Date(`${TODAY}T17:00:00Z`)));
const { sequelize } = testDb();

describe('the new-planting harvest preview', () => {
  it('when a variety and a sowing date are chosen, then the window is the progress computation’s, and nothing is saved', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    // Constant 20 °C: the projection lands on the packet's 50 days (progress.test.ts checks the same).
    await giveGardenWeather(sequelize, garden, steadyDays('2021-01-01', addDays(TODAY, -1), 20, 20));
    const variety = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    const res = await clients.viewer.get(`${base}/plantings/preview?varietyId=${variety.id}&method=direct-sow&sownOn=2026-05-01`);
    expect(res.status).toBe(200);
    const p = res.body as PlantingPreviewDto;
    expect(p.startEvent).toEqual({ kind: 'sowing', on: '2026-05-01' });
    expect(p.maturity).toMatchObject({ p10: '2026-06-20', p50: '2026-06-20', p90: '2026-06-20', kind: 'analog' });
    // Lettuce's base 40 °F (Univ. of Delaware): 50 days of (20 − 4.44) °C-days.
    expect(p.target).toBeCloseTo(50 * (20 - fToC(40)), 0);
    expect(p.unit).toBe('C');
    const list = await clients.viewer.get(`${base}/plantings`);
    expect(list.body.total).toBe(0);
  });

  it('when past seasons started that day were hot at harvest, then a lettuce gets a bolt warning in words; a pea never does', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    // Steady 33/22 °C: above lettuce's bolting heat on every day of every past season.
    await giveGardenWeather(sequelize, garden, steadyDays('2021-01-01', addDays(TODAY, -1), 33, 22));
    const lettuce = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    const res = await clients.viewer.get(`${base}/plantings/preview?varietyId=${lettuce.id}&method=direct-sow&sownOn=2026-05-01`);
    expect(res.status).toBe(200);
    const season = (res.body as PlantingPreviewDto).boltSeason!;
    expect(season.years).toBeGreaterThanOrEqual(4);
    expect(season.highShare).toBe(1);
    expect(season.warning).toMatch(/^High bolt risk: Lettuce sown on 1 May would have met bolting heat or long days while ready to pick in \d of the last \d seasons here\./);

    const pea = await makeVariety(garden.id, { cropKey: 'pea', name: 'Test pea', dtmDays: 60 });
    const peaPreview = await clients.viewer.get(`${base}/plantings/preview?varietyId=${pea.id}&method=direct-sow&sownOn=2026-05-01`);
    expect(peaPreview.status).toBe(200);
    expect(peaPreview.body.boltSeason).toBeNull();
  });

  it('when the query is incomplete or names another garden’s variety, then the error names the field', async () => {
    const { clients, base } = await gardenWithClients(app);
    const other = await gardenWithClients(app);
    const foreign = await makeVariety(other.garden.id);
    const missing = await clients.viewer.get(`${base}/plantings/preview?method=direct-sow&sownOn=2026-05-01`);
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('varietyId');
    const bad = await clients.viewer.get(`${base}/plantings/preview?varietyId=${foreign.id}&method=direct-sow&sownOn=2026-13-01`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('sownOn');
    const theirs = await clients.viewer.get(`${base}/plantings/preview?varietyId=${foreign.id}&method=direct-sow&sownOn=2026-05-01`);
    expect(theirs.status).toBe(400);
    expect(theirs.body.error.fields.varietyId).toBe('Choose a variety of this garden.');
    const outsider = await clients.outsider.get(`${base}/plantings/preview?varietyId=${foreign.id}&method=direct-sow&sownOn=2026-05-01`);
    expect(outsider.status).toBe(404);
  });
});
