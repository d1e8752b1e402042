import { describe, expect, it } from 'vitest';
import net from 'node:net';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createSequelize } from '../../server/db/sequelize';
import { testApp, testDb } from '../helpers/test-app';

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
});
