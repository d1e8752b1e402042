import { createHash } from 'node:crypto';
import request from 'supertest';
import ical from 'node-ical';
import type { VEvent } from 'node-ical';
import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import type { TestAgent } from '../helpers/test-app';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import type { CalendarFeedDto } from '#shared/schemas/calendar';
import type { AlertDto } from '#shared/schemas/alerts';

const TODAY = '2026-06-10';
const app = testApp({}, testWeather({}, () => new Date(`${TODAY}T17:00:00Z`)));
const { sequelize } = testDb();

const day = (d: Date | undefined) => d?.toISOString().slice(0, 10);

async function linkOf(client: TestAgent) {
  const res = await client.get('/api/me/calendar-feed');
  expect([200, 201]).toContain(res.status);
  return res.body as CalendarFeedDto;
}

async function fetchFeed(url: string) {
  const res = await request(app).get(new URL(url, 'http://localhost').pathname);
  return res;
}

async function eventsOf(url: string) {
  const res = await fetchFeed(url);
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toMatch(/^text\/calendar/);
  const text = res.text;
  // Stored sentences carry date tokens; the feed must hold words only.
  expect(text).not.toMatch(/[⟦⟧]/u);
  const parsed = ical.sync.parseICS(text);
  const events = Object.values(parsed).filter((c): c is VEvent => c?.type === 'VEVENT');
  return { text, events, byUid: new Map(events.map((e) => [e.uid, e])) };
}

/** A garden with 20 °C every day since 2021; lettuce (50 packet days) lands exactly on its packet date. */
async function steadyGarden() {
  const ctx = await gardenWithClients(app);
  await ctx.garden.update({ units: 'C' });
  await giveGardenWeather(sequelize, ctx.garden, steadyDays('2021-01-01', addDays(TODAY, -1), 20, 20));
  const bed = await makeBed(ctx.garden.id, 'North bed');
  const variety = await makeVariety(ctx.garden.id, { name: 'Little Gem', dtmDays: 50, dtmFrom: 'sowing' });
  return { ...ctx, bed, variety };
}

