/**
 * Progress is cached per planting; these model hooks drop the rows a record change makes wrong,
 * inside the change's own transaction, whatever path made it (forms, CSV import, log entries).
 * Weather changes arrive as garden events instead (jobs/processors/planting-progress.ts).
 */
import type { Transaction } from 'sequelize';
import { CropOverride, Garden, Planting, Variety } from '../../db/models';
import type { ProgressRepository } from './progress.repository';

let registered: ProgressRepository | null = null;

/**
 * Hooks live on the model classes, which outlive any one app (tests build many); they are added
 * once and call whichever repository registered last, so they always use the live connection.
 */
export function registerProgressInvalidation(repo: ProgressRepository) {
  const first = registered === null;
  registered = repo;
  if (!first) return;
  const tx = (o: { transaction?: Transaction | null }) => o.transaction ?? undefined;
  // A planting's dates also move its variety's own start window, hence its target: drop the variety's rows.
  const byPlanting = async (p: Planting, o: { transaction?: Transaction | null }) => {
    const ids = new Set([p.varietyId, p.previous('varietyId') as number | undefined].filter((id): id is number => !!id));
    for (const varietyId of ids) await registered!.invalidate({ varietyId }, tx(o));
    await registered!.invalidate({ plantingId: p.id }, tx(o));
  };
  Planting.addHook('afterCreate', 'progress', byPlanting);
  Planting.addHook('afterUpdate', 'progress', byPlanting);
  Planting.addHook('afterDestroy', 'progress', byPlanting);
  Variety.addHook('afterUpdate', 'progress', (v: Variety, o) => registered!.invalidate({ varietyId: v.id }, tx(o)));
  const byOverride = (c: CropOverride, o: { transaction?: Transaction | null }) => registered!.invalidate({ gardenId: c.gardenId, cropKey: c.cropKey }, tx(o));
  CropOverride.addHook('afterCreate', 'progress', byOverride);
  CropOverride.addHook('afterUpdate', 'progress', byOverride);
  CropOverride.addHook('afterDestroy', 'progress', byOverride);
  Garden.addHook('afterUpdate', 'progress', async (g: Garden, o) => {
    if (['latitude', 'longitude', 'timeZone', 'units', 'weatherCellId'].some((k) => g.changed(k as keyof Garden))) {
      await registered!.invalidate({ gardenId: g.id }, tx(o));
    }
  });
}
