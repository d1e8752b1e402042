import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { gardenWithClients, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import { localeOf } from '../../server/lib/locale';

const TODAY = '2026-06-10';
const app = testApp({}, testWeather({}, () => new Date(`${TODAY}T17:00:00Z`)));
const { sequelize } = testDb();

describe('dates in the reader’s language', () => {
  it('when the same progress is read in British and American English, then its summary words the stored dates each way, and nothing leaks a token', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await giveGardenWeather(sequelize, garden, steadyDays('2021-01-01', addDays(TODAY, -1), 20, 20));
    const variety = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing' });
    const p = await makePlanting(garden.id, { varietyId: variety.id, sownOn: '2026-05-20' });
    const gb = await clients.viewer.get(`${base}/plantings/${p.id}/progress`).set('Accept-Language', 'en-GB,en;q=0.8');
    const us = await clients.viewer.get(`${base}/plantings/${p.id}/progress`).set('Accept-Language', 'en-US,en;q=0.8');
    expect(gb.status).toBe(200);
    expect(us.status).toBe(200);
    // Constant weather: ready on the packet's day, 9 July (progress.test.ts).
    expect(gb.body.summary).toContain('9 Jul');
    expect(us.body.summary).toContain('Jul 9');
    expect(gb.headers.vary).toMatch(/Accept-Language/);
    expect(JSON.stringify(gb.body) + JSON.stringify(us.body)).not.toContain('⟦');
    const list = await clients.viewer.get(`${base}/plantings`).set('Accept-Language', 'en-US');
    expect(JSON.stringify(list.body)).not.toContain('⟦');
  });

  it('when Accept-Language is missing, malformed or unknown, then the default wording is used', () => {
    expect(localeOf(undefined)).toBe('en-GB');
    expect(localeOf('de-DE;q=0.5, en-US;q=0.9')).toBe('en-US');
    expect(localeOf('*')).toBe('en-GB');
    expect(localeOf('x-@@, ;;;')).toBe('en-GB');
  });
});
