import { Router } from 'express';
import { varietyCreateSchema, varietyListQuerySchema, varietyUpdateSchema } from '#shared/schemas/varieties';
import { parseBody, parseChange, parseQuery } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import { actorOf } from '../audit/audit';
import type { RouteTableEntry } from '../../lib/routes';
import { recordId } from '../records/params';
import { pageOf } from '../records/paging';
import { getGarden } from '../gardens/gardens.service';
import { cropOrNotFound, effectiveCrops, effectiveValues, getCrop } from '../crops/crops.service';
import { createVariety, deleteVariety, getVariety, listVarieties, updateVariety } from './varieties.service';
import { presentVariety } from './varieties.presenter';
import { varietyTarget, varietyTargets } from './variety-target';
import type { WeatherService } from '../weather/weather.service';
import type { ReadCache } from '../../lib/read-cache';
import type { ProgressService } from '../progress/progress.service';
import { calibrationOf } from './calibration';

export function varietiesRouter(table: RouteTableEntry[], weather: WeatherService, cache: ReadCache, progress: ProgressService) {
  const router = Router();
  const detail = async (gardenId: number, varietyId: number) => {
    const variety = await getVariety(gardenId, varietyId);
    const crop = effectiveValues(await getCrop(gardenId, variety.cropKey));
    const target = await varietyTarget(await getGarden(gardenId), variety, crop, (g) => weather.gardenHistory(g));
    return presentVariety(variety, crop.season, target);
  };
  mountRoutes(
    router,
    '/api/gardens/:gardenId/varieties',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const { gardenId } = req.membership!;
          const q = parseQuery(varietyListQuerySchema, req.query);
          await cache.send(req, res, 'varieties', async () => {
            const [{ rows, count }, crops, garden] = await Promise.all([listVarieties(gardenId, q), effectiveCrops(gardenId), getGarden(gardenId)]);
            const cropOf = (v: { cropKey: string }) => crops.get(v.cropKey) ?? effectiveValues({ crop: cropOrNotFound(v.cropKey), overrides: new Map() });
            const targets = await varietyTargets(garden, rows, cropOf, (g) => weather.gardenHistory(g));
            return pageOf(rows.map((v) => presentVariety(v, cropOf(v).season, targets.get(v.id))), count, q);
          });
        },
      },
      {
        method: 'post',
        path: '/',
        access: 'grower',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const variety = await createVariety(gardenId, actorOf(requireSignedIn(req)), parseBody(varietyCreateSchema, req.body));
          res.status(201).json({ variety: await detail(gardenId, variety.id) });
        },
      },
      {
        method: 'get',
        path: '/:varietyId',
        access: 'viewer',
        handler: async (req, res) => {
          res.json({ variety: await detail(req.membership!.gardenId, recordId(req.params, 'varietyId')) });
        },
      },
      {
        method: 'get',
        path: '/:varietyId/calibration',
        access: 'viewer',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const variety = await getVariety(gardenId, recordId(req.params, 'varietyId'));
          await cache.send(req, res, 'calibration', () => calibrationOf(progress, gardenId, variety));
        },
      },
      {
        method: 'patch',
        path: '/:varietyId',
        access: 'grower',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const varietyId = recordId(req.params, 'varietyId');
          await updateVariety(gardenId, varietyId, actorOf(requireSignedIn(req)), parseChange(varietyUpdateSchema, req.body));
          res.json({ variety: await detail(gardenId, varietyId) });
        },
      },
      {
        method: 'delete',
        path: '/:varietyId',
        access: 'grower',
        handler: async (req, res) => {
          await deleteVariety(req.membership!.gardenId, recordId(req.params, 'varietyId'), actorOf(requireSignedIn(req)));
          res.status(204).end();
        },
      },
    ],
    table,
  );
  return router;
}
