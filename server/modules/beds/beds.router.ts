import { Router } from 'express';
import { bedCreateSchema, bedListQuerySchema, bedUpdateSchema } from '#shared/schemas/beds';
import { parseBody, parseChange, parseQuery } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import { actorOf } from '../audit/audit';
import type { RouteTableEntry } from '../../lib/routes';
import { recordId } from '../records/params';
import { pageOf } from '../records/paging';
import { plantingCounts, createBed, deleteBed, getBed, listBeds, updateBed } from './beds.service';
import { presentBed } from './beds.presenter';

export function bedsRouter(table: RouteTableEntry[]) {
  const router = Router();
  const one = async (gardenId: number, bedId: number) => {
    const bed = await getBed(gardenId, bedId);
    return presentBed(bed, (await plantingCounts(gardenId, [bed.id])).get(bed.id));
  };
  mountRoutes(
    router,
    '/api/gardens/:gardenId/beds',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const q = parseQuery(bedListQuerySchema, req.query);
          const { rows, count, counts } = await listBeds(req.membership!.gardenId, q);
          res.json(pageOf(rows.map((b) => presentBed(b, counts.get(b.id))), count, q));
        },
      },
      {
        method: 'post',
        path: '/',
        access: 'grower',
        handler: async (req, res) => {
          const bed = await createBed(req.membership!.gardenId, actorOf(requireSignedIn(req)), parseBody(bedCreateSchema, req.body));
          res.status(201).json({ bed: presentBed(bed) });
        },
      },
      {
        method: 'get',
        path: '/:bedId',
        access: 'viewer',
        handler: async (req, res) => {
          res.json({ bed: await one(req.membership!.gardenId, recordId(req.params, 'bedId')) });
        },
      },
      {
        method: 'patch',
        path: '/:bedId',
        access: 'grower',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const bedId = recordId(req.params, 'bedId');
          await updateBed(gardenId, bedId, actorOf(requireSignedIn(req)), parseChange(bedUpdateSchema, req.body));
          res.json({ bed: await one(gardenId, bedId) });
        },
      },
      {
        method: 'delete',
        path: '/:bedId',
        access: 'grower',
        handler: async (req, res) => {
          await deleteBed(req.membership!.gardenId, recordId(req.params, 'bedId'), actorOf(requireSignedIn(req)));
          res.status(204).end();
        },
      },
    ],
    table,
  );
  return router;
}
