import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { testApp, testDb } from '../helpers/test-app';
import { gardenWithClients, makeBed, makeLot, makePlanting, makeVariety } from '../helpers/garden-records';
import { PASSWORD } from '../helpers/factories';
import { GerminationTest, Planting, PlantingLog } from '../../server/db/models';

const app = testApp();
const { sequelize } = testDb();

describe('Idempotency-Key on creates', () => {
  it('when a planned planting with no dates is submitted 20 times at once with one key, then one row is made and every answer names it or says it is in progress', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id);
    const variety = await makeVariety(garden.id);
    const body = { bedId: bed.id, varietyId: variety.id, seedLotId: null, method: 'direct-sow', status: 'planned', quantity: null, quantityUnit: 'plants', sownOn: null, emergedOn: null, thinnedOn: null, transplantedOn: null, firstHarvestOn: null, lastHarvestOn: null, boltedOn: null, notes: '' };
    const key = randomUUID();
    const answers = await Promise.all(Array.from({ length: 20 }, () => clients.grower.post(`${base}/plantings`).set('Idempotency-Key', key).send(body)));
    expect(answers.map((a) => a.status).filter((s) => s !== 201 && s !== 409)).toEqual([]);
    expect(await Planting.count({ where: { gardenId: garden.id } })).toBe(1);
    const ids = new Set(answers.filter((a) => a.status === 201).map((a) => a.body.planting.id));
    expect(ids.size).toBe(1);
    for (const a of answers.filter((x) => x.status === 409)) expect(a.headers['retry-after']).toBe('1');
    // A retry later (the first answer was lost) gets the same answer again, marked as replayed.
    const retry = await clients.grower.post(`${base}/plantings`).set('Idempotency-Key', key).send(body);
    expect(retry.status).toBe(201);
    expect(retry.headers['idempotent-replayed']).toBe('true');
    expect(retry.body.planting.id).toBe([...ids][0]);
    expect(await Planting.count({ where: { gardenId: garden.id } })).toBe(1);
    // The same key with another body is refused; a new key makes a second planting.
    const reused = await clients.grower.post(`${base}/plantings`).set('Idempotency-Key', key).send({ ...body, notes: 'other' });
    expect(reused.status).toBe(422);
    expect(reused.body.error.fields).toHaveProperty('Idempotency-Key');
    expect((await clients.grower.post(`${base}/plantings`).set('Idempotency-Key', randomUUID()).send(body)).status).toBe(201);
    expect(await Planting.count({ where: { gardenId: garden.id } })).toBe(2);
  });

  it('when identical log entries and germination tests are sent 20 times with one key each, then one of each is stored', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id, { sownOn: '2025-04-01' });
    const logKey = randomUUID();
    await Promise.all(Array.from({ length: 20 }, () => clients.grower.post(`${base}/plantings/${p.id}/log`).set('Idempotency-Key', logKey).send({ entryOn: '2025-04-10', kind: 'watered' })));
    expect(await PlantingLog.count({ where: { plantingId: p.id } })).toBe(1);
    const v = await makeVariety(garden.id, { cropKey: 'spinach' });
    const lot = await makeLot(garden.id, v.id);
    const testKey = randomUUID();
    await Promise.all(Array.from({ length: 20 }, () => clients.grower.post(`${base}/seed-lots/${lot.id}/germination-tests`).set('Idempotency-Key', testKey).send({ testedOn: '2025-02-01', seedsTested: 20, germinated: 15 })));
    expect(await GerminationTest.count({ where: { seedLotId: lot.id } })).toBe(1);
  });

  it('when the first attempt with a key is refused, then the corrected retry with the same key runs afresh; another user’s key is their own', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id, { sownOn: '2025-04-01' });
    const key = randomUUID();
    const bad = await clients.grower.post(`${base}/plantings/${p.id}/log`).set('Idempotency-Key', key).send({ entryOn: 'not a date', kind: 'watered' });
    expect(bad.status).toBe(400);
    const good = await clients.grower.post(`${base}/plantings/${p.id}/log`).set('Idempotency-Key', key).send({ entryOn: '2025-04-10', kind: 'watered' });
    expect(good.status).toBe(201);
    expect(good.headers['idempotent-replayed']).toBeUndefined();
    const owners = await clients.owner.post(`${base}/plantings/${p.id}/log`).set('Idempotency-Key', key).send({ entryOn: '2025-04-11', kind: 'fed' });
    expect(owners.status).toBe(201);
    expect(await PlantingLog.count({ where: { plantingId: p.id } })).toBe(2);
    const malformed = await clients.grower.post(`${base}/plantings/${p.id}/log`).set('Idempotency-Key', 'short').send({ entryOn: '2025-04-12', kind: 'fed' });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields).toHaveProperty('Idempotency-Key');
  });

  it('when the client gives up before the answer and retries with the same key, then the retry meets the first answer and one entry is stored', async () => {
    const { base, garden, grower } = await gardenWithClients(app);
    const p = await makePlanting(garden.id, { sownOn: '2025-04-01' });
    const login = await request(app).post('/api/auth/login').send({ email: grower.email, password: PASSWORD });
    const cookie = ([] as string[]).concat(login.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
    const server = await new Promise<http.Server>((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const key = randomUUID();
    const body = JSON.stringify({ entryOn: '2025-04-10', kind: 'watered', note: 'gave up waiting' });
    // Another transaction holds the planting, so the first request is still waiting when the client leaves.
    const hold = await sequelize.transaction();
    await Planting.findByPk(p.id, { transaction: hold, lock: hold.LOCK.UPDATE });
    // The whole request is sent, then the connection dropped at once, as a timed-out phone would.
    await new Promise<void>((resolve) => {
      const req = http.request({ host: '127.0.0.1', port: (server.address() as AddressInfo).port, method: 'POST', path: `${base}/plantings/${p.id}/log`, headers: { 'Content-Type': 'application/json', 'Content-Length': Buffer.byteLength(body), Cookie: cookie, 'X-Requested-With': 'heatclock', 'Idempotency-Key': key } });
      req.on('error', () => resolve());
      req.end(body, () => {
        req.destroy();
        resolve();
      });
    });
    await new Promise((r) => setTimeout(r, 300));
    await hold.commit();
    await new Promise((r) => setTimeout(r, 500));
    const retry = await request(server).post(`${base}/plantings/${p.id}/log`).set({ Cookie: cookie, 'X-Requested-With': 'heatclock', 'Idempotency-Key': key, 'Content-Type': 'application/json' }).send(body);
    server.close();
    expect(retry.status).toBe(201);
    expect(retry.headers['idempotent-replayed']).toBe('true');
    expect(await PlantingLog.count({ where: { plantingId: p.id } })).toBe(1);
  });
});
