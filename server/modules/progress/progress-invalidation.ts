/**
 * Progress is cached per planting; these model hooks drop the rows a record change makes wrong,
 * inside the change's own transaction, whatever path made it (forms, CSV import, log entries),
 * and owe the garden an alert evaluation ("garden records changed", an outbox row in the same
 * transaction). Weather changes arrive as garden events of their own (weather-events.ts).
 */
import type { Model, Sequelize, Transaction } from 'sequelize';
import { Bed, CropOverride, Garden, GerminationTest, Planting, PlantingLog, PlantingPhoto, SeedLot, Variety } from '../../db/models';
import { localDate } from '../../lib/local-date';
import { recordWeatherChanged } from '../weather/weather-events';
import { ProgressRepository } from './progress.repository';

/** The consumers a record change owes an evaluation to; progress itself is dropped directly. */
const RECORD_CONSUMERS = ['alerts'] as const;

/** An outbox row in the change's transaction, or in one of its own when the change ran without one. */
async function owe(gardenId: number, transaction: Transaction | undefined) {
  const day = localDate('UTC');
  if (transaction) return recordWeatherChanged(transaction, { gardenId }, day, day, RECORD_CONSUMERS);
  await Planting.sequelize!.transaction((t) => recordWeatherChanged(t, { gardenId }, day, day, RECORD_CONSUMERS));
}

type HookOptions = { transaction?: Transaction | null };

/** The repository on the change's own connection (its transaction's, else its model's). */
function repoOf(record: Model, o: HookOptions): ProgressRepository {
  const db = (o.transaction as (Transaction & { sequelize?: Sequelize }) | null | undefined)?.sequelize ?? (record.constructor as typeof Model).sequelize!;
  let repo = repos.get(db);
  if (!repo) repos.set(db, (repo = new ProgressRepository(db)));
  return repo;
}
const repos = new WeakMap<Sequelize, ProgressRepository>();

/** Hooks added by name; `Model.init` (a rebinding in tests) drops them, so they are checked each time. */
function hasOurHook(model: object, type: string, name: string): boolean {
  const hooks = (model as unknown as { options?: { hooks?: Record<string, Array<{ name?: string }>> } }).options?.hooks?.[type] ?? [];
  return hooks.some((h) => h?.name === name);
}

/**
 * Hooks live on the model classes, which outlive any one app (tests build many); each call adds
 * those missing (a model bound again has none) and every hook works on the connection of the
 * change it follows.
 */
export function registerProgressInvalidation() {
  if (hasOurHook(Planting, 'afterCreate', 'progress') && hasOurHook(Bed, 'afterCreate', 'read-cache')) return;
  const tx = (o: HookOptions) => o.transaction ?? undefined;
  // A planting's dates also move its variety's own start window, hence its target: drop the variety's rows.
  const byPlanting = async (p: Planting, o: HookOptions) => {
    const repo = repoOf(p, o);
    const ids = new Set([p.varietyId, p.previous('varietyId') as number | undefined].filter((id): id is number => !!id));
    for (const varietyId of ids) await repo.invalidate({ gardenId: p.gardenId, varietyId }, tx(o));
    await repo.invalidate({ gardenId: p.gardenId, plantingId: p.id }, tx(o));
    await owe(p.gardenId, tx(o));
  };
  Planting.addHook('afterCreate', 'progress', byPlanting);
  Planting.addHook('afterUpdate', 'progress', byPlanting);
  Planting.addHook('afterDestroy', 'progress', byPlanting);
  Variety.addHook('afterUpdate', 'progress', async (v: Variety, o) => {
    await repoOf(v, o).invalidate({ gardenId: v.gardenId, varietyId: v.id }, tx(o));
    await owe(v.gardenId, tx(o));
  });
  const byOverride = async (c: CropOverride, o: HookOptions) => {
    await repoOf(c, o).invalidate({ gardenId: c.gardenId, cropKey: c.cropKey }, tx(o));
    await owe(c.gardenId, tx(o));
  };
  CropOverride.addHook('afterCreate', 'progress', byOverride);
  CropOverride.addHook('afterUpdate', 'progress', byOverride);
  CropOverride.addHook('afterDestroy', 'progress', byOverride);
  // Records progress does not read still show on the garden's lists (bed and lot names, log
  // counts, photos, a new or removed variety): their changes move the garden's revision only.
  const touched = async (r: Model, o: HookOptions) => repoOf(r, o).touch((r as unknown as { gardenId: number }).gardenId, tx(o));
  for (const model of [Bed, SeedLot, GerminationTest, PlantingLog, PlantingPhoto] as const) {
    for (const hook of ['afterCreate', 'afterUpdate', 'afterDestroy'] as const) (model as typeof Bed).addHook(hook, 'read-cache', touched);
  }
  Variety.addHook('afterCreate', 'read-cache', touched);
  Variety.addHook('afterDestroy', 'read-cache', touched);
  Garden.addHook('afterUpdate', 'read-cache', async (g: Garden, o) => repoOf(g, o).touch(g.id, tx(o)));
  Garden.addHook('afterUpdate', 'progress', async (g: Garden, o) => {
    if (['latitude', 'longitude', 'timeZone', 'units', 'weatherCellId'].some((k) => g.changed(k as keyof Garden))) {
      await repoOf(g, o).invalidate({ gardenId: g.id }, tx(o));
      await owe(g.id, tx(o));
    }
  });
}
