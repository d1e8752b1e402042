import { Router } from 'express';
import { alertListQuerySchema } from '#shared/schemas/alerts';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { parseQuery } from '../../lib/validate';
import { recordId } from '../records/params';
import type { AlertService } from './alerts.service';
import type { ReadCache } from '../../lib/read-cache';

export function alertsRouter(alerts: AlertService, table: RouteTableEntry[], cache: ReadCache) {
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId/alerts',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const { gardenId } = req.membership!;
          const q = parseQuery(alertListQuerySchema, req.query);
          await cache.send(req, res, 'alerts', async () => {
            await alerts.ensureEvaluated(gardenId);
            return { items: await alerts.list(gardenId, q) };
          });
        },
      },
      // Registered before '/:alertId/…' so the literal path is not read as an id.
      {
        method: 'get',
        path: '/counts',
        access: 'viewer',
        handler: async (req, res) => {
          const { gardenId } = req.membership!;
          await cache.send(req, res, 'alert-counts', async () => {
            await alerts.ensureEvaluated(gardenId);
            return alerts.counts(gardenId);
          });
        },
      },
      {
        method: 'post',
        path: '/:alertId/acknowledge',
        access: 'grower',
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          res.json({ alert: await alerts.acknowledge(req.membership!.gardenId, recordId(req.params, 'alertId'), user.id) });
        },
      },
    ],
    table,
  );
  return router;
}
