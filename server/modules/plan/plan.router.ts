import { Router } from 'express';
import { planQuerySchema } from '#shared/schemas/plan';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { parseQuery } from '../../lib/validate';
import type { ReadCache } from '../../lib/read-cache';
import type { WeatherService } from '../weather/weather.service';
import { computePlan } from './plan.service';
import { presentPlan } from './plan.presenter';

export function planRouter(table: RouteTableEntry[], weather: WeatherService, cache: ReadCache) {
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId',
    [
      {
        method: 'get',
        path: '/plan',
        access: 'viewer',
        handler: async (req, res) => {
          const q = parseQuery(planQuerySchema, req.query);
          await cache.send(req, res, 'plan', async () => presentPlan(await computePlan(weather, req.membership!.gardenId, q)));
        },
      },
    ],
    table,
  );
  return router;
}
