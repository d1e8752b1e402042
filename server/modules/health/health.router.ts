import { Router } from 'express';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';

const READY_TIMEOUT_MS = 1500;

interface Readiness {
  ok: boolean;
  /** Galera's wsrep_local_state_comment when the server runs wsrep (absent on a plain server). */
  node?: string;
}

/**
 * Answers whether the database takes a query within a short bound; never hangs. On a Galera node
 * the node must also be Synced: a Joining, Donor or cut-off node answers SHOW STATUS but refuses
 * or lags real work (1047), so a balancer should send traffic elsewhere. A server without wsrep
 * has no such row and stays ready.
 */
async function databaseReadiness(sequelize: Sequelize): Promise<Readiness> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<Readiness>((resolve) => {
    timer = setTimeout(() => resolve({ ok: false }), READY_TIMEOUT_MS);
  });
  const probe = sequelize
    .query<{ Variable_name: string; Value: string }>("SHOW STATUS LIKE 'wsrep_local_state_comment'", { type: QueryTypes.SELECT })
    .then(
      (rows): Readiness => {
        const node = rows[0]?.Value;
        return node === undefined ? { ok: true } : { ok: node === 'Synced', node };
      },
      (): Readiness => ({ ok: false }),
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
          const { ok, node } = await databaseReadiness(sequelize);
          if (!ok) res.set('Retry-After', '5');
          res.status(ok ? 200 : 503).json({ status: ok ? 'ready' : 'unavailable', database: ok ? 'up' : 'down', ...(node !== undefined ? { node } : {}) });
        },
      },
    ],
    table,
  );
  return router;
}
