import { describe, expect, it } from 'vitest';
import { agent, testApp, testDb, testWeather } from '../helpers/test-app';
import type { TestAgent } from '../helpers/test-app';
import { signIn } from '../helpers/factories';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { syntheticDay } from '../../fixtures/weather/generator';
import { addDays, daysBetween } from '#shared/thermal/dates';
import { dailyDegreeDays } from '#shared/thermal/index';
import { fToC } from '#shared/thermal/units';
import type { DailyTemp } from '#shared/thermal/types';
import type { ProgressDto } from '#shared/schemas/progress';
import type { Worker } from '../../server/jobs/worker';

const TODAY = '2026-06-10';
const at = (day: string) => () => new Date(`${day}T17:00:00Z`);
const app = testApp({}, testWeather({}, at(TODAY)));
const { sequelize } = testDb();

/** The fake weather service's invented weather for a place, as recorded days. */
function synthetic(latitude: number, longitude: number, from: string, to: string): DailyTemp[] {
  return Array.from({ length: daysBetween(from, to) + 1 }, (_, k) => {
    const date = addDays(from, k);
    return { date, ...syntheticDay(latitude, longitude, date), source: 'observed' as const };
  });
}

async function progressOf(client: TestAgent, base: string, id: number) {
  const res = await client.get(`${base}/plantings/${id}/progress`);
  expect(res.status).toBe(200);
  return res.body as ProgressDto;
}

