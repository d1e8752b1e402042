import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { agent, testApp, testDb, testWeather } from '../helpers/test-app';
import { signIn } from '../helpers/factories';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import { overloadShed } from '../../server/lib/overload';
import type { ReadCache } from '../../server/lib/read-cache';
import type { AlertDto } from '#shared/schemas/alerts';
import type { TodayDto } from '#shared/schemas/progress';
import express from 'express';

const TODAY = '2026-06-10';
const now = () => new Date(`${TODAY}T17:00:00Z`);
const app = testApp({}, testWeather({}, now));
const other = testApp({}, testWeather({}, now));
const { sequelize } = testDb();
const cacheOf = (a: typeof app) => a.locals.readCache as ReadCache;

/** Mild past weather, then a hot forecast week (bolt risk for lettuce). */
const weather = () => [...steadyDays('2021-01-01', addDays(TODAY, -1), 18, 9), ...steadyDays(TODAY, addDays(TODAY, 6), 31, 18, 'forecast')];

/** Listens on a free loopback port; resolves once it is bound. */
async function listening(handler: express.Express) {
  const server = await new Promise<ReturnType<express.Express['listen']>>((resolve) => {
    const s = handler.listen(0, '127.0.0.1', () => resolve(s));
  });
  return { server, port: (server.address() as { port: number }).port };
}

