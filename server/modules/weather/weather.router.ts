import { Router } from 'express';
import type { ReadCache } from '../../lib/read-cache';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { MAX_WEATHER_DAYS, weatherImportFieldsSchema, weatherQuerySchema } from '#shared/schemas/weather';
import type { WeatherResponse } from '#shared/schemas/weather';
import { addDays, daysBetween } from '#shared/thermal/dates';
import { AppError } from '../../errors';
import { localDate } from '../../lib/local-date';
import { receiveOneFile } from '../../lib/upload';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import { actorOf } from '../audit/audit';
import type { RouteTableEntry } from '../../lib/routes';
import { parseBody, parseQuery } from '../../lib/validate';
import { getGarden } from '../gardens/gardens.service';
import { findGaps } from './weather-gaps';
import type { WeatherService } from './weather.service';
import { importStationCsv } from './weather-import';
import { activeThresholds } from './weather-thresholds';
import { presentDay, presentRun } from './weather.presenter';
import { loadGardenSoil } from './garden-soil';

const MAX_CSV_BYTES = 2 * 1024 * 1024;

/** One CSV file and its unit field, with every multipart limit set (413 when too large). */
const receiveCsv: RequestHandler = async (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    throw new AppError(415, 'unsupported_media_type', 'Send the file as multipart/form-data with a "file" field.');
  }
  const file = await receiveOneFile(req, res, 'file', { maxBytes: MAX_CSV_BYTES, fields: 1 });
  if (file && !/\.(csv|txt)$/i.test(file.originalname)) {
    throw new AppError(415, 'unsupported_file_type', 'Upload a .csv file (text with columns date, high, low).');
  }
  next();
};

/** `evaluate`: the garden's alerts, run at once after a "refresh now" so the grower sees them on return. */
export function weatherRouter(deps: { sequelize: Sequelize; weather: WeatherService; table: RouteTableEntry[]; cache: ReadCache; evaluate?: (gardenId: number) => Promise<unknown> }) {
  const { sequelize, weather, table, cache, evaluate } = deps;
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId/weather',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const q = parseQuery(weatherQuerySchema, req.query);
          const today = localDate(req.membership!.garden.timeZone, weather.now());
          // The days, gaps and thresholds follow the garden's counters and are kept; the history
          // status (a cell's loading progress, last refresh, error) is read fresh every time.
          const [cached, status] = await Promise.all([
            cache.remember(req, 'weather', async () => {
              const garden = await getGarden(req.membership!.gardenId);
              const from = q.from ?? addDays(q.to ?? today, -30);
              const to = q.to ?? addDays(today, weather.settings.forecastDays - 1);
              if (daysBetween(from, to) + 1 > MAX_WEATHER_DAYS) {
                const msg = `Ask for at most ${MAX_WEATHER_DAYS} days at a time.`;
                throw new AppError(400, 'validation_failed', msg, { [q.from ? 'from' : 'to']: msg });
              }
              const [days, soil] = await Promise.all([weather.gardenSeries(garden, from, to), loadGardenSoil(sequelize, garden, { from, to })]);
              const pastEnd = [to, addDays(today, -1)].sort()[0];
              const observedDates = new Set(days.filter((d) => d.source !== 'forecast').map((d) => d.date));
              const body: Omit<WeatherResponse, 'history'> = {
                unit: garden.units,
                thresholds: await activeThresholds(garden.id, garden.units),
                from,
                to,
                today,
                days: days.map((d) => presentDay(d, garden.units, soil.get(d.date))),
                gaps: from <= pastEnd ? findGaps(observedDates, from, pastEnd) : [],
              };
              return body;
            }),
            weather.backfillStatus(req.membership!.garden.weatherCellId),
          ]);
          const body: WeatherResponse = {
            ...cached,
            history: status && { ...status, refreshedAt: status.refreshedAt ? new Date(status.refreshedAt).toISOString() : null },
          };
          res.json(body);
        },
      },
      {
        method: 'post',
        path: '/refresh',
        access: 'grower',
        handler: async (req, res) => {
          const garden = await getGarden(req.membership!.gardenId);
          if (!garden.weatherCellId) {
            throw new AppError(409, 'no_location', 'Set the garden location in Garden settings before fetching weather.');
          }
          const run = await weather.runRefresh({ kind: 'manual', gardenId: garden.id, cellId: garden.weatherCellId });
          await evaluate?.(garden.id);
          void weather.backfill(garden.weatherCellId);
          res.json({ run });
        },
      },
      {
        method: 'post',
        path: '/imports',
        access: 'grower',
        before: [receiveCsv],
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const fields = parseBody(weatherImportFieldsSchema, { ...req.body });
          if (!req.file) throw new AppError(400, 'validation_failed', 'Choose a CSV file to upload.', { file: 'Choose a CSV file to upload.' });
          const garden = await getGarden(req.membership!.gardenId);
          const result = await importStationCsv(sequelize, {
            gardenId: garden.id,
            actor: actorOf(user),
            fileName: req.file.originalname,
            buffer: req.file.buffer,
            unit: fields.unit,
            today: localDate(garden.timeZone, weather.now()),
          }, () => weather.eventsCommitted());
          res.status(result.alreadyImported ? 200 : 201).json({ import: result });
        },
      },
      {
        method: 'get',
        path: '/runs',
        access: 'owner',
        handler: async (req, res) => {
          const runs = await weather.repo.runs(req.membership!.gardenId, 20);
          res.json({ runs: runs.map(presentRun) });
        },
      },
    ],
    table,
  );
  return router;
}
