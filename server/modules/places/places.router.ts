import { Router } from 'express';
import { placesQuerySchema } from '#shared/schemas/places';
import type { PlacesResponse } from '#shared/schemas/places';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { parseQuery } from '../../lib/validate';
import { findPlaces } from './places.service';

export function placesRouter(table: RouteTableEntry[]) {
  const router = Router();
  mountRoutes(
    router,
    '/api/places',
    [
      {
        method: 'get',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          const { q } = parseQuery(placesQuerySchema, req.query);
          const body: PlacesResponse = { items: await findPlaces(q) };
          // Not kept by the browser: a grower's searches say where they live.
          res.set('Cache-Control', 'no-store').json(body);
        },
      },
    ],
    table,
  );
  return router;
}
