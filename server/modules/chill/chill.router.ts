import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import type { ReadCache } from '../../lib/read-cache';
import { AppError } from '../../errors';
import { gardenChill } from './chill.service';

export function chillRouter(deps: { sequelize: Sequelize; table: RouteTableEntry[]; cache: ReadCache }) {
  const { table, cache } = deps;
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId/chill',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const m = req.membership!;
          const latitude = m.garden.latitude;
          if (latitude === null) throw new AppError(409, 'no_location', 'The garden has no location yet, so it has no weather to count winter chill from.');
          // Keyed by the garden's revision, which every weather write moves.
          await cache.send(req, res, 'chill', async () => gardenChill(deps.sequelize, { ...m.garden, latitude }));
        },
      },
    ],
    table,
  );
  return router;
}
