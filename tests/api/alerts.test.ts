import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { agent, testApp, testDb, testWeather } from '../helpers/test-app';
import { signIn } from '../helpers/factories';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import { fToC } from '#shared/thermal/units';
import type { DailyTemp } from '#shared/thermal/types';
import type { AlertDto } from '#shared/schemas/alerts';
import type { AlertService } from '../../server/modules/alerts/alerts.service';
import type { Worker } from '../../server/jobs/worker';

const TODAY = '2026-06-10';
const now = () => new Date(`${TODAY}T17:00:00Z`);
const app = testApp({}, testWeather({}, now));
const { sequelize } = testDb();
const alertsOf = (a: typeof app) => a.locals.alerts as AlertService;

/** Mild past weather (no bolt trigger but long June days), then the given forecast. */
function weatherWith(forecast: DailyTemp[]): DailyTemp[] {
  return [...steadyDays('2021-01-01', addDays(TODAY, -1), 18, 9), ...forecast];
}

async function list(client: ReturnType<typeof agent>, base: string, query = '') {
  const res = await client.get(`${base}/alerts${query}`);
  expect(res.status).toBe(200);
  return res.body.items as AlertDto[];
}

async function alertRows(gardenId: number) {
  return sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM alerts WHERE garden_id = ?', { replacements: [gardenId], type: QueryTypes.SELECT });
}

