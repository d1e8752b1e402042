import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { gardenWithClients, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';

const TODAY = '2026-08-20';
const app = testApp({}, testWeather({}, () => new Date(`${TODAY}T17:00:00Z`)));
const { sequelize } = testDb();

describe('plantings that need a look', () => {
  it('when a planting is past its window with no harvest and nothing logged for weeks, then the list, its page and Today say so; a fresh log entry clears the stale flag', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, steadyDays('2021-01-01', addDays(TODAY, -1), 20, 20));
    const variety = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    // Constant weather: the target is reached 50 days from sowing (see progress.test.ts), on 2026-07-21, in
    // recorded weather; a week later with no harvest it is overdue.
    const late = await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-06-01', emergedOn: '2026-06-08' });
    const fresh = await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-08-01' });

    const list = await clients.viewer.get(`${base}/plantings?pageSize=50`);
    expect(list.status).toBe(200);
    const byId = new Map(list.body.items.map((p: { id: number }) => [p.id, p]));
    expect((byId.get(late.id) as { attention: unknown }).attention).toEqual({ overdue: { due: '2026-07-28', days: 23 }, stale: { lastOn: '2026-06-08', days: 73 } });
    expect((byId.get(fresh.id) as { attention: unknown }).attention).toEqual({ overdue: null, stale: null });

    const today = await clients.viewer.get(`${base}/today`);
    expect(today.status).toBe(200);
    const row = today.body.plantings.find((p: { plantingId: number }) => p.plantingId === late.id);
    expect(row.attention).toEqual({ overdue: { due: '2026-07-28', days: 23 }, stale: { lastOn: '2026-06-08', days: 73 } });

    const logged = await clients.grower.post(`${base}/plantings/${late.id}/log`).send({ entryOn: '2026-08-15', kind: 'watered' });
    expect(logged.status).toBe(201);
    expect(logged.body.planting.attention.stale).toBeNull();
    const page = await clients.viewer.get(`${base}/plantings/${late.id}`);
    expect(page.status).toBe(200);
    expect(page.body.planting.attention).toEqual({ overdue: { due: '2026-07-28', days: 23 }, stale: null });
  });
});