async function gardenWithLettuce() {
  const ctx = await gardenWithClients(app);
  await giveGardenWeather(sequelize, ctx.garden, weather());
  const bed = await makeBed(ctx.garden.id, 'North bed');
  const variety = await makeVariety(ctx.garden.id, { dtmDays: 55, boltTolerance: 2 });
  const planting = await makePlanting(ctx.garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-05-01' });
  return { ...ctx, bed, variety, planting };
}

describe('cached garden reads', () => {
  it('when a list is read twice, then the second answer comes from the cache and is the same', async () => {
    const { clients, base } = await gardenWithLettuce();
    const hits = cacheOf(app).hits;
    const first = await clients.viewer.get(`${base}/plantings`);
    const second = await clients.viewer.get(`${base}/plantings`);
    expect(second.status).toBe(200);
    expect(second.body).toEqual(first.body);
    expect(cacheOf(app).hits).toBe(hits + 1);
  });

  it('when a browser asks again with the answer’s ETag, then it gets 304; when it accepts brotli, the kept answer comes compressed', async () => {
    const { clients, base } = await gardenWithLettuce();
    const plain = await clients.viewer.get(`${base}/today`).set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    const etag = plain.headers.etag;
    expect(etag).toMatch(/^W\/"/);
    const again = await clients.viewer.get(`${base}/today`).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    const br = await clients.viewer.get(`${base}/today`).set('Accept-Encoding', 'gzip, br');
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.body).toEqual(plain.body);
  });

  it('when a bed is renamed, then the plantings list shows the new name on the very next read, on this instance and another', async () => {
    const { clients, base, bed, garden, grower } = await gardenWithLettuce();
    expect((await clients.viewer.get(`${base}/plantings`)).body.items[0].bed.name).toBe('North bed');
    expect((await clients.grower.patch(`${base}/beds/${bed.id}`).send({ name: 'Shade bed' })).status).toBe(200);
    expect((await clients.viewer.get(`${base}/plantings`)).body.items[0].bed.name).toBe('Shade bed');
    const elsewhere = agent(other);
    await signIn(elsewhere, grower.email);
    expect((await elsewhere.get(`/api/gardens/${garden.id}/plantings`)).body.items[0].bed.name).toBe('Shade bed');
  });

  it('when a variety is added or removed, then the varieties list shows it at once', async () => {
    const { clients, base } = await gardenWithLettuce();
    const names = async () => ((await clients.viewer.get(`${base}/varieties`)).body.items as { name: string }[]).map((v) => v.name);
    expect(await names()).not.toContain('Frost Queen');
    const made = await clients.grower.post(`${base}/varieties`).send({
      cropKey: 'spinach', name: 'Frost Queen', dtmDays: 45, dtmFrom: 'sowing', emergenceDaysMin: 6, emergenceDaysMax: 10, boltTolerance: 4, heatTolerance: 2,
      traits: [], containerFriendly: false, sunHours: 6, waterCmPerWeek: 2.5, sowDepthCm: 1.5, spacingCm: 8, thinSpacingCm: 10, gddTargetOverrideC: null, notes: '',
    });
    expect(made.status).toBe(201);
    expect(await names()).toContain('Frost Queen');
    expect((await clients.grower.delete(`${base}/varieties/${made.body.variety.id}`)).status).toBe(204);
    expect(await names()).not.toContain('Frost Queen');
  });

  it('when a weather cell’s history status changes without new days, then the weather page shows it at once', async () => {
    const { clients, base, garden } = await gardenWithLettuce();
    const url = `${base}/weather?from=${addDays(TODAY, -5)}&to=${TODAY}`;
    expect((await clients.viewer.get(url)).body.history.error).toBeNull();
    await sequelize.query("UPDATE weather_cells SET backfill_error = 'The weather service did not answer.' WHERE id = ?", { replacements: [garden.weatherCellId] });
    expect((await clients.viewer.get(url)).body.history.error).toBe('The weather service did not answer.');
  });

  it('when a log entry is added, then the list’s log count moves at once', async () => {
    const { clients, base, planting } = await gardenWithLettuce();
    const before = (await clients.viewer.get(`${base}/plantings`)).body.items[0].logCount as number;
    const log = await clients.grower.post(`${base}/plantings/${planting.id}/log`).send({ kind: 'observation', entryOn: TODAY, note: 'Shade cloth on.' });
    expect(log.status).toBe(201);
    expect((await clients.viewer.get(`${base}/plantings`)).body.items[0].logCount).toBe(before + 1);
  });

  it('when the garden’s weather changes, then Today and the weather page show the new days on the very next read', async () => {
    const { clients, base, garden } = await gardenWithLettuce();
    const before = (await clients.viewer.get(`${base}/today`)).body as TodayDto;
    const yesterday = addDays(TODAY, -1);
    expect(before.weather.find((d) => d.date === yesterday)?.tmax).toBeCloseTo(64.4, 1);
    const weatherUrl = `${base}/weather?from=${addDays(TODAY, -5)}&to=${TODAY}`;
    await clients.viewer.get(weatherUrl);
    // A station file for yesterday: the same write path a grower's import takes.
    const res = await clients.grower
      .post(`${base}/weather/imports`)
      .field('unit', 'C')
      .attach('file', Buffer.from(`date,high,low\n${yesterday},25,12\n`), { filename: 'station.csv', contentType: 'text/csv' });
    expect(res.status).toBe(201);
    const after = (await clients.viewer.get(`${base}/today`)).body as TodayDto;
    expect(after.weather.find((d) => d.date === yesterday)?.tmax).toBeCloseTo(77, 1);
    const days = (await clients.viewer.get(weatherUrl)).body.days as { date: string; tmax: number }[];
    expect(days.find((d) => d.date === yesterday)?.tmax).toBeCloseTo(77, 1);
    expect(garden.id).toBeGreaterThan(0);
  });

  it('when an alert is acknowledged, then Today no longer lists it as open on the very next read', async () => {
    const { clients, base } = await gardenWithLettuce();
    const today = (await clients.viewer.get(`${base}/today`)).body as TodayDto;
    expect(today.actions.length).toBeGreaterThan(0);
    const open = (await clients.viewer.get(`${base}/alerts?status=open`)).body.items as AlertDto[];
    const target = open.find((a) => a.id === today.actions[0].alertId)!;
    expect((await clients.grower.post(`${base}/alerts/${target.id}/acknowledge`)).status).toBe(200);
    const after = (await clients.viewer.get(`${base}/today`)).body as TodayDto;
    expect(after.actions.map((a) => a.alertId)).not.toContain(target.id);
    expect(after.actionsTotal).toBe(today.actionsTotal - 1);
  });

  it('when a member is removed, then a cached list is not served to them', async () => {
    const { clients, base, viewer, garden } = await gardenWithLettuce();
    expect((await clients.viewer.get(`${base}/plantings`)).status).toBe(200);
    await sequelize.query('DELETE FROM memberships WHERE user_id = ? AND garden_id = ?', { replacements: [viewer.id, garden.id] });
    expect((await clients.viewer.get(`${base}/plantings`)).status).toBe(404);
  });
});

describe('Today in a large garden', () => {
  it('when more plantings grow than Today lists, then it shows the most pressing and counts the rest', async () => {
    const { clients, base, garden, bed } = await gardenWithLettuce();
    const pea = await makeVariety(garden.id, { cropKey: 'pea', dtmDays: 60, boltTolerance: null });
    for (let i = 0; i < 34; i++) await makePlanting(garden.id, { bedId: bed.id, varietyId: pea.id, sownOn: addDays('2026-04-01', i) });
    const today = (await clients.viewer.get(`${base}/today`)).body as TodayDto;
    expect(today.growingTotal).toBe(35);
    expect(today.plantings).toHaveLength(30);
    // The lettuce has bolt risk in the hot week: it comes first though it is not the oldest.
    expect(today.plantings[0].crop.key).toBe('lettuce');
  });
});

describe('alert list limit', () => {
  it('when a limit is given, then only that many come, most severe first; a bad limit is a 400 naming it', async () => {
    const { clients, base, garden, bed, variety } = await gardenWithLettuce();
    await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-05-08' });
    const all = (await clients.viewer.get(`${base}/alerts?status=open`)).body.items as AlertDto[];
    expect(all.length).toBeGreaterThan(1);
    const one = await clients.viewer.get(`${base}/alerts?status=open&limit=1`);
    expect(one.body.items.map((a: AlertDto) => a.id)).toEqual([all[0].id]);
    const bad = await clients.viewer.get(`${base}/alerts?limit=0`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('limit');
  });
});

describe('past capacity', () => {
  it('when more requests arrive than may run or wait, then the rest get 503 with Retry-After at once, and the server answers again after', async () => {
    const gate: Array<() => void> = [];
    const slow = express();
    slow.use(overloadShed({ maxInFlight: 2, maxQueue: 1, maxWaitMs: 5_000, retryAfterS: 2 }));
    slow.get('/work', (_req, res) => {
      gate.push(() => res.json({ ok: true }));
    });
    const { server, port } = await listening(slow);
    try {
      const url = `http://127.0.0.1:${port}/work`;
      const pending = [0, 1, 2].map(() => fetch(url));
      await expect.poll(() => gate.length).toBe(2);
      const refused = await fetch(url);
      expect(refused.status).toBe(503);
      expect(refused.headers.get('retry-after')).toBe('2');
      expect((await refused.json()).error).toMatchObject({ code: 'overloaded', message: expect.stringMatching(/try again in 2 seconds/) });
      // Finishing one lets the waiting one run; all three succeed.
      gate.shift()!();
      await expect.poll(() => gate.length).toBe(2);
      gate.splice(0).forEach((finish) => finish());
      expect((await Promise.all(pending)).map((r) => r.status)).toEqual([200, 200, 200]);
      const again = fetch(url);
      await expect.poll(() => gate.length).toBe(1);
      gate.shift()!();
      expect((await again).status).toBe(200);
    } finally {
      server.closeAllConnections();
      server.close();
    }
  });

  it('when a request waits longer than allowed, then it gets 503 with Retry-After instead of waiting on', async () => {
    const gate: Array<() => void> = [];
    const slow = express();
    slow.use(overloadShed({ maxInFlight: 1, maxQueue: 5, maxWaitMs: 50, retryAfterS: 3 }));
    slow.get('/work', (_req, res) => {
      gate.push(() => res.json({ ok: true }));
    });
    const first = request(slow).get('/work').then((r) => r);
    await expect.poll(() => gate.length).toBe(1);
    const waited = await request(slow).get('/work');
    expect(waited.status).toBe(503);
    expect(waited.headers['retry-after']).toBe('3');
    gate.shift()!();
    expect((await first).status).toBe(200);
  });

  it('when the app is over capacity, then API reads are shed with 503 but health still answers', async () => {
    const tight = testApp({ overload: { maxInFlight: 1, maxQueue: 0, maxWaitMs: 1000, retryAfterS: 2 } });
    const { server, port } = await listening(tight);
    try {
      const results = await Promise.all(Array.from({ length: 12 }, () => fetch(`http://127.0.0.1:${port}/api/auth/me`)));
      const codes = results.map((r) => r.status);
      expect(codes.every((c) => c === 401 || c === 503)).toBe(true);
      expect(codes).toContain(503);
      expect(results.find((r) => r.status === 503)!.headers.get('retry-after')).toBe('2');
      expect((await fetch(`http://127.0.0.1:${port}/api/health`)).status).toBe(200);
    } finally {
      server.closeAllConnections();
      server.close();
    }
  });
});
