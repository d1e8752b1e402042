import { Router } from 'express';
import { gardenUpdateSchema } from '#shared/schemas/gardens';
import { parseChange } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import { actorOf } from '../audit/audit';
import type { RouteTableEntry } from '../../lib/routes';
import { getGarden, listGardensFor, updateGarden } from './gardens.service';
import { presentGarden } from './gardens.presenter';
import type { WeatherService } from '../weather/weather.service';

export function gardensRouter(deps: { table: RouteTableEntry[]; weather: WeatherService }) {
  const { table, weather } = deps;
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens',
    [
      {
        method: 'get',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const rows = await listGardensFor(user.id);
          res.json({ gardens: rows.map((r) => presentGarden(r.garden, r.role)) });
        },
      },
      {
        method: 'get',
        path: '/:gardenId',
        access: 'viewer',
        handler: async (req, res) => {
          const m = req.membership!;
          res.json({ garden: presentGarden(await getGarden(m.gardenId), m.role) });
        },
      },
      {
        method: 'patch',
        path: '/:gardenId',
        access: 'owner',
        handler: async (req, res) => {
          const m = req.membership!;
          const input = parseChange(gardenUpdateSchema, req.body);
          const garden = await updateGarden(m.gardenId, actorOf(requireSignedIn(req)), input);
          const newCell = await weather.locateGarden(garden);
          if (newCell) void weather.prepareCell(newCell, garden.id);
          res.json({ garden: presentGarden(garden, m.role) });
        },
      },
    ],
    table,
  );
  return router;
}
