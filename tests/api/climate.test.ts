import { describe, expect, it } from 'vitest';
import { addDays, daysBetween } from '#shared/thermal/dates';
import type { DailyTemp } from '#shared/thermal/types';
import { testApp, testDb } from '../helpers/test-app';
import { giveGardenWeather } from '../helpers/garden-weather';
import { gardenWithClients } from '../helpers/garden-records';

const app = testApp();

/** Mild days (low 5 °C) from `from` through `to`, with the given lows on the given days. */
function history(from: string, to: string, lows: Record<string, number>): DailyTemp[] {
  return Array.from({ length: daysBetween(from, to) + 1 }, (_, k) => {
    const date = addDays(from, k);
    const tmin = lows[date] ?? 5;
    return { date, tmax: Math.max(tmin + 10, 15), tmin, source: 'observed' as const };
  });
}

function lowsEachYear(years: number[], monthDays: Record<string, number>): Record<string, number> {
  return Object.fromEntries(years.flatMap((y) => Object.entries(monthDays).map(([md, t]) => [`${y}-${md}`, t])));
}

const range = (a: number, b: number) => Array.from({ length: b - a + 1 }, (_, k) => a + k);

async function gardenWith(days: DailyTemp[], place: { latitude: number; longitude: number; timeZone: string; units: 'F' | 'C' }) {
  const ctx = await gardenWithClients(app);
  await ctx.garden.update(place);
  await giveGardenWeather(testDb().sequelize, ctx.garden, days);
  return ctx;
}

const north = { latitude: 45, longitude: -93, timeZone: 'UTC', units: 'F' as const };

describe('garden climate facts (GET /api/gardens/:gardenId/climate)', () => {
  it('when every one of 12 northern seasons froze last on 20 Apr and first on 15 Oct, then p10 = p50 = p90 and the figures are not an estimate', async () => {
    // Frost days: a -20 °C night on 10 Jan, -2 °C on 20 Apr, -3 °C on 15 Oct, every year 2010–2021.
    const days = history('2010-01-01', '2021-12-31', lowsEachYear(range(2010, 2021), { '01-10': -20, '04-20': -2, '10-15': -3 }));
    const { clients, base } = await gardenWith(days, north);
    const res = await clients.viewer.get(`${base}/climate`);
    expect(res.status).toBe(200);
    const c = res.body.climate;
    expect(c.lastSpringFrost).toEqual({ p10: '04-20', p50: '04-20', p90: '04-20', years: 12, estimate: false });
    expect(c.firstFallFrost).toEqual({ p10: '10-15', p50: '10-15', p90: '10-15', years: 12, estimate: false });
    // 21 Apr … 14 Oct inclusive: 10 + 31 + 30 + 31 + 31 + 30 + 14 = 177 days.
    expect(c.frostFreeDays).toEqual({ p10: 177, p50: 177, p90: 177, years: 12, estimate: false });
    // Winters Jul–Jun: 2010–11 … 2020–21 are complete, 11 of them, each at −20 °C = −4 °F.
    expect(c.extremeMinimum).toEqual({ mean: -4, unit: 'F', years: 11, estimate: false });
    // USDA-ARS & Oregon State PRISM 2023 (SCIENCE §6): zone = floor((−4 + 60)/10) + 1 = 6; 56 mod 10 = 6 ≥ 5 → b.
    expect(c.zone).toEqual({ zone: '6b', years: 11, estimate: false });
    expect(c).toMatchObject({ years: 11, estimate: false, hemisphere: 'north', reason: null, override: null, source: 'history' });
  });

  it('when five seasons froze last and first on different days, then the 10/50/90 % dates are the nearest-rank picks, flagged as an estimate', async () => {
    const lows: Record<string, number> = {
      // Winter lows (mid-January), −10, −14, −12, −16 °C for the winters 2016–17 … 2019–20.
      '2017-01-15': -10, '2018-01-15': -14, '2019-01-15': -12, '2020-01-15': -16,
      // Last spring frosts.
      '2016-04-02': -1, '2017-04-28': -1, '2018-04-10': -1, '2019-05-03': -1, '2020-04-17': -1,
      // First fall frosts.
      '2016-10-20': -1, '2017-09-30': -1, '2018-10-05': -1, '2019-10-11': -1, '2020-10-25': -1,
    };
    const { clients, base } = await gardenWith(history('2016-01-01', '2020-12-31', lows), { ...north, units: 'C' });
    const c = (await clients.viewer.get(`${base}/climate`)).body.climate;
    // Nearest rank as shared/thermal/quantiles.ts defines it: the value at rank ceil(p/100 · n), n = 5:
    // p10 → rank 1, p50 → rank 3, p90 → rank 5.
    // Spring sorted: 04-02, 04-10, 04-17, 04-28, 05-03. Fall sorted: 09-30, 10-05, 10-11, 10-20, 10-25.
    expect(c.lastSpringFrost).toEqual({ p10: '04-02', p50: '04-17', p90: '05-03', years: 5, estimate: true });
    expect(c.firstFallFrost).toEqual({ p10: '09-30', p50: '10-11', p90: '10-25', years: 5, estimate: true });
    // Days strictly between, by hand: 2016 200, 2017 154, 2018 177, 2019 160, 2020 190 → 154, 160, 177, 190, 200.
    expect(c.frostFreeDays).toEqual({ p10: 154, p50: 177, p90: 200, years: 5, estimate: true });
    // (−10 − 14 − 12 − 16) / 4 = −13 °C = 8.6 °F → zone floor(68.6/10) + 1 = 7, 8.6 ≥ 5 → 7b (SCIENCE §6).
    expect(c.extremeMinimum).toEqual({ mean: -13, unit: 'C', years: 4, estimate: true });
    expect(c.zone).toEqual({ zone: '7b', years: 4, estimate: true });
    expect(c).toMatchObject({ years: 4, estimate: true });
  });

  it('when the garden is south of the equator, then spring frost falls in September and fall frost in May, seasons running July–June', async () => {
    // 11 seasons 2010–11 … 2020–21: −6 °C on 15 Jul, −1 °C on 25 Sep, −2 °C on 10 May.
    const lows = { ...lowsEachYear(range(2010, 2020), { '07-15': -6, '09-25': -1 }), ...lowsEachYear(range(2011, 2021), { '05-10': -2 }) };
    const { clients, base } = await gardenWith(history('2010-07-01', '2021-06-30', lows), { latitude: -37.8, longitude: 145, timeZone: 'Australia/Melbourne', units: 'C' });
    const c = (await clients.viewer.get(`${base}/climate`)).body.climate;
    expect(c.hemisphere).toBe('south');
    expect(c.lastSpringFrost).toEqual({ p10: '09-25', p50: '09-25', p90: '09-25', years: 11, estimate: false });
    expect(c.firstFallFrost).toEqual({ p10: '05-10', p50: '05-10', p90: '05-10', years: 11, estimate: false });
    // 26 Sep … 9 May: 226 days, 227 across a 29 February (2011–12, 2015–16, 2019–20); n = 11:
    // p10 → rank 2 (226), p50 → rank 6 (226), p90 → rank 10 (227).
    expect(c.frostFreeDays).toEqual({ p10: 226, p50: 226, p90: 227, years: 11, estimate: false });
    // Southern winters are calendar years: 2011 … 2020 complete, 10 of them; −6 °C = 21.2 °F → 9a (SCIENCE §6).
    expect(c.extremeMinimum).toEqual({ mean: -6, unit: 'C', years: 10, estimate: false });
    expect(c.zone).toEqual({ zone: '9a', years: 10, estimate: false });
  });

  it('when the garden has no stored weather, then every figure is empty, flagged, with the reason in words', async () => {
    const { clients, base } = await gardenWithClients(app);
    const c = (await clients.viewer.get(`${base}/climate`)).body.climate;
    expect(c).toMatchObject({ years: 0, estimate: true, reason: 'No weather is stored for this garden yet.' });
    expect(c.lastSpringFrost).toEqual({ p10: null, p50: null, p90: null, years: 0, estimate: true });
    expect(c.zone.zone).toBeNull();
  });
});

