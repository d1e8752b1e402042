import { sendCsv } from '../../lib/send-csv';
import { Router } from 'express';
import { logEntryCreateSchema, logListQuerySchema, plantingCreateSchema, plantingListQuerySchema, plantingPreviewQuerySchema, plantingUpdateSchema } from '#shared/schemas/plantings';
import type { AppConfig } from '../../config';
import { parseBody, parseChange, parseQuery } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { AppError } from '../../errors';
import { actorOf } from '../audit/audit';
import { recordId } from '../records/params';
import { pageOf } from '../records/paging';
import { receiveOneFile } from '../../lib/upload';
import { localDate } from '../../lib/local-date';
import { getGarden } from '../gardens/gardens.service';
import { removePhotoFiles } from '../photos/photos.service';
import { createPlanting, deletePlanting, getPlanting, listPlantings, updatePlanting } from './plantings.service';
import { addLogEntry, deleteLogEntry, getLogEntry, listLog } from './planting-log.service';
import { exportPlantingsCsv, importPlantingsCsv } from './planting-csv';
import { presentPlanting } from './plantings.presenter';
import { presentLogEntry } from './planting-log.presenter';
import type { Planting } from '../../db/models';
import type { ProgressService } from '../progress/progress.service';
import type { ReadCache } from '../../lib/read-cache';

const CSV_MAX_BYTES = 2 * 1024 * 1024;


export function plantingsRouter(config: AppConfig, table: RouteTableEntry[], progress: ProgressService, cache: ReadCache) {
  const router = Router();
  /** What presenting a planting needs of its garden: the latitude (seasons) and its today. */
  const gardenFacts = async (gardenId: number) => {
    const { garden, today } = await progress.gardenToday(gardenId);
    return { latitude: garden.latitude, today };
  };
  /** One planting with its progress, as every single-planting answer gives it. */
  const present = async (gardenId: number, planting: Planting) => {
    const [facts, summaries] = await Promise.all([gardenFacts(gardenId), progress.summaries(gardenId, [planting.id])]);
    return presentPlanting(planting, facts, summaries.get(planting.id) ?? null);
  };
  mountRoutes(
    router,
    '/api/gardens/:gardenId/plantings',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const { gardenId, garden } = req.membership!;
          const q = parseQuery(plantingListQuerySchema, req.query);
          const today = localDate(garden.timeZone, progress.now());
          await cache.send(req, res, 'plantings', async () => {
            // Sorting by progress, readiness or risk orders every planting by its stored figure:
            // those rows must be there for today first. Other orders need only the page's.
            if (q.sort === 'progress' || q.sort === 'ready' || q.sort === 'risk') await progress.refreshGarden(gardenId);
            const { rows, count } = await listPlantings(gardenId, q);
            const summaries = await progress.summaries(gardenId, rows.map((p) => p.id));
            const facts = { latitude: garden.latitude, today };
            return pageOf(rows.map((p) => presentPlanting(p, facts, summaries.get(p.id) ?? null)), count, q);
          });
        },
      },
      {
        method: 'get',
        path: '/preview',
        access: 'viewer',
        handler: async (req, res) => {
          const q = parseQuery(plantingPreviewQuerySchema, req.query);
          await cache.send(req, res, 'planting-preview', () =>
            progress.preview(req.membership!.gardenId, { varietyId: q.varietyId, method: q.method, sownOn: q.sownOn ?? null, transplantedOn: q.transplantedOn ?? null }),
          );
        },
      },
      {
        method: 'post',
        path: '/',
        access: 'grower',
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const gardenId = req.membership!.gardenId;
          const planting = await createPlanting(gardenId, actorOf(user), parseBody(plantingCreateSchema, req.body));
          res.status(201).json({ planting: await present(gardenId, planting) });
        },
      },
      // Registered before '/:plantingId' so the literal paths are not read as ids.
      {
        method: 'get',
        path: '/export.csv',
        access: 'viewer',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const garden = await getGarden(gardenId);
          const csv = await exportPlantingsCsv(gardenId);
          sendCsv(res, `plantings-${localDate(garden.timeZone)}.csv`, csv);
        },
      },
      {
        method: 'post',
        path: '/import',
        access: 'grower',
        // Importing the same file again changes nothing (planting-csv.ts), key or no key.
        idempotent: false,
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const file = await receiveOneFile(req, res, 'file', { maxBytes: CSV_MAX_BYTES, fields: 0 });
          if (!file) throw new AppError(400, 'validation_failed', 'Please check the fields: file.', { file: 'Attach the plantings CSV file.' });
          res.json({ report: await importPlantingsCsv(req.membership!.gardenId, actorOf(user), file.buffer) });
        },
      },
      {
        method: 'get',
        path: '/:plantingId',
        access: 'viewer',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const planting = await getPlanting(gardenId, recordId(req.params, 'plantingId'));
          res.json({ planting: await present(gardenId, planting) });
        },
      },
      {
        method: 'patch',
        path: '/:plantingId',
        access: 'grower',
        handler: async (req, res) => {
          const gardenId = req.membership!.gardenId;
          const plantingId = recordId(req.params, 'plantingId');
          const planting = await updatePlanting(gardenId, plantingId, actorOf(requireSignedIn(req)), parseChange(plantingUpdateSchema, req.body));
          res.json({ planting: await present(gardenId, planting) });
        },
      },
      {
        method: 'delete',
        path: '/:plantingId',
        access: 'grower',
        handler: async (req, res) => {
          const files = await deletePlanting(req.membership!.gardenId, recordId(req.params, 'plantingId'), actorOf(requireSignedIn(req)));
          await removePhotoFiles(config.uploads, files);
          res.status(204).end();
        },
      },
      {
        method: 'get',
        path: '/:plantingId/log',
        access: 'viewer',
        handler: async (req, res) => {
          const plantingId = recordId(req.params, 'plantingId');
          const q = parseQuery(logListQuerySchema, req.query);
          const { rows, count } = await listLog(req.membership!.gardenId, plantingId, q);
          res.json(pageOf(rows.map(presentLogEntry), count, q));
        },
      },
      {
        method: 'post',
        path: '/:plantingId/log',
        access: 'grower',
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const gardenId = req.membership!.gardenId;
          const plantingId = recordId(req.params, 'plantingId');
          const entry = await addLogEntry(gardenId, plantingId, actorOf(user), parseBody(logEntryCreateSchema, req.body));
          const planting = await getPlanting(gardenId, plantingId);
          res.status(201).json({
            entry: presentLogEntry(await getLogEntry(gardenId, plantingId, entry.id)),
            planting: await present(gardenId, planting),
          });
        },
      },
      {
        method: 'delete',
        path: '/:plantingId/log/:entryId',
        access: 'grower',
        handler: async (req, res) => {
          await deleteLogEntry(req.membership!.gardenId, recordId(req.params, 'plantingId'), recordId(req.params, 'entryId'));
          res.status(204).end();
        },
      },
    ],
    table,
  );
  return router;
}
