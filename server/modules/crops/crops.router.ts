import { Router } from 'express';
import { z } from 'zod';
import { cropKeySchema, cropListQuerySchema, cropOverridesUpdateSchema } from '#shared/schemas/crops';
import { nothingToChange, parseBody, parseQuery } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import { actorOf } from '../audit/audit';
import type { RouteTableEntry } from '../../lib/routes';
import { validationError } from '../../errors';
import { getCrop, listCrops, updateCropOverrides } from './crops.service';
import { presentCrop } from './crops.presenter';

function cropKeyOf(params: Record<string, unknown>): string {
  const result = z.strictObject({ cropKey: cropKeySchema }).safeParse({ cropKey: params.cropKey });
  if (!result.success) throw validationError(result.error, 'params');
  return result.data.cropKey;
}

export function cropsRouter(table: RouteTableEntry[]) {
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId/crops',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const crops = await listCrops(req.membership!.gardenId, parseQuery(cropListQuerySchema, req.query));
          res.json({ crops: crops.map(presentCrop) });
        },
      },
      {
        method: 'get',
        path: '/:cropKey',
        access: 'viewer',
        handler: async (req, res) => {
          res.json({ crop: presentCrop(await getCrop(req.membership!.gardenId, cropKeyOf(req.params))) });
        },
      },
      {
        // Crop parameters steer every planting's projection in the garden, like its settings.
        method: 'patch',
        path: '/:cropKey',
        access: 'owner',
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const cropKey = cropKeyOf(req.params);
          const input = parseBody(cropOverridesUpdateSchema, req.body);
          if (Object.keys(input.params).length === 0) throw nothingToChange();
          res.json({ crop: presentCrop(await updateCropOverrides(req.membership!.gardenId, actorOf(user), cropKey, input)) });
        },
      },
    ],
    table,
  );
  return router;
}