describe('the owner’s climate override (PUT /api/gardens/:gardenId/climate)', () => {
  it('when the owner sets a frost date and a zone, then the climate shows them as the source, and clearing them goes back to the history', async () => {
    const days = history('2018-01-01', '2020-12-31', lowsEachYear(range(2018, 2020), { '04-20': -2 }));
    const { clients, base } = await gardenWith(days, north);
    expect((await clients.viewer.get(`${base}/climate`)).body.climate.source).toBe('history');
    const put = await clients.owner.put(`${base}/climate`).send({ lastSpringFrost50: '05-01', zone: '6A' });
    expect(put.status).toBe(200);
    expect(put.body.override).toMatchObject({ lastSpringFrost50: '05-01', firstFallFrost50: null, zone: '6a' });
    // The cached answer is keyed by the garden revision, which the override moved.
    const after = (await clients.viewer.get(`${base}/climate`)).body.climate;
    expect(after.source).toBe('override');
    expect(after.override).toMatchObject({ lastSpringFrost50: '05-01', zone: '6a' });
    expect(after.lastSpringFrost.p50).toBe('04-20');
    // A field left out keeps its value; null clears it.
    await clients.owner.put(`${base}/climate`).send({ firstFallFrost50: '10-01' });
    expect((await clients.viewer.get(`${base}/climate`)).body.climate.override).toMatchObject({ lastSpringFrost50: '05-01', firstFallFrost50: '10-01', zone: '6a' });
    const cleared = await clients.owner.put(`${base}/climate`).send({ lastSpringFrost50: null, firstFallFrost50: null, zone: null });
    expect(cleared.body.override).toBeNull();
    expect((await clients.viewer.get(`${base}/climate`)).body.climate).toMatchObject({ override: null, source: 'history' });
  });

  it('when the override is not a month-day or a zone, then 400 names each field', async () => {
    const { clients, base } = await gardenWithClients(app);
    const bad = await clients.owner.put(`${base}/climate`).send({ lastSpringFrost50: '02-30', firstFallFrost50: '2025-10-01', zone: '14a' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['firstFallFrost50', 'lastSpringFrost50', 'zone']);
    const unknown = await clients.owner.put(`${base}/climate`).send({ zone: '6a', frostDate: '04-01' });
    expect(unknown.status).toBe(400);
    expect(Object.keys(unknown.body.error.fields)).toContain('frostDate');
    expect((await clients.owner.put(`${base}/climate`).send({})).body.error.code).toBe('nothing_to_change');
    expect((await clients.owner.put(`${base}/climate`).send({ lastSpringFrost50: '02-29' })).status).toBe(200);
  });

  it('when a viewer or grower sets the override, then 403; an outsider gets 404 for reading and writing', async () => {
    const { clients, base } = await gardenWithClients(app);
    expect((await clients.viewer.put(`${base}/climate`).send({ zone: '6a' })).status).toBe(403);
    expect((await clients.grower.put(`${base}/climate`).send({ zone: '6a' })).status).toBe(403);
    expect((await clients.outsider.get(`${base}/climate`)).status).toBe(404);
    expect((await clients.outsider.put(`${base}/climate`).send({ zone: '6a' })).status).toBe(404);
    expect((await clients.viewer.get(`${base}/climate`)).body.climate.override).toBeNull();
  });
});
