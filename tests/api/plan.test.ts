import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { gardenWithClients, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather } from '../helpers/garden-weather';
import { addDays, dayOfYear, daysBetween } from '#shared/thermal/dates';
import type { DailyTemp } from '#shared/thermal/types';
import type { PlanDto } from '#shared/schemas/plan';
import { loadedWeatherStats, preparedStats } from '../../server/modules/plan/plan.service';

const NORTH_TODAY = '2026-02-10';

/**
 * Cold winters, cool springs and autumns, hot summers: a daily mean from −4 °C in midwinter to
 * 22 °C in midsummer (six months on south of the equator), ±6 °C for high and low, and each year
 * up to 2 °C warmer or cooler, so frost dates differ from year to year.
 */
function seasonal(from: string, to: string, south: boolean): DailyTemp[] {
  return Array.from({ length: daysBetween(from, to) + 1 }, (_, k) => {
    const date = addDays(from, k);
    const shift = ((Number(date.slice(0, 4)) * 7) % 5) - 2;
    const doy = dayOfYear(date) + (south ? 182 : 0);
    const mean = 9 - 13 * Math.cos((2 * Math.PI * (doy - 15)) / 365) + shift;
    return { date, tmax: mean + 6, tmin: mean - 6, source: 'observed' as const };
  });
}

function months(plan: PlanDto) {
  return plan.windows.map((w) => [Number(w.from.slice(5, 7)), Number(w.to.slice(5, 7))]);
}

const { sequelize } = testDb();

