import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';

const READY_TIMEOUT_MS = 1500;

/** Answers whether the database takes a query within a short bound; never hangs. */
async function databaseReachable(sequelize: Sequelize): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), READY_TIMEOUT_MS);
  });
  const probe = sequelize.query('SELECT 1').then(
    () => true,
    () => false,
  );
  try {
    return await Promise.race([probe, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

export function healthRouter(sequelize: Sequelize, table: RouteTableEntry[]) {
  const router = Router();
  mountRoutes(
    router,
    '/api',
    [
      {
        method: 'get',
        path: '/health',
        access: 'public',
        handler: (_req, res) => {
          res.json({ status: 'ok', uptimeSeconds: Math.round(process.uptime()) });
        },
      },
      {
        method: 'get',
        path: '/ready',
        access: 'public',
        handler: async (_req, res) => {
          const ok = await databaseReachable(sequelize);
          res.status(ok ? 200 : 503).json({ status: ok ? 'ready' : 'unavailable', database: ok ? 'up' : 'down' });
        },
      },
    ],
    table,
  );
  return router;
}
