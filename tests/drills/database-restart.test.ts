/**
 * Drill: the database server really stops (and hangs) under a running app, then comes back.
 * The project's MariaDB is shared by the test files running beside this one, so the drill runs
 * its own server (tests/helpers/private-mariadb.ts) with the same binaries, migrates it, and
 * points one app at it. The models follow this file's Sequelize (one per process, as in production).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { loadConfig } from '../../server/config';
import type { AppConfig } from '../../server/config';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { migrate } from '../../server/db/migrate';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/lib/logger';
import { startFakeWeather } from '../../fixtures/weather/server';
import { addMember, createGarden, createUser, signIn } from '../helpers/factories';
import type { TestAgent } from '../helpers/test-app';
import { mariaDbInstalled, privateMariaDb } from '../helpers/private-mariadb';
import type { PrivateMariaDb } from '../helpers/private-mariadb';

/** What "fast" means for an answer while the database is gone. */
const FAST_MS = 2000;
/** The drill's statement bound: a frozen server is given up on after this + 2 s (socket timeout). */
const QUERY_TIMEOUT_MS = 1500;

let server: PrivateMariaDb;
let sequelize: Sequelize;
let config: AppConfig;
let fake: ReturnType<typeof startFakeWeather>;

async function signedInGarden() {
  const app = createApp({ config, sequelize, clientDir: null, logger: createLogger('silent') });
  const garden = await createGarden();
  const owner = await createUser();
  await addMember(owner.id, garden.id, 'owner');
  const client: TestAgent = request.agent(app).set('X-Requested-With', 'heatclock-drill');
  await signIn(client, owner.email);
  return { app, garden, client, base: `/api/gardens/${garden.id}` };
}