describe('the sowing plan', () => {
  const app = testApp({}, testWeather({}, () => new Date(`${NORTH_TODAY}T12:00:00Z`)));

  it('when summers are hot, then lettuce gets a spring and an autumn window and midsummer is left out with a reason in words', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, seasonal('2014-01-01', addDays(NORTH_TODAY, -1), false));
    const lettuce = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    const res = await clients.viewer.get(`${base}/plan?varietyId=${lettuce.id}`);
    expect(res.status).toBe(200);
    const plan = res.body as PlanDto;
    // Growers read plain words: no internal source marks or date tokens reach them.
    expect(JSON.stringify(plan)).not.toMatch(/SCIENCE|from memory|no source|⟦/);
    expect(plan.season.label).toBe('2026');
    expect(plan.frostRisk).toBe('50');
    expect(plan.candidates.length).toBe(53);
    expect(plan.candidates[1].sowOn).toBe('2026-01-08');
    expect(plan.windows.map((w) => w.name)).toEqual(['Spring window', 'Autumn window']);
    const [spring, autumn] = months(plan);
    expect(spring[0]).toBeGreaterThanOrEqual(2);
    expect(spring[1]).toBeLessThanOrEqual(5);
    expect(autumn[0]).toBeGreaterThanOrEqual(7);
    expect(autumn[1]).toBeLessThanOrEqual(10);
    const summer = plan.excluded.find((e) => e.from > plan.windows[0].to && e.to < plan.windows[1].from)!;
    expect(summer.reason).toMatch(/high bolt risk while ready to pick in \d+ of \d+ past years/);
    expect(`${summer.name} ${summer.reason}`).toMatch(/summer/i);
    // Dates in words are worded for the reader, never left as tokens.
    expect(JSON.stringify(plan)).not.toMatch(/⟦/);
    for (const c of plan.candidates) {
      expect(c.boltHighShare).toBeGreaterThanOrEqual(0);
      expect(c.boltHighShare).toBeLessThanOrEqual(1);
      expect(c.reason.length).toBeGreaterThan(10);
    }
    expect(plan.succession?.everyDays).toBeGreaterThanOrEqual(7);
    expect(plan.succession?.words).toMatch(/^For a steady harvest, sow every \d+ days from/);
  });

  it('when a tomato is planned, then no recommended day comes before the last spring frost, and a cautious plan starts no earlier than a bold one', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, seasonal('2014-01-01', addDays(NORTH_TODAY, -1), false));
    const tomato = await makeVariety(garden.id, { cropKey: 'tomato', name: 'Test tomato', dtmDays: 70, dtmFrom: 'transplant' });
    const plans: Record<string, PlanDto> = {};
    for (const risk of ['10', '50', '90']) {
      const res = await clients.viewer.get(`${base}/plan?varietyId=${tomato.id}&frostRisk=${risk}`);
      expect(res.status).toBe(200);
      plans[risk] = res.body as PlanDto;
      const p = plans[risk];
      expect(p.tender).toBe(true);
      expect(p.frost.lastSpring).not.toBeNull();
      const recommended = p.candidates.filter((c) => c.recommended);
      expect(recommended.length).toBeGreaterThan(0);
      for (const c of recommended) {
        expect(c.sowOn > p.frost.lastSpring!).toBe(true);
        expect(c.frostOk).toBe(true);
      }
    }
    expect(plans['10'].frost.lastSpring! >= plans['90'].frost.lastSpring!).toBe(true);
    expect(plans['10'].windows[0].from >= plans['90'].windows[0].from).toBe(true);
    expect(plans['10'].frost.firstFall! <= plans['90'].frost.firstFall!).toBe(true);
    expect(plans['10'].excluded[0].reason).toMatch(/not after the last spring frost/);
  });

  it('when a pepper is planned, then it starts a week or more after the last spring frost (warm-loving: Purdue HO-203 class)', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, seasonal('2014-01-01', addDays(NORTH_TODAY, -1), false));
    const pepper = await makeVariety(garden.id, { cropKey: 'pepper', name: 'Test pepper', dtmDays: 65, dtmFrom: 'transplant' });
    const res = await clients.viewer.get(`${base}/plan?varietyId=${pepper.id}&frostRisk=90`);
    expect(res.status).toBe(200);
    const p = res.body as PlanDto;
    expect(p.startKind).toBe('transplant');
    const first = p.candidates.find((c) => c.recommended)!;
    expect(first.sowOn >= addDays(p.frost.lastSpring!, 7)).toBe(true);
    expect(p.excluded[0].reason).toMatch(/less than a week after the last spring frost/);
    expect(p.windows[0].reason).toMatch(/^Set out /);
  });

  it('when one past autumn has no days, then the autumn frost still falls in the planned season', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const days = seasonal('2014-01-01', addDays(NORTH_TODAY, -1), false).filter((d) => !(d.date >= '2024-08-01' && d.date <= '2024-12-31'));
    await giveGardenWeather(sequelize, garden, days);
    const tomato = await makeVariety(garden.id, { cropKey: 'tomato', name: 'Test tomato', dtmDays: 70, dtmFrom: 'transplant' });
    const res = await clients.viewer.get(`${base}/plan?varietyId=${tomato.id}`);
    expect(res.status).toBe(200);
    const p = res.body as PlanDto;
    expect(p.frost.firstFall).toMatch(/^2026-(09|10|11)-/);
    for (const c of p.candidates.filter((x) => x.recommended)) expect(c.harvest.p50! < p.frost.firstFall!).toBe(true);
    expect(p.candidates.filter((c) => c.sowOn >= p.frost.firstFall!).every((c) => !c.recommended && !c.frostOk)).toBe(true);
  });

  it('when the query is wrong, then the error names the field; a viewer reads, an outsider gets 404', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const variety = await makeVariety(garden.id);
    const other = await gardenWithClients(app);
    const foreign = await makeVariety(other.garden.id);
    const missing = await clients.viewer.get(`${base}/plan`);
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('varietyId');
    const risk = await clients.viewer.get(`${base}/plan?varietyId=${variety.id}&frostRisk=30`);
    expect(risk.status).toBe(400);
    expect(risk.body.error.fields).toHaveProperty('frostRisk');
    const unknown = await clients.viewer.get(`${base}/plan?varietyId=${variety.id}&year=2027`);
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields).toHaveProperty('year');
    const theirs = await clients.viewer.get(`${base}/plan?varietyId=${foreign.id}`);
    expect(theirs.status).toBe(400);
    expect(theirs.body.error.fields.varietyId).toBe('Choose a variety of this garden.');
    expect((await clients.viewer.get(`${base}/plan?varietyId=${variety.id}`)).status).toBe(200);
    expect((await clients.outsider.get(`${base}/plan?varietyId=${variety.id}`)).status).toBe(404);
  });

  it('when station days are imported after a plan was read, then the next plan is made from them, not from the weather kept in memory', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ units: 'C' });
    await giveGardenWeather(sequelize, garden, seasonal('2014-01-01', addDays(NORTH_TODAY, -1), false));
    const lettuce = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    const misses = loadedWeatherStats.misses;
    const before = (await clients.viewer.get(`${base}/plan?varietyId=${lettuce.id}&frostRisk=50`)).body as PlanDto;
    // Another risk, and a variety added since (which moves the read cache's revision only): the garden's weather comes from memory.
    expect((await clients.viewer.get(`${base}/plan?varietyId=${lettuce.id}&frostRisk=10`)).status).toBe(200);
    const twin = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    const twinBefore = (await clients.viewer.get(`${base}/plan?varietyId=${twin.id}&frostRisk=50`)).body as PlanDto;
    expect(twinBefore.candidates).toEqual(before.candidates);
    expect(loadedWeatherStats.misses).toBe(misses + 1);
    // Every spring and summer of five past years far hotter at the garden's own station.
    const hot = ['2021', '2022', '2023', '2024', '2025'].flatMap((y) => seasonal(`${y}-03-01`, `${y}-09-30`, false).map((d) => `${d.date},${(d.tmax + 8).toFixed(1)},${(d.tmin + 8).toFixed(1)}`));
    const imported = await clients.grower
      .post(`${base}/weather/imports`)
      .field('unit', 'C')
      .attach('file', Buffer.from(['date,high,low', ...hot].join('\n')), { filename: 'station.csv', contentType: 'text/csv' });
    expect(imported.status).toBe(201);
    const after = (await clients.viewer.get(`${base}/plan?varietyId=${lettuce.id}&frostRisk=50`)).body as PlanDto;
    expect(loadedWeatherStats.misses).toBe(misses + 2);
    expect(after.candidates.map((c) => c.harvest.p50)).not.toEqual(before.candidates.map((c) => c.harvest.p50));
    const twinAfter = (await clients.viewer.get(`${base}/plan?varietyId=${twin.id}&frostRisk=50`)).body as PlanDto;
    expect(twinAfter.candidates).toEqual(after.candidates);
    expect(loadedWeatherStats.misses).toBe(misses + 2);
  });
});

