import { Router } from 'express';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { recordId } from '../records/params';
import type { ProgressService } from './progress.service';

export function progressRouter(progress: ProgressService, table: RouteTableEntry[]) {
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
          res.json(await progress.today(req.membership!.gardenId));
        },
      },
    ],
    table,
  );
  return router;
}
