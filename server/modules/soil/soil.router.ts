import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { soilReadingCreateSchema } from '#shared/schemas/soil';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import { actorOf } from '../audit/audit';
import type { RouteTableEntry } from '../../lib/routes';
import type { ReadCache } from '../../lib/read-cache';
import { parseBody } from '../../lib/validate';
import { recordId } from '../records/params';
import { addSoilReading, deleteSoilReading, gardenSoil } from './soil.service';

export function soilRouter(deps: { sequelize: Sequelize; table: RouteTableEntry[]; cache: ReadCache; now?: () => Date }) {
  const { sequelize, table, cache } = deps;
  const now = deps.now ?? (() => new Date());
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId/soil',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        // Keyed by the garden's revision: every soil write and weather write moves it.
        handler: async (req, res) => cache.send(req, res, 'soil', async () => gardenSoil(sequelize, req.membership!.garden, now())),
      },
      {
        method: 'post',
        path: '/readings',
        access: 'grower',
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const input = parseBody(soilReadingCreateSchema, req.body);
          res.status(201).json({ reading: await addSoilReading(sequelize, req.membership!.garden, actorOf(user), input, now()) });
        },
      },
      {
        method: 'delete',
        path: '/readings/:readingId',
        access: 'grower',
        handler: async (req, res) => {
          await deleteSoilReading(sequelize, req.membership!.garden, actorOf(requireSignedIn(req)), recordId(req.params, 'readingId'));
          res.status(204).end();
        },
      },
    ],
    table,
  );
  return router;
}
