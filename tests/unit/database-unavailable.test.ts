import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { describe, expect, it } from 'vitest';
import express from 'express';
import request from 'supertest';
import { ConnectionRefusedError, DatabaseError } from 'sequelize';
import { errorHandler, isDatabaseDown } from '../../server/errors';
import { createCapturingLogger } from '../../server/lib/logger';
import { loadConfig } from '../../server/config';

/** A driver error as Sequelize wraps it: the connector's SqlError under `original`/`parent`. */
function driverError(errno: number, extra: Record<string, unknown> = {}) {
  const sqlError = Object.assign(new Error(`(conn:1, no: ${errno}) simulated`), { errno, sql: 'SELECT 1', ...extra });
  return new DatabaseError(sqlError as unknown as Error & { sql: string; parameters: object });
}

describe('a database node that cannot serve right now', () => {
  it('when the node is not ready (1047), a statement ran out (1969), a conflict outlived its retries (1213) or the connection was lost, then 503 with Retry-After', async () => {
    for (const err of [driverError(1047), driverError(1969), driverError(1213), driverError(1205), driverError(45026, { fatal: true }), driverError(45009), driverError(0, { fatal: true }), new ConnectionRefusedError(new Error('refused'))]) {
      expect(isDatabaseDown(err), String((err as { original?: { errno?: number } }).original?.errno)).toBe(true);
      const { logger } = createCapturingLogger('error');
      const app = express();
      app.get('/x', () => {
        throw err;
      });
      app.use(errorHandler(logger));
      const res = await request(app).get('/x');
      expect(res.status).toBe(503);
      expect(res.headers['retry-after']).toBe('5');
      expect(res.body.error.code).toBe('database_unavailable');
      expect(JSON.stringify(res.body)).not.toMatch(/simulated|SELECT/);
    }
  });

  it('when the statement itself is wrong (1064) or breaks a constraint (1452), then it is not called an outage', () => {
    expect(isDatabaseDown(driverError(1064))).toBe(false);
    expect(isDatabaseDown(driverError(1452))).toBe(false);
    expect(isDatabaseDown(new Error('plain'))).toBe(false);
  });

  it('when DB_QUERY_TIMEOUT_MS is not set, then statements are bounded at 8 s; 0 turns the bound off', () => {
    expect(loadConfig({ NODE_ENV: 'development' }).db.queryTimeoutMs).toBe(8000);
    expect(loadConfig({ NODE_ENV: 'development', DB_QUERY_TIMEOUT_MS: '0' }).db.queryTimeoutMs).toBe(0);
    expect(() => loadConfig({ DB_QUERY_TIMEOUT_MS: 'soon' })).toThrow(/DB_QUERY_TIMEOUT_MS/);
  });

  it('when an error comes after the answer was sent (the session touch at res.end failing), then it is logged and the kept-alive connection serves the next request', async () => {
    const { logger, lines } = createCapturingLogger('warn');
    const app = express();
    app.get('/x', (_req, res, next) => {
      res.status(503).json({ error: { code: 'database_unavailable' } });
      setImmediate(() => next(driverError(1969)));
    });
    app.use(errorHandler(logger));
    const server = http.createServer(app).listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    const sockets = new Set<unknown>();
    const get = () =>
      new Promise<number>((resolve, reject) => {
        const req = http.get({ host: '127.0.0.1', port: (server.address() as AddressInfo).port, path: '/x', agent }, (res) => {
          sockets.add(req.socket);
          res.resume();
          res.on('end', () => resolve(res.statusCode ?? 0));
        });
        req.on('error', reject);
      });
    try {
      expect(await get()).toBe(503);
      await new Promise((r) => setTimeout(r, 50));
      expect(await get()).toBe(503);
      expect(sockets.size).toBe(1);
      expect(lines.some((l) => l.includes('error after the response was sent'))).toBe(true);
    } finally {
      agent.destroy();
      server.close();
    }
  });
});