describe('the sowing plan south of the equator', () => {
  const SOUTH_TODAY = '2026-06-10';
  const app = testApp({}, testWeather({}, () => new Date(`${SOUTH_TODAY}T02:00:00Z`)));

  it('when summers are hot, then lettuce windows fall in late winter to spring and late summer to autumn', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await garden.update({ latitude: -35.3, longitude: 149.1, timeZone: 'Australia/Sydney', units: 'C' });
    await giveGardenWeather(sequelize, garden, seasonal('2014-01-01', addDays(SOUTH_TODAY, -1), true));
    const lettuce = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    const started = performance.now();
    const res = await clients.viewer.get(`${base}/plan?varietyId=${lettuce.id}`);
    expect(res.status).toBe(200);
    const plan = res.body as PlanDto;
    expect(plan.season.label).toBe('2026–27');
    expect(plan.windows.map((w) => w.name)).toEqual(['Spring window', 'Autumn window']);
    const [spring, autumn] = months(plan);
    expect([7, 8, 9, 10]).toContain(spring[0]);
    expect([8, 9, 10, 11]).toContain(spring[1]);
    expect([1, 2, 3, 4]).toContain(autumn[0]);
    expect([2, 3, 4, 5]).toContain(autumn[1]);
    expect(plan.excluded.some((e) => /summer/.test(e.name) && /high bolt risk/.test(e.reason))).toBe(true);
    const first = performance.now() - started;
    // 20 sequential plans at the three frost risks: the other risks reuse the prepared climatology
    // (no new preparation), repeats of a risk come from the read cache.
    const misses = preparedStats.misses;
    const hits = preparedStats.hits;
    const times: number[] = [];
    for (let i = 0; i < 20; i++) {
      const t = performance.now();
      const r = await clients.viewer.get(`${base}/plan?varietyId=${lettuce.id}&frostRisk=${['10', '50', '90'][i % 3]}`);
      expect(r.status).toBe(200);
      times.push(performance.now() - t);
    }
    times.sort((a, b) => a - b);
    expect(preparedStats.misses).toBe(misses);
    expect(preparedStats.hits).toBeGreaterThanOrEqual(hits + 2);
    // 20 sequential plans of 20 varieties of the same crop: each a read-cache miss that reuses the prepared climatology.
    const fresh: number[] = [];
    for (let i = 0; i < 20; i++) {
      const v = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
      const t = performance.now();
      expect((await clients.viewer.get(`${base}/plan?varietyId=${v.id}`)).status).toBe(200);
      fresh.push(performance.now() - t);
    }
    fresh.sort((a, b) => a - b);
    expect(preparedStats.misses).toBe(misses);
    console.info(`plan: first call ${first.toFixed(1)} ms; p50 of 20 sequential calls at three risks ${times[10].toFixed(1)} ms; p50 of 20 calls for new varieties ${fresh[10].toFixed(1)} ms`);
  });
});
