import { sendCsv } from '../../lib/send-csv';
import { Router } from 'express';
import { stringify } from 'csv-stringify/sync';
import { compareQuerySchema } from '#shared/schemas/compare';
import type { CompareDto } from '#shared/schemas/compare';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { parseQuery } from '../../lib/validate';
import type { ReadCache } from '../../lib/read-cache';
import type { ProgressService } from '../progress/progress.service';
import { neutralise } from '../plantings/planting-csv';
import { computeCompare } from './compare.service';

export function compareColumns(unit: CompareDto['unit']): string[] {
  return [
    'planting_id',
    'variety',
    'season',
    'start_on',
    'first_harvest_on',
    'bolted_on',
    'days_to_harvest',
    `dd_to_harvest_${unit}_days`,
    'days_to_bolt',
    `dd_to_bolt_${unit}_days`,
    `heat_days_above_${unit}`,
    'longest_hot_streak_days',
    'heat_counted_until',
    'day_length_at_bolt_hours',
    'bolted_before_harvest',
  ];
}

/** The per-planting rows of the comparison: text cells neutralised, numbers as the plain numbers computed. */
export function compareCsv(dto: CompareDto): string {
  const names = new Map(dto.varieties.map((v) => [v.varietyId, v.name]));
  const num = (x: number | null) => (x === null ? '' : String(x));
  const text = (x: string | null) => (x === null ? '' : neutralise(x));
  const rows = dto.plantings.map((p) => [
    String(p.plantingId),
    text(names.get(p.varietyId) ?? ''),
    text(p.seasonLabel),
    text(p.startOn),
    text(p.firstHarvestOn),
    text(p.boltedOn),
    num(p.daysToHarvest),
    num(p.ddToHarvest),
    num(p.daysToBolt),
    num(p.ddToBolt),
    num(p.heatDays),
    num(p.longestHotStreak),
    text(p.heatUntil),
    num(p.dayLengthAtBolt),
    p.boltedBeforeHarvest === null ? '' : p.boltedBeforeHarvest ? 'yes' : 'no',
  ]);
  const header = compareColumns(dto.unit).map((c) => (dto.heatThreshold !== null && c.startsWith('heat_days_above_') ? `heat_days_above_${dto.heatThreshold}_${dto.unit}` : c));
  return stringify([header, ...rows], { record_delimiter: 'windows', bom: true, quoted_match: /[\r\n]/ });
}

export function compareRouter(table: RouteTableEntry[], progress: ProgressService, cache: ReadCache) {
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId',
    [
      {
        method: 'get',
        path: '/compare',
        access: 'viewer',
        handler: async (req, res) => {
          const q = parseQuery(compareQuerySchema, req.query);
          await cache.send(req, res, 'compare', () => computeCompare(progress, req.membership!.gardenId, q));
        },
      },
      {
        method: 'get',
        path: '/compare.csv',
        access: 'viewer',
        handler: async (req, res) => {
          const q = parseQuery(compareQuerySchema, req.query);
          const dto = await computeCompare(progress, req.membership!.gardenId, q);
          sendCsv(res, `compare-${dto.crop.key}.csv`, compareCsv(dto));
        },
      },
    ],
    table,
  );
  return router;
}
