import { describe, expect, it } from 'vitest';
import net from 'node:net';
import path from 'node:path';
import { tmpdir } from 'node:os';
import { mkdtempSync, writeFileSync } from 'node:fs';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createSequelize } from '../../server/db/sequelize';
import { testApp, testDb } from '../helpers/test-app';
import { createUser, PASSWORD } from '../helpers/factories';
import { initModels } from '../../server/db/models';

/** A port on loopback that nothing listens on. */
async function closedPort(): Promise<number> {
  const srv = net.createServer();
  await new Promise<void>((r) => srv.listen(0, '127.0.0.1', r));
  const { port } = srv.address() as net.AddressInfo;
  await new Promise((r) => srv.close(r));
  return port;
}

describe('health and readiness', () => {
  it('when the database answers, then ready is 200', async () => {
    const res = await request(testApp()).get('/api/ready');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ready', database: 'up' });
  });

  it('when the database is unreachable, then ready is 503 quickly and health stays 200', async () => {
    const { config } = testDb();
    const dead = createSequelize({ ...config.db, port: await closedPort() }, { acquireMs: 1000 });
    const app = createApp({ config, sequelize: dead, clientDir: null });
    const started = Date.now();
    const res = await request(app).get('/api/ready');
    expect(res.status).toBe(503);
    expect(res.body.database).toBe('down');
    expect(Date.now() - started).toBeLessThan(5000);
    expect((await request(app).get('/api/health')).status).toBe(200);
    await dead.close();
  });

  it('when the database is down, then the page shell still loads, without a session cookie', async () => {
    const { config } = testDb();
    const dir = mkdtempSync(path.join(tmpdir(), 'heatclock-shell-'));
    writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>Heatclock</title>');
    const dead = createSequelize({ ...config.db, port: await closedPort() }, { acquireMs: 1000 });
    const app = createApp({ config, sequelize: dead, clientDir: dir });
    const res = await request(app).get('/g/1/weather').set('Cookie', 'heatclock.sid=s%3Aanything.sig');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<title>Heatclock</title>');
    expect(res.headers['set-cookie']).toBeUndefined();
    await dead.close();
  });

  it('when the database goes away under a signed-in request, then the answer is a fast 503, never a hang', async () => {
    const { config } = testDb();
    const live = testApp();
    const user = await createUser();
    const login = await request(live).post('/api/auth/login').send({ email: user.email, password: PASSWORD }).expect(200);
    const cookie = String(login.headers['set-cookie']).split(';')[0];
    const dead = createSequelize({ ...config.db, port: await closedPort() }, { acquireMs: 1000 });
    // The models follow the process's one Sequelize instance: point them at the dead one for this request.
    initModels(dead);
    const app = createApp({ config, sequelize: dead, clientDir: null });
    const started = Date.now();
    const res = await request(app).get('/api/gardens').set('Cookie', cookie);
    initModels(testDb().sequelize);
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('database_unavailable');
    expect(res.headers['retry-after']).toBe('5');
    expect(JSON.stringify(res.body)).not.toMatch(/ECONNREFUSED|127\.0\.0\.1|Sequelize/);
    expect(Date.now() - started).toBeLessThan(5000);
    await dead.close();
  });
});