describe('calendar feed', () => {
  it('when a user first asks for the link, then one is made, shown again later, and only its hash and a sealed copy are stored', async () => {
    const { clients, owner } = await steadyGarden();
    const first = await clients.owner.get('/api/me/calendar-feed');
    expect(first.status).toBe(201);
    const { url } = first.body as CalendarFeedDto;
    expect(url).toMatch(/\/api\/calendar\/[A-Za-z0-9_-]{43}\.ics$/);
    const again = await linkOf(clients.owner);
    expect(again.url).toBe(url);
    const token = /\/api\/calendar\/([A-Za-z0-9_-]{43})\.ics$/.exec(url!)![1];
    const [rows] = (await sequelize.query('SELECT * FROM calendar_feeds WHERE user_id = ?', { replacements: [owner.id] })) as [Array<Record<string, unknown>>, unknown];
    expect(rows).toHaveLength(1);
    expect(rows[0].token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    for (const value of Object.values(rows[0])) expect(String(value)).not.toContain(token);
  });

  it('when the feed is fetched, then it parses and holds each growing planting’s window (not a harvested one) and each open alert, worded, with stable UIDs', async () => {
    const { clients, base, garden, bed, variety } = await steadyGarden();
    const growing = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-05-20' });
    // Sown early enough that its window has opened: the harvest-window alert is open today.
    const ready = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-04-15' });
    const finished = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-04-01', status: 'harvested', firstHarvestOn: '2026-05-25' });
    const { url } = await linkOf(clients.viewer);
    const { events, byUid, text } = await eventsOf(url!);

    const harvest = byUid.get(`planting-${growing.id}-harvest@heatclock`)!;
    expect(harvest).toBeDefined();
    expect(harvest.datetype).toBe('date');
    expect(day(harvest.start)).toBe('2026-07-09');
    // DTEND of an all-day event is the day after the last one (RFC 5545 3.6.1).
    expect(day(harvest.end)).toBe('2026-07-10');
    expect(harvest.summary).toBe(`Likely harvest: Lettuce: Little Gem, North bed, ${garden.name}`);
    expect(String(harvest.description)).toMatch(/°C-days/);
    expect(byUid.has(`planting-${finished.id}-harvest@heatclock`)).toBe(false);

    const alerts = (await clients.viewer.get(`${base}/alerts`).query({ status: 'open' })).body as { items: AlertDto[] };
    const open = alerts.items.filter((a) => a.plantingId === ready.id && a.type === 'harvest-window');
    expect(open).toHaveLength(1);
    const alertEvent = byUid.get(`alert-${open[0].id}@heatclock`)!;
    expect(alertEvent).toBeDefined();
    expect(day(alertEvent.start)).toBe(open[0].startsOn);
    expect(day(alertEvent.end)).toBe(addDays(open[0].endsOn ?? open[0].startsOn, 1));
    expect(alertEvent.summary).toContain(garden.name);
    expect(alertEvent.summary).toContain('Harvest window open');
    expect(text).toMatch(/^DTSTAMP:\d{8}T\d{6}Z\r?$/m);

    const second = await eventsOf(url!);
    expect(second.events.map((e) => e.uid).sort()).toEqual(events.map((e) => e.uid).sort());
    for (const e of second.events) expect(Number(e.sequence)).toBe(Number(byUid.get(e.uid)!.sequence));
  });

  it('when a planting’s dates change so its window moves, then its event keeps its UID with a higher SEQUENCE and the new dates', async () => {
    const { clients, base, garden, bed, variety } = await steadyGarden();
    const p = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-05-20' });
    const uid = `planting-${p.id}-harvest@heatclock`;
    const { url } = await linkOf(clients.grower);
    const before = (await eventsOf(url!)).byUid.get(uid)!;
    expect(day(before.start)).toBe('2026-07-09');
    const patched = await clients.grower.patch(`${base}/plantings/${p.id}`).send({ sownOn: '2026-05-25' });
    expect(patched.status).toBe(200);
    const after = (await eventsOf(url!)).byUid.get(uid)!;
    expect(day(after.start)).toBe('2026-07-14');
    expect(Number(after.sequence)).toBeGreaterThan(Number(before.sequence));
    // Fetched again with nothing changed: the same SEQUENCE.
    expect(Number((await eventsOf(url!)).byUid.get(uid)!.sequence)).toBe(Number(after.sequence));
  });

  it('when the link is revoked or replaced, then the old address answers 404', async () => {
    const { clients } = await steadyGarden();
    const { url } = await linkOf(clients.owner);
    const rotated = await clients.owner.post('/api/me/calendar-feed').send({});
    expect(rotated.status).toBe(201);
    const next = (rotated.body as CalendarFeedDto).url!;
    expect(next).not.toBe(url);
    expect((await fetchFeed(url!)).status).toBe(404);
    expect((await fetchFeed(next)).status).toBe(200);
    expect((await clients.owner.delete('/api/me/calendar-feed')).status).toBe(204);
    expect((await fetchFeed(next)).status).toBe(404);
    expect((await request(app).get('/api/calendar/not-a-token.ics')).status).toBe(404);
  });

  it('when another user opens their own feed, then none of my gardens is in it', async () => {
    const { clients, garden, bed, variety } = await steadyGarden();
    const p = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-05-20' });
    const mine = await linkOf(clients.owner);
    const theirs = await linkOf(clients.outsider);
    expect(theirs.url).not.toBe(mine.url);
    const { events, text } = await eventsOf(theirs.url!);
    expect(events.some((e) => e.uid === `planting-${p.id}-harvest@heatclock`)).toBe(false);
    expect(text).not.toContain(garden.name);
    expect((await eventsOf(mine.url!)).byUid.has(`planting-${p.id}-harvest@heatclock`)).toBe(true);
  });

  it('when nobody is signed in, then the link cannot be read, made or revoked', async () => {
    for (const method of ['get', 'post', 'delete'] as const) {
      expect((await request(app)[method]('/api/me/calendar-feed').set('X-Requested-With', 'x')).status).toBe(401);
    }
  });
});
