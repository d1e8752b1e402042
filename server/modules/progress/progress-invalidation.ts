/**
 * Progress is cached per planting; these model hooks drop the rows a record change makes wrong,
 * inside the change's own transaction, whatever path made it (forms, CSV import, log entries),
 * and owe the garden an alert evaluation ("garden records changed", an outbox row in the same
 * transaction). Weather changes arrive as garden events of their own (weather-events.ts).
 */
import type { Transaction } from 'sequelize';
import { Bed, CropOverride, Garden, GerminationTest, Planting, PlantingLog, PlantingPhoto, SeedLot, Variety } from '../../db/models';
import { localDate } from '../../lib/local-date';
import { recordWeatherChanged } from '../weather/weather-events';
import type { ProgressRepository } from './progress.repository';

/** The consumers a record change owes an evaluation to; progress itself is dropped directly. */
const RECORD_CONSUMERS = ['alerts'] as const;

/** An outbox row in the change's transaction, or in one of its own when the change ran without one. */
async function owe(gardenId: number, transaction: Transaction | undefined) {
  const day = localDate('UTC');
  if (transaction) return recordWeatherChanged(transaction, { gardenId }, day, day, RECORD_CONSUMERS);
  await Planting.sequelize!.transaction((t) => recordWeatherChanged(t, { gardenId }, day, day, RECORD_CONSUMERS));
}

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
    for (const varietyId of ids) await registered!.invalidate({ gardenId: p.gardenId, varietyId }, tx(o));
    await registered!.invalidate({ gardenId: p.gardenId, plantingId: p.id }, tx(o));
    await owe(p.gardenId, tx(o));
  };
  Planting.addHook('afterCreate', 'progress', byPlanting);
  Planting.addHook('afterUpdate', 'progress', byPlanting);
  Planting.addHook('afterDestroy', 'progress', byPlanting);
  Variety.addHook('afterUpdate', 'progress', async (v: Variety, o) => {
    await registered!.invalidate({ gardenId: v.gardenId, varietyId: v.id }, tx(o));
    await owe(v.gardenId, tx(o));
  });
  const byOverride = async (c: CropOverride, o: { transaction?: Transaction | null }) => {
    await registered!.invalidate({ gardenId: c.gardenId, cropKey: c.cropKey }, tx(o));
    await owe(c.gardenId, tx(o));
  };
  CropOverride.addHook('afterCreate', 'progress', byOverride);
  CropOverride.addHook('afterUpdate', 'progress', byOverride);
  CropOverride.addHook('afterDestroy', 'progress', byOverride);
  // Records progress does not read still show on the garden's lists (bed and lot names, log
  // counts, photos): their changes move the garden's counter, which cached reads key on.
  const touched = async (r: object, o: { transaction?: Transaction | null }) => registered!.touch((r as { gardenId: number }).gardenId, tx(o));
  for (const model of [Bed, SeedLot, GerminationTest, PlantingLog, PlantingPhoto] as const) {
    for (const hook of ['afterCreate', 'afterUpdate', 'afterDestroy'] as const) (model as typeof Bed).addHook(hook, 'read-cache', touched);
  }
  Garden.addHook('afterUpdate', 'read-cache', async (g: Garden, o) => registered!.touch(g.id, tx(o)));
  Garden.addHook('afterUpdate', 'progress', async (g: Garden, o) => {
    if (['latitude', 'longitude', 'timeZone', 'units', 'weatherCellId'].some((k) => g.changed(k as keyof Garden))) {
      await registered!.invalidate({ gardenId: g.id }, tx(o));
      await owe(g.id, tx(o));
    }
  });
}
