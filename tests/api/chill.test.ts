import { describe, expect, it } from 'vitest';
import { addDays, chillOfHours, chillSeasonOf, daysBetween, estimatedHours } from '#shared/thermal';
import type { DailyTemp } from '#shared/thermal/types';
import { localDate } from '../../server/lib/local-date';
import { testApp, testDb } from '../helpers/test-app';
import { giveGardenWeather } from '../helpers/garden-weather';
import { gardenWithClients } from '../helpers/garden-records';

const app = testApp();

/** Cold days (−2…6 °C) from `from` through `to`. */
function coldDays(from: string, to: string): DailyTemp[] {
  return Array.from({ length: daysBetween(from, to) + 1 }, (_, k) => ({ date: addDays(from, k), tmax: 6, tmin: -2, source: 'observed' as const }));
}

async function gardenAt(place: { latitude: number; longitude: number; timeZone: string }) {
  const ctx = await gardenWithClients(app);
  await ctx.garden.update({ ...place, units: 'C' });
  const today = localDate(place.timeZone);
  const { since } = chillSeasonOf(place.latitude, today);
  const days = coldDays(addDays(since, -3), addDays(today, -1));
  await giveGardenWeather(testDb().sequelize, ctx.garden, days);
  return { ...ctx, today, since, days };
}

describe('winter chill for fruit (GET /api/gardens/:gardenId/chill)', () => {
  it('when a northern garden has had cold days since 1 October, then a viewer reads the hours the engine counts over the same days', async () => {
    const { clients, base, since, today, days, garden } = await gardenAt({ latitude: 45, longitude: -93, timeZone: 'America/Chicago' });
    const res = await clients.viewer.get(`${base}/chill`);
    expect(res.status).toBe(200);
    expect(res.body.since).toBe(since);
    expect(res.body.since.slice(5)).toBe('10-01');
    expect(res.body.seasonEnded).toBe(today > chillSeasonOf(45, today).until);
    expect(res.body.method).toBe('linvill-1990-from-daily');
    expect(res.body.estimated).toBe(true);
    const counted = days.filter((d) => d.date >= since && d.date < today);
    expect(res.body.daysCounted).toBe(counted.length);
    expect(res.body.daysMissing).toBe(0);
    expect(res.body.through).toBe(addDays(today, -1));
    // The same figure as the shared engine over the season's days, with the day before as the first night.
    const hours = estimatedHours(garden.latitude!, days.filter((d) => d.date >= addDays(since, -1) && d.date < today)).slice(24);
    const expected = chillOfHours(hours);
    expect(res.body.hoursAtOrBelow7C).toBe(expected.hoursAtOrBelow7C);
    expect(res.body.utahUnits).toBeCloseTo(expected.utahUnits, 6);
    // Every hour of a −2…6 °C day is at or below 7.2 °C.
    expect(res.body.hoursAtOrBelow7C).toBe(counted.length * 24);
    const apple = res.body.fruit.find((f: { key: string }) => f.key === 'apple');
    expect(apple.chillHours).toEqual({ min: 500, max: 1500 });
    expect(apple.words).toMatch(/h more|Enough/);
  });

  it('when a southern garden is read, then its chill season starts on 1 April', async () => {
    const { clients, base } = await gardenAt({ latitude: -42.88, longitude: 147.33, timeZone: 'Australia/Hobart' });
    const res = await clients.viewer.get(`${base}/chill`);
    expect(res.status).toBe(200);
    expect(res.body.since.slice(5)).toBe('04-01');
    expect(res.body.until.slice(5)).toBe('10-31');
    // Between 1 November and 31 March the figures are last winter's, and the answer says so.
    const today = localDate('Australia/Hobart');
    expect(res.body.seasonEnded).toBe(today > chillSeasonOf(-42.88, today).until);
  });

  it('when someone outside the garden asks, then the garden is not found for them', async () => {
    const { base, clients } = await gardenAt({ latitude: 45, longitude: -93, timeZone: 'UTC' });
    const res = await clients.outsider.get(`${base}/chill`);
    expect([403, 404]).toContain(res.status);
  });
});
