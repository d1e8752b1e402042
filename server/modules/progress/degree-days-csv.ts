/**
 * A planting's day-by-day degree days as CSV: the series of the planting's progress answer (the
 * very figures the planting page charts), one row per day from the start event, in the garden's
 * unit, named in the header. Text cells go through the plantings export's `neutralise`; numbers
 * are written as the plain numbers the server computed (they cannot start a formula).
 */
import { sendCsv } from '../../lib/send-csv';
import { Router } from 'express';
import { stringify } from 'csv-stringify/sync';
import type { ProgressDto } from '#shared/schemas/progress';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { recordId } from '../records/params';
import { neutralise } from '../plantings/planting-csv';
import type { ProgressService } from './progress.service';

export function degreeDaysColumns(unit: ProgressDto['unit']): string[] {
  return ['date', `tmax_${unit}`, `tmin_${unit}`, 'source', `gdd_${unit}_days`, `cumulative_gdd_${unit}_days`];
}

export function degreeDaysCsv(progress: ProgressDto): string {
  const rows = progress.series.map((d) => [neutralise(d.date), String(d.tmax), String(d.tmin), neutralise(d.source), String(d.dd), String(d.cumulative)]);
  return stringify([degreeDaysColumns(progress.unit), ...rows], { record_delimiter: 'windows', bom: true, quoted_match: /[\r\n]/ });
}

export function degreeDaysCsvRouter(progress: ProgressService, table: RouteTableEntry[]) {
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId',
    [
      {
        method: 'get',
        path: '/plantings/:plantingId/degree-days.csv',
        access: 'viewer',
        handler: async (req, res) => {
          const { gardenId } = req.membership!;
          const plantingId = recordId(req.params, 'plantingId');
          const dto = JSON.parse(await progress.plantingProgress(gardenId, plantingId)) as ProgressDto;
          sendCsv(res, `degree-days-planting-${plantingId}-${dto.today}.csv`, degreeDaysCsv(dto));
        },
      },
    ],
    table,
  );
  return router;
}
