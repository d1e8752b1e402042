import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { climateOverrideSchema } from '#shared/schemas/climate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import { actorOf } from '../audit/audit';
import type { RouteTableEntry } from '../../lib/routes';
import type { ReadCache } from '../../lib/read-cache';
import { parseChange } from '../../lib/validate';
import type { WeatherService } from '../weather/weather.service';
import { ClimateService } from './climate.service';

export function climateRouter(deps: { sequelize: Sequelize; weather: WeatherService; table: RouteTableEntry[]; cache: ReadCache }) {
  const { table, cache } = deps;
  const service = new ClimateService(deps.sequelize, deps.weather);
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId/climate',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const m = req.membership!;
          // Keyed by the garden's revision: stored weather and the override both move it.
          await cache.send(req, res, 'climate', async () => ({ climate: await service.climate(m.garden) }));
        },
      },
      {
        method: 'put',
        path: '/',
        access: 'owner',
        handler: async (req, res) => {
          const m = req.membership!;
          const user = requireSignedIn(req);
          const input = parseChange(climateOverrideSchema, req.body);
          const override = await service.setOverride(m.gardenId, actorOf(user), input);
          res.json({ override });
        },
      },
    ],
    table,
  );
  return router;
}