describe('alerts', () => {
  it('when a heat wave is forecast for lettuce, then a bolt-risk alert gives the figures in the garden’s unit; peas never get one', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, weatherWith(steadyDays(TODAY, addDays(TODAY, 6), 31, 18, 'forecast')));
    const bed = await makeBed(garden.id);
    const lettuce = await makePlanting(garden.id, { bedId: bed.id, varietyId: (await makeVariety(garden.id, { dtmDays: 55, boltTolerance: 2 })).id, sownOn: '2026-05-01' });
    const pea = await makePlanting(garden.id, { bedId: bed.id, varietyId: (await makeVariety(garden.id, { cropKey: 'pea', dtmDays: 60, boltTolerance: null })).id, sownOn: '2026-05-01' });
    const items = await list(clients.viewer, base);
    const bolt = items.filter((a) => a.type === 'bolt-risk');
    expect(bolt.map((a) => a.plantingId)).toEqual([lettuce.id]);
    expect(bolt[0]).toMatchObject({ status: 'open', severity: expect.stringMatching(/watch|warning/), caution: expect.stringMatching(/heat-safety/) });
    // Lettuce's heat threshold is 27 °C ≈ 80.6 °F (SCIENCE §3, from memory), worded in °F for this garden.
    expect(bolt[0].reasons.join(' ')).toMatch(/days in a row with highs above 80\.6 °F.*forecast/);
    expect(bolt[0].reasons.join(' ')).not.toMatch(/°C/);
    expect(items.some((a) => a.plantingId === pea.id && a.type === 'bolt-risk')).toBe(false);
    const counts = await clients.viewer.get(`${base}/alerts/counts`);
    expect(counts.body.byType['bolt-risk']).toBe(1);
  });

  it('when a light freeze is forecast, then tender tomatoes are alerted and very hardy lettuce is not (Purdue HO-203 classes, NWS categories, SCIENCE §4)', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, weatherWith([...steadyDays(TODAY, addDays(TODAY, 2), 12, 5, 'forecast'), { date: addDays(TODAY, 3), tmax: 8, tmin: fToC(30), source: 'forecast' }]));
    const bed = await makeBed(garden.id);
    const tomato = await makePlanting(garden.id, { bedId: bed.id, varietyId: (await makeVariety(garden.id, { cropKey: 'tomato', dtmDays: 70, dtmFrom: 'transplant', boltTolerance: null })).id, method: 'transplant', sownOn: null, transplantedOn: '2026-05-20' });
    const lettuce = await makePlanting(garden.id, { bedId: bed.id, sownOn: '2026-05-20' });
    const frost = (await list(clients.viewer, base, '?type=frost'));
    expect(frost.map((a) => a.plantingId)).toEqual([tomato.id]);
    expect(frost[0]).toMatchObject({ startsOn: addDays(TODAY, 3), severity: 'watch', title: expect.stringMatching(/Light freeze forecast/) });
    expect(frost[0].reasons[0]).toMatch(/low of 30 °F is at or below 32 °F/);
    expect(frost[0].caution).toMatch(/fire codes/);
    expect(frost.some((a) => a.plantingId === lettuce.id)).toBe(false);
  });

  it('when one cold night is forecast for peppers, then no chilling alert; three in a row raise one', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const warm = (from: string, n: number) => steadyDays(from, addDays(from, n - 1), 26, 16, 'forecast');
    await giveGardenWeather(sequelize, garden, weatherWith([...warm(TODAY, 2), { date: addDays(TODAY, 2), tmax: 20, tmin: 8, source: 'forecast' }, ...warm(addDays(TODAY, 3), 4)]));
    const pepper = await makeVariety(garden.id, { cropKey: 'pepper', dtmDays: 70, dtmFrom: 'transplant', boltTolerance: null });
    await makePlanting(garden.id, { varietyId: pepper.id, method: 'transplant', sownOn: null, transplantedOn: '2026-05-25' });
    expect(await list(clients.viewer, base, '?type=chilling')).toEqual([]);

    const { clients: c2, base: b2, garden: g2 } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, g2, weatherWith([...warm(TODAY, 2), ...steadyDays(addDays(TODAY, 2), addDays(TODAY, 4), 18, 7, 'forecast'), ...warm(addDays(TODAY, 5), 2)]));
    const pepper2 = await makeVariety(g2.id, { cropKey: 'pepper', dtmDays: 70, dtmFrom: 'transplant', boltTolerance: null });
    await makePlanting(g2.id, { varietyId: pepper2.id, method: 'transplant', sownOn: null, transplantedOn: '2026-05-25' });
    const chill = await list(c2.viewer, b2, '?type=chilling');
    expect(chill).toHaveLength(1);
    expect(chill[0].reasons[0]).toMatch(/3 days in a row/);
  });

  it('when evaluation runs again, and twice at once from two app instances, then no alert is duplicated; a passing condition is resolved and kept', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const cellId = await giveGardenWeather(sequelize, garden, weatherWith([...steadyDays(TODAY, addDays(TODAY, 1), 12, 5, 'forecast'), { date: addDays(TODAY, 2), tmax: 8, tmin: fToC(30), source: 'forecast' }]));
    const tomato = await makeVariety(garden.id, { cropKey: 'tomato', dtmDays: 70, dtmFrom: 'transplant', boltTolerance: null });
    await makePlanting(garden.id, { varietyId: tomato.id, method: 'transplant', sownOn: null, transplantedOn: '2026-05-20' });
    const other = testApp({}, testWeather({}, now));
    await alertsOf(app).evaluate(garden.id);
    const first = Number((await alertRows(garden.id))[0].n);
    expect(first).toBeGreaterThan(0);
    await Promise.all([alertsOf(app).evaluate(garden.id), alertsOf(other).evaluate(garden.id), alertsOf(other).evaluate(garden.id)]);
    expect(Number((await alertRows(garden.id))[0].n)).toBe(first);

    // The forecast warms: the frost alert passes, is resolved, and stays in the history.
    await sequelize.query("UPDATE weather_days SET tmax_c = 22, tmin_c = 12 WHERE cell_id = ? AND source = 'forecast'", { replacements: [cellId] });
    await sequelize.query('DELETE FROM planting_progress WHERE garden_id = ?', { replacements: [garden.id] });
    await alertsOf(app).evaluate(garden.id);
    const resolved = await list(clients.viewer, base, '?status=resolved&type=frost');
    expect(resolved).toHaveLength(1);
    expect(resolved[0].resolvedAt).not.toBeNull();
    expect(await list(clients.viewer, base, '?status=open&type=frost')).toEqual([]);
  });

  it('when a frost spell is seen again two days later, then it is the same alert, not a new one', async () => {
    const { garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, weatherWith([...steadyDays(TODAY, TODAY, 12, 5, 'forecast'), ...steadyDays(addDays(TODAY, 1), addDays(TODAY, 4), 6, fToC(30), 'forecast')]));
    const tomato = await makeVariety(garden.id, { cropKey: 'tomato', dtmDays: 70, dtmFrom: 'transplant', boltTolerance: null });
    await makePlanting(garden.id, { varietyId: tomato.id, method: 'transplant', sownOn: null, transplantedOn: '2026-05-20' });
    await alertsOf(app).evaluate(garden.id);
    const later = testApp({}, testWeather({}, () => new Date(`${addDays(TODAY, 2)}T17:00:00Z`)));
    await alertsOf(later).evaluate(garden.id);
    const rows = await sequelize.query<{ id: number; status: string; first_on: string }>("SELECT id, status, first_on FROM alerts WHERE garden_id = ? AND type = 'frost'", { replacements: [garden.id], type: QueryTypes.SELECT });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ status: 'open', first_on: addDays(TODAY, 1) });
  });

  it('when a grower acknowledges, then the alert is acknowledged by name; a viewer cannot', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, weatherWith(steadyDays(TODAY, addDays(TODAY, 6), 31, 18, 'forecast')));
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { dtmDays: 55, boltTolerance: 1 })).id, sownOn: '2026-05-01' });
    const [alert] = await list(clients.viewer, base, '?type=bolt-risk');
    expect((await clients.viewer.post(`${base}/alerts/${alert.id}/acknowledge`)).status).toBe(403);
    const ack = await clients.grower.post(`${base}/alerts/${alert.id}/acknowledge`);
    expect(ack.status).toBe(200);
    expect(ack.body.alert).toMatchObject({ status: 'acknowledged', acknowledgedBy: 'Grower' });
    expect((await clients.outsider.post(`${base}/alerts/${alert.id}/acknowledge`)).status).toBe(404);
    expect((await clients.viewer.get(`${base}/alerts?status=closed`)).body.error.fields).toHaveProperty('status');
  });

  it('when a station upload changes the weather, then the alerts processor evaluates the garden after commit', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, weatherWith([]));
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { dtmDays: 55, boltTolerance: 1 })).id, sownOn: '2026-05-01' });
    const hot = steadyDays(addDays(TODAY, -4), addDays(TODAY, -1), 32, 19).map((d) => `${d.date},${d.tmax},${d.tmin}`);
    const upload = await clients.grower
      .post(`${base}/weather/imports`)
      .field('unit', 'C')
      .attach('file', Buffer.from(`date,high,low\n${hot.join('\n')}\n`), { filename: 'station.csv', contentType: 'text/csv' });
    expect(upload.status).toBe(201);
    await (app.locals.worker as Worker).drain();
    const [row] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM alerts WHERE garden_id = ? AND type = 'bolt-risk' AND status = 'open'", { replacements: [garden.id], type: QueryTypes.SELECT });
    expect(Number(row.n)).toBe(1);
  });

  it('when days of weather are missing for more than two days, then a garden-wide data-gap alert says which', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const days = weatherWith([]).filter((d) => d.date < addDays(TODAY, -8) || d.date > addDays(TODAY, -6));
    await giveGardenWeather(sequelize, garden, days);
    const [gap] = await list(clients.viewer, base, '?type=data-gap');
    expect(gap).toMatchObject({ plantingId: null, startsOn: addDays(TODAY, -8), endsOn: addDays(TODAY, -6), title: 'Weather missing for 3 days' });
    const today = await clients.viewer.get(`${base}/today`);
    expect(today.body.actions.map((a: { kind: string }) => a.kind)).toContain('data-gap');
  });

  it('when Today is opened, then its attention list is the garden’s open alerts', async () => {
    const { base, garden, viewer } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, weatherWith(steadyDays(TODAY, addDays(TODAY, 6), 31, 18, 'forecast')));
    await makePlanting(garden.id, { varietyId: (await makeVariety(garden.id, { dtmDays: 55, boltTolerance: 1 })).id, sownOn: '2026-05-01' });
    const client = agent(app);
    await signIn(client, viewer.email);
    const today = await client.get(`${base}/today`);
    const open = await list(client, base, '?status=open');
    expect(today.body.actions.map((a: { alertId: number }) => a.alertId).sort()).toEqual(open.map((a) => a.id).sort());
    expect(today.body.actions.find((a: { kind: string }) => a.kind.startsWith('bolt'))?.caution).toMatch(/heat-safety/);
  });
});
