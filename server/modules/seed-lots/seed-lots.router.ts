import { Router } from 'express';
import {
  germinationTestCreateSchema,
  seedLotCreateSchema,
  seedLotListQuerySchema,
  seedLotUpdateSchema,
  seedsToSowQuerySchema,
} from '#shared/schemas/seed-lots';
import { parseBody, parseChange, parseQuery } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import { actorOf } from '../audit/audit';
import type { RouteTableEntry } from '../../lib/routes';
import type { GerminationTest, SeedLot } from '../../db/models';
import { recordId } from '../records/params';
import { pageOf } from '../records/paging';
import { localDate } from '../../lib/local-date';
import { getGarden } from '../gardens/gardens.service';
import { effectiveCrops } from '../crops/crops.service';
import {
  addGerminationTest,
  createSeedLot,
  deleteGerminationTest,
  deleteSeedLot,
  getSeedLot,
  listSeedLots,
  seedsToSowFor,
  testsOf,
  updateSeedLot,
} from './seed-lots.service';
import { presentSeedLot, presentTest } from './seed-lots.presenter';
import type { ReadCache } from '../../lib/read-cache';

/** Presents lots with the garden's own seed-life figures and today's date in its time zone. */
async function presenter(gardenId: number) {
  const [garden, crops] = await Promise.all([getGarden(gardenId), effectiveCrops(gardenId)]);
  const today = localDate(garden.timeZone);
  return (lot: SeedLot, tests: Map<number, GerminationTest[]>, withTests = false) =>
    presentSeedLot(lot, tests.get(lot.id) ?? [], crops.get(lot.variety!.cropKey)?.seedLifeYears ?? null, today, withTests);
}

export function seedLotsRouter(table: RouteTableEntry[], cache: ReadCache) {
  const router = Router();
  const one = async (gardenId: number, lot: SeedLot) => (await presenter(gardenId))(lot, await testsOf([lot.id]), true);
  mountRoutes(
    router,
    '/api/gardens/:gardenId/seed-lots',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const { gardenId } = req.membership!;
          const q = parseQuery(seedLotListQuerySchema, req.query);
          await cache.send(req, res, 'seed-lots', async () => {
            const [{ rows, count, tests }, present] = await Promise.all([listSeedLots(gardenId, q), presenter(gardenId)]);
            return pageOf(rows.map((lot) => present(lot, tests)), count, q);
          });
        },
      },
      {
        method: 'post',
        path: '/',
        access: 'grower',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const lot = await createSeedLot(gardenId, actorOf(requireSignedIn(req)), parseBody(seedLotCreateSchema, req.body));
          res.status(201).json({ seedLot: await one(gardenId, lot) });
        },
      },
      {
        method: 'get',
        path: '/:seedLotId',
        access: 'viewer',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          res.json({ seedLot: await one(gardenId, await getSeedLot(gardenId, recordId(req.params, 'seedLotId'))) });
        },
      },
      {
        method: 'patch',
        path: '/:seedLotId',
        access: 'grower',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const lot = await updateSeedLot(gardenId, recordId(req.params, 'seedLotId'), actorOf(requireSignedIn(req)), parseChange(seedLotUpdateSchema, req.body));
          res.json({ seedLot: await one(gardenId, lot) });
        },
      },
      {
        method: 'delete',
        path: '/:seedLotId',
        access: 'grower',
        handler: async (req, res) => {
          await deleteSeedLot(req.membership!.gardenId, recordId(req.params, 'seedLotId'), actorOf(requireSignedIn(req)));
          res.status(204).end();
        },
      },
      {
        method: 'post',
        path: '/:seedLotId/germination-tests',
        access: 'grower',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const seedLotId = recordId(req.params, 'seedLotId');
          const test = await addGerminationTest(gardenId, seedLotId, actorOf(requireSignedIn(req)), parseBody(germinationTestCreateSchema, req.body));
          res.status(201).json({ test: presentTest(test), seedLot: await one(gardenId, await getSeedLot(gardenId, seedLotId)) });
        },
      },
      {
        method: 'delete',
        path: '/:seedLotId/germination-tests/:testId',
        access: 'grower',
        handler: async (req, res) => {
          await deleteGerminationTest(req.membership!.gardenId, recordId(req.params, 'seedLotId'), recordId(req.params, 'testId'), actorOf(requireSignedIn(req)));
          res.status(204).end();
        },
      },
      {
        method: 'get',
        path: '/:seedLotId/seeds-to-sow',
        access: 'viewer',
        handler: async (req, res) => {
          const seedLotId = recordId(req.params, 'seedLotId');
          const q = parseQuery(seedsToSowQuerySchema, req.query);
          res.json({ seedsToSow: await seedsToSowFor(req.membership!.gardenId, seedLotId, q) });
        },
      },
    ],
    table,
  );
  return router;
}
