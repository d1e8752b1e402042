import { Router } from 'express';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { recordId } from '../records/params';
import type { ProgressService } from './progress.service';
import { asTodayAction } from '../alerts/alerts.service';
import type { AlertService } from '../alerts/alerts.service';

export function progressRouter(progress: ProgressService, alerts: AlertService, table: RouteTableEntry[]) {
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId',
    [
      {
        method: 'get',
        path: '/plantings/:plantingId/progress',
        access: 'viewer',
        handler: async (req, res) => {
          const body = await progress.plantingProgress(req.membership!.gardenId, recordId(req.params, 'plantingId'));
          res.type('application/json').send(body);
        },
      },
      {
        method: 'get',
        path: '/today',
        access: 'viewer',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          await alerts.ensureEvaluated(gardenId);
          const [today, open] = await Promise.all([progress.today(gardenId), alerts.list(gardenId, { status: 'open' })]);
          res.json({ ...today, actions: open.map(asTodayAction) });
        },
      },
    ],
    table,
  );
  return router;
}
