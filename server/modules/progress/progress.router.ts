import { Router } from 'express';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { recordId } from '../records/params';
import type { ProgressService } from './progress.service';
import { TODAY_LIMIT } from '#shared/schemas/progress';
import { asTodayAction } from '../alerts/alerts.service';
import type { AlertService } from '../alerts/alerts.service';
import type { ReadCache } from '../../lib/read-cache';

export function progressRouter(progress: ProgressService, alerts: AlertService, table: RouteTableEntry[], cache: ReadCache) {
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
          const { gardenId } = req.membership!;
          const plantingId = recordId(req.params, 'plantingId');
          await cache.sendText(req, res, 'progress', () => progress.plantingProgress(gardenId, plantingId));
        },
      },
      {
        method: 'get',
        path: '/today',
        access: 'viewer',
        handler: async (req, res) => {
          const { gardenId } = req.membership!;
          await cache.send(req, res, 'today', async () => {
            await alerts.ensureEvaluated(gardenId);
            const [today, open, counts] = await Promise.all([progress.today(gardenId), alerts.list(gardenId, { status: 'open', limit: TODAY_LIMIT }), alerts.counts(gardenId)]);
            // Alerts come most severe first (the list's order); Today shows the first of them.
            return { ...today, actions: open.map(asTodayAction), actionsTotal: counts.open };
          });
        },
      },
    ],
    table,
  );
  return router;
}