async function addBeds(client: TestAgent, base: string, names: string[]) {
  const ids: number[] = [];
  for (const name of names) {
    const res = await client.post(`${base}/beds`).set('Idempotency-Key', randomUUID()).send({ name, kind: 'bed', lengthM: 2, widthM: 1 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    ids.push(res.body.bed.id as number);
  }
  return ids;
}

async function timed(req: PromiseLike<request.Response>) {
  const started = Date.now();
  const res = await req;
  return { res, ms: Date.now() - started };
}

function expectFast503(res: request.Response, ms: number) {
  expect(res.status, JSON.stringify(res.body)).toBe(503);
  expect(res.body.error.code).toBe('database_unavailable');
  expect(res.headers['retry-after']).toBeDefined();
  expect(JSON.stringify(res.body)).not.toMatch(/ECONNREFUSED|127\.0\.0\.1|Sequelize|socket/i);
  expect(ms).toBeLessThan(FAST_MS);
}

/** The app, unrestarted, answers ready again within a bound once the server is back. */
async function waitReady(app: ReturnType<typeof createApp>, boundMs = 10_000) {
  const started = Date.now();
  for (;;) {
    const res = await request(app).get('/api/ready');
    if (res.status === 200) return Date.now() - started;
    if (Date.now() - started > boundMs) throw new Error(`not ready ${boundMs} ms after the database came back: ${JSON.stringify(res.body)}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

function bedNamesInDatabase(gardenId: number): string[] {
  return server
    .sql(`SELECT name FROM beds WHERE garden_id = ${gardenId} ORDER BY id;`)
    .split('\n')
    .filter(Boolean);
}

describe.skipIf(!mariaDbInstalled())('drill: the database server stops and comes back', () => {
  beforeAll(async () => {
    fake = startFakeWeather('error');
    server = await privateMariaDb('restart');
    const started = Date.now();
    await server.start();
    expect(Date.now() - started).toBeLessThan(10_000);
    const base = loadConfig({ ...process.env, NODE_ENV: 'test' });
    config = { ...base, db: { ...server.db(4), queryTimeoutMs: QUERY_TIMEOUT_MS } };
    sequelize = createSequelize(config.db, { acquireMs: 1000 });
    initModels(sequelize);
    await migrate(sequelize);
  }, 60_000);

  afterAll(async () => {
    fake?.close();
    await sequelize?.close().catch(() => undefined);
    await server?.remove();
  }, 30_000);

  it('when MariaDB shuts down under a waiting request, then answers are fast 503s, ready is red, and after its restart the same app serves every committed record', async () => {
    const { app, garden, client, base } = await signedInGarden();
    const committed = ['North bed', 'South bed', 'Herb spiral', 'Cold frame', 'Pumpkin patch'];
    const ids = await addBeds(client, base, committed);
    expect((await request(app).get('/api/ready')).status).toBe(200);

    // Mid-request: the server freezes with a read on the wire, then shuts down under it.
    await server.pause();
    const inFlight = timed(client.get(`${base}/beds`));
    await new Promise((r) => setTimeout(r, 300));
    await server.stop();
    const first = await inFlight;
    expect(first.res.status, JSON.stringify(first.res.body)).toBe(503);
    expect(first.res.headers['retry-after']).toBeDefined();

    // While it is down: reads, writes and readiness all answer at once.
    for (const req of [client.get(`${base}/beds`), client.get('/api/gardens'), client.get(`${base}/beds/${ids[0]}`)]) {
      const { res, ms } = await timed(req);
      expectFast503(res, ms);
    }
    const retryKey = randomUUID();
    const refused = await timed(client.post(`${base}/beds`).set('Idempotency-Key', retryKey).send({ name: 'Written while down', kind: 'bed' }));
    expectFast503(refused.res, refused.ms);
    const ready = await timed(request(app).get('/api/ready'));
    expect(ready.res.status).toBe(503);
    expect(ready.res.body).toMatchObject({ status: 'unavailable', database: 'down' });
    expect(ready.ms).toBeLessThan(FAST_MS);
    expect((await request(app).get('/api/health')).status).toBe(200);

    // Back on the same folder and port: no restart of the app, the session still holds.
    await server.start();
    expect(await waitReady(app)).toBeLessThan(10_000);
    const list = await client.get(`${base}/beds`);
    expect(list.status, JSON.stringify(list.body)).toBe(200);
    const listed = (list.body.items as Array<{ id: number; name: string }>).map((b) => b.name);
    expect(listed).toEqual(expect.arrayContaining(committed));
    // The client's retry of the refused write goes through once.
    await client.post(`${base}/beds`).set('Idempotency-Key', retryKey).send({ name: 'Written while down', kind: 'bed' }).expect(201);
    await client.post(`${base}/beds`).set('Idempotency-Key', retryKey).send({ name: 'Written while down', kind: 'bed' }).expect(201);
    expect(bedNamesInDatabase(garden.id)).toEqual([...committed, 'Written while down']);
  }, 60_000);

  it('when MariaDB is killed outright (no clean shutdown), then crash recovery keeps every committed write and the app reconnects', async () => {
    const { app, garden, client, base } = await signedInGarden();
    const committed = Array.from({ length: 8 }, (_, i) => `Row ${i + 1}`);
    await addBeds(client, base, committed);
    await server.stop('SIGKILL');
    const { res, ms } = await timed(client.get(`${base}/beds`));
    expectFast503(res, ms);
    await server.start();
    await waitReady(app);
    expect(bedNamesInDatabase(garden.id)).toEqual(committed);
    const list = await client.get(`${base}/beds`).expect(200);
    expect((list.body.items as Array<{ name: string }>).map((b) => b.name)).toEqual(expect.arrayContaining(committed));
  }, 60_000);

  it('when MariaDB hangs (process frozen), then ready is red fast, a request gives up within the statement bound, and the thawed server is used again', async () => {
    const { app, client, base } = await signedInGarden();
    await addBeds(client, base, ['Before the freeze']);
    await server.pause();
    try {
      const ready = await timed(request(app).get('/api/ready'));
      expect(ready.res.status).toBe(503);
      expect(ready.ms).toBeLessThan(FAST_MS);
      const { res, ms } = await timed(client.get(`${base}/beds`));
      expect(res.status, JSON.stringify(res.body)).toBe(503);
      expect(res.headers['retry-after']).toBeDefined();
      // Not a hang: the statement bound plus the socket's 2 s, and some slack for a busy machine.
      expect(ms).toBeLessThan(QUERY_TIMEOUT_MS + 2000 + 2000);
    } finally {
      server.resume();
    }
    await waitReady(app);
    const list = await client.get(`${base}/beds`).expect(200);
    expect((list.body.items as Array<{ name: string }>).map((b) => b.name)).toContain('Before the freeze');
  }, 60_000);
});
