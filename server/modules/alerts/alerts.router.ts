import { Router } from 'express';
import { alertListQuerySchema } from '#shared/schemas/alerts';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { parseQuery } from '../../lib/validate';
import { recordId } from '../records/params';
import type { AlertService } from './alerts.service';

export function alertsRouter(alerts: AlertService, table: RouteTableEntry[]) {
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
          const gardenId = req.membership!.gardenId;
          const q = parseQuery(alertListQuerySchema, req.query);
          await alerts.ensureEvaluated(gardenId);
          res.json({ items: await alerts.list(gardenId, q) });
        },
      },
      // Registered before '/:alertId/…' so the literal path is not read as an id.
      {
        method: 'get',
        path: '/counts',
        access: 'viewer',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          await alerts.ensureEvaluated(gardenId);
          res.json(await alerts.counts(gardenId));
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