describe('planting progress', () => {
  it('when temperatures are constant, then the projection lands exactly on the packet’s date (start day is day 0, common practice, no source)', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, steadyDays('2021-01-01', addDays(TODAY, -1), 20, 20));
    const variety = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    const p = await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-05-20' });
    const g = await progressOf(clients.viewer, base, p.id);
    expect(g.packetDate).toBe('2026-07-09');
    expect(g.maturity).toMatchObject({ p10: '2026-07-09', p50: '2026-07-09', p90: '2026-07-09' });
    expect(g.maturity.basis).toMatchObject({ kind: 'analog', observedDays: 20 });
    // 20 °C against lettuce's base 40 °F (Univ. of Delaware): 20 − 4.44 °C-days a day, 50 days.
    expect(g.target).toBeCloseTo(50 * (20 - fToC(40)), 0);
    expect(g.accumulated).toBeCloseTo(20 * (20 - fToC(40)), 0);
    expect(g.startEvent).toEqual({ kind: 'sowing', on: '2026-05-20' });
  });

  it('when the packet counts from emergence, then the days to emergence are added once', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, steadyDays('2021-01-01', addDays(TODAY, -1), 18, 18));
    const variety = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'emergence', emergenceDaysMin: 4, emergenceDaysMax: 8 });
    const p = await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-05-25' });
    const g = await progressOf(clients.viewer, base, p.id);
    expect(g.packetDate).toBe(addDays('2026-05-25', 58));
    expect(g.maturity.p50).toBe(addDays('2026-05-25', 58));
    expect(g.target).toBeCloseTo(58 * (18 - fToC(40)), 0);
  });

  it('when a planting is read, then its degree days equal an independent sum of the engine’s daily values over the stored weather', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const days = synthetic(garden.latitude!, garden.longitude!, '2016-01-01', addDays(TODAY, -1));
    await giveGardenWeather(sequelize, garden, days);
    const variety = await makeVariety(garden.id, { dtmDays: 60, dtmFrom: 'sowing' });
    const p = await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-04-15' });
    const g = await progressOf(clients.viewer, base, p.id);
    const [stored] = (await sequelize.query(
      'SELECT tmax_c AS tmax, tmin_c AS tmin FROM weather_days WHERE cell_id = ? AND date > ? AND date < ? ORDER BY date',
      { replacements: [garden.weatherCellId, '2026-04-15', TODAY] },
    )) as [Array<{ tmax: string; tmin: string }>, unknown];
    // Lettuce: base 40 °F, single sine, horizontal cutoff, no upper threshold (crop library).
    const sumC = stored.reduce((s, d) => s + dailyDegreeDays(Number(d.tmax), Number(d.tmin), { base: fToC(40), method: 'single-sine' }), 0);
    expect(g.unit).toBe('F');
    expect(g.accumulated).toBeCloseTo(sumC * 1.8, 0);
    expect(g.series.filter((d) => d.date < TODAY).at(-1)!.cumulative).toBeCloseTo(sumC * 1.8, 0);
    expect(g.series.every((d) => d.source === 'observed')).toBe(true);
    expect(g.base).toBeCloseTo(40, 5);
  });

  it('when more days are observed, then the maturity window narrows', async () => {
    const { clients, base, garden, viewer } = await gardenWithClients(app);
    // Past seasons each at their own steady warmth (12–20 °C), so analog years disagree; this season at 16 °C.
    const years = Array.from({ length: 10 }, (_, k) => steadyDays(`${2016 + k}-01-01`, `${2016 + k}-12-31`, 12 + (k % 5) * 2, 12 + (k % 5) * 2));
    await giveGardenWeather(sequelize, garden, [...years.flat(), ...steadyDays('2026-01-01', '2026-08-20', 16, 16)]);
    const variety = await makeVariety(garden.id, { dtmDays: 70, dtmFrom: 'sowing' });
    const p = await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-05-01' });
    const width = (g: ProgressDto) => daysBetween(g.maturity.p10!, g.maturity.p90!);
    const early = await progressOf(clients.viewer, base, p.id);
    const later = agent(testApp({}, testWeather({}, at('2026-07-01'))));
    await signIn(later, viewer.email);
    const late = await progressOf(later, base, p.id);
    expect(early.maturity.basis.kind).toBe('analog');
    expect(width(late)).toBeLessThan(width(early));
    expect(late.maturity.basis.observedDays).toBeGreaterThan(early.maturity.basis.observedDays);
  });

  it('when a hot, long-day spell is forecast, then a lettuce planting’s bolt risk rises with the figures in its reasons, and a slow-bolting variety stays lower', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const past = synthetic(garden.latitude!, garden.longitude!, '2018-01-01', addDays(TODAY, -1)).map((d) => (d.date >= '2026-05-01' ? { ...d, tmax: 21, tmin: 10 } : d));
    const forecast = steadyDays(TODAY, addDays(TODAY, 6), 31, 18, 'forecast');
    await giveGardenWeather(sequelize, garden, [...past, ...forecast]);
    const bed = await makeBed(garden.id);
    const quick = await makeVariety(garden.id, { dtmDays: 55, boltTolerance: 1 });
    const slow = await makeVariety(garden.id, { dtmDays: 55, boltTolerance: 5 });
    const a = await makePlanting(garden.id, { bedId: bed.id, varietyId: quick.id, sownOn: '2026-05-01' });
    const b = await makePlanting(garden.id, { bedId: bed.id, varietyId: slow.id, sownOn: '2026-05-01' });
    const ga = await progressOf(clients.viewer, base, a.id);
    const gb = await progressOf(clients.viewer, base, b.id);
    const rank = { none: 0, low: 1, elevated: 2, high: 3 } as const;
    expect(ga.boltRisk.highFrom).not.toBeNull();
    expect(ga.boltRisk.highFrom! >= TODAY && ga.boltRisk.highFrom! <= addDays(TODAY, 6)).toBe(true);
    const high = ga.boltRisk.days.find((d) => d.date === ga.boltRisk.highFrom)!;
    expect(high).toMatchObject({ level: 'high', forecast: true });
    expect(ga.summary).toMatch(/bolt risk .*high from|bolt risk high/i);
    expect(ga.summary).toMatch(/°F/);
    const lastQuick = ga.boltRisk.days.at(-1)!;
    const lastSlow = gb.boltRisk.days.at(-1)!;
    expect(rank[lastSlow.level]).toBeLessThan(rank[lastQuick.level]);
    // The reasons name the figures in the garden's unit: 80 °F is lettuce's heat threshold (SCIENCE §3, from memory).
    const res = await clients.viewer.get(`${base}/today`);
    expect(res.status).toBe(200);
    const action = res.body.actions.find((x: { plantingId: number; kind: string }) => x.plantingId === a.id && x.kind === 'bolt-high');
    expect(action.title).toMatch(/bolt risk high/i);
    expect(action.advice).toMatch(/slower-bolting/);
  });

  it('when a planting is started indoors in the south, then it counts from its transplant and belongs to that season', async () => {
    const south = testApp({}, testWeather({}, at('2026-10-01')));
    const { clients, base, garden } = await gardenWithClients(south);
    await garden.update({ latitude: -35.3, longitude: 149.1, timeZone: 'Australia/Sydney', units: 'C' });
    await giveGardenWeather(sequelize, garden, synthetic(-35.3, 149.1, '2020-07-01', '2026-09-30'));
    const variety = await makeVariety(garden.id, { cropKey: 'tomato', dtmDays: 65, dtmFrom: 'transplant', boltTolerance: null });
    const p = await makePlanting(garden.id, { varietyId: variety.id, method: 'indoor-start', sownOn: '2026-06-20', transplantedOn: '2026-09-05' });
    const planting = await clients.viewer.get(`${base}/plantings/${p.id}`);
    expect(planting.body.planting.season).toBe('2026–27');
    const g = await progressOf(clients.viewer, base, p.id);
    expect(g.startEvent).toEqual({ kind: 'transplant', on: '2026-09-05' });
    expect(g.packetDate).toBe(addDays('2026-09-05', 65));
    expect(g.boltRisk.level).toBe('none');
    expect(g.series[0].date).toBe('2026-09-06');
  });

  it('when a viewer asks, then progress is read; another garden’s member gets 404', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id, { sownOn: '2026-05-01' });
    const viewer = await clients.viewer.get(`${base}/plantings/${p.id}/progress`);
    expect(viewer.status).toBe(200);
    expect(viewer.body.maturity.basis.kind).toBe('none');
    expect(viewer.body.maturity.basis.note).toMatch(/no past weather/i);
    expect((await clients.outsider.get(`${base}/plantings/${p.id}/progress`)).status).toBe(404);
    expect((await clients.viewer.get(`${base}/plantings/999999999/progress`)).status).toBe(404);
  });

  it('when a planting’s dates change, then its progress is computed again from the new start', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, steadyDays('2022-01-01', addDays(TODAY, -1), 20, 10));
    const p = await makePlanting(garden.id, { sownOn: '2026-05-01' });
    const before = await progressOf(clients.viewer, base, p.id);
    const patch = await clients.grower.patch(`${base}/plantings/${p.id}`).send({ sownOn: '2026-05-15' });
    expect(patch.status).toBe(200);
    expect(patch.body.planting.progress.accumulated).toBeLessThan(before.accumulated);
    const after = await progressOf(clients.viewer, base, p.id);
    expect(after.startEvent?.on).toBe('2026-05-15');
  });

  it('when a station upload changes the garden’s weather, then the progress processor recomputes it after commit', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, steadyDays('2022-01-01', addDays(TODAY, -1), 20, 10));
    const p = await makePlanting(garden.id, { sownOn: '2026-05-20' });
    const before = await progressOf(clients.viewer, base, p.id);
    const rows = steadyDays('2026-05-21', '2026-06-09', 30, 20).map((d) => `${d.date},${d.tmax},${d.tmin}`);
    const upload = await clients.grower
      .post(`${base}/weather/imports`)
      .field('unit', 'C')
      .attach('file', Buffer.from(`date,high,low\n${rows.join('\n')}\n`), { filename: 'station.csv', contentType: 'text/csv' });
    expect(upload.status).toBe(201);
    await (app.locals.worker as Worker).drain();
    const [[row]] = (await sequelize.query('SELECT computed_for FROM planting_progress WHERE planting_id = ?', { replacements: [p.id] })) as [Array<{ computed_for: string }>, unknown];
    expect(row.computed_for).toBe(TODAY);
    const after = await progressOf(clients.viewer, base, p.id);
    // Lettuce, base 40 °F: 20 days at a mean of 25 °C instead of 15 °C add 10 °C-days each.
    expect(after.accumulated - before.accumulated).toBeCloseTo(20 * 10, 0);
    expect(after.series.at(-1)!.source).toBe('imported');
  });

  it('when the plantings list is sorted by bolt risk, then the cached figures order it and each row carries its progress', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, [...steadyDays('2022-01-01', addDays(TODAY, -1), 22, 10), ...steadyDays(TODAY, addDays(TODAY, 6), 32, 18, 'forecast')]);
    const bed = await makeBed(garden.id);
    const pea = await makeVariety(garden.id, { cropKey: 'pea', dtmDays: 60, boltTolerance: null });
    const lettuce = await makeVariety(garden.id, { dtmDays: 50, boltTolerance: 1 });
    const a = await makePlanting(garden.id, { bedId: bed.id, varietyId: pea.id, sownOn: '2026-04-20' });
    const b = await makePlanting(garden.id, { bedId: bed.id, varietyId: lettuce.id, sownOn: '2026-04-20' });
    const res = await clients.viewer.get(`${base}/plantings?sort=risk&order=desc`);
    expect(res.status).toBe(200);
    expect(res.body.items.map((x: { id: number }) => x.id)).toEqual([b.id, a.id]);
    expect(res.body.items[0].progress).toMatchObject({ boltLevel: expect.stringMatching(/elevated|high/) });
    expect(res.body.items[1].progress.boltLevel).toBe('none');
    expect(res.body.items[0].nextEvent.label).toMatch(/ready/i);
  });
});
