import { Op, fn, literal } from 'sequelize';
import type { Includeable, Order, OrderItem, Transaction, WhereOptions } from 'sequelize';
import type { z } from 'zod';
import { plantingCreateSchema } from '#shared/schemas/plantings';
import type { PlantingCreateInput, PlantingUpdateInput, plantingListQuerySchema } from '#shared/schemas/plantings';
import { Bed, Planting, PlantingPhoto, SeedLot, Variety } from '../../db/models';
import { AppError, validationError } from '../../errors';
import { likeText, limitOffset } from '../records/paging';
import { bedInGarden, seedLotInGarden, varietyInGarden } from '../records/scope';
import { plantingFields } from './plantings.presenter';
import { inTransaction } from '../../lib/transaction';
import { uniqueOr409 } from '../records/unique';
import { changedFields, fieldsOf, recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { changedSummary } from '../audit/audit-words';
import { PLANTING_FIELDS, plantingSubject, plantingView } from '../audit/audit-views';

type PlantingListQuery = z.output<typeof plantingListQuerySchema>;

export const duplicatePlanting = 'This garden already has a planting of that variety in that bed, by the same method, started that day.';

export const plantingIncludes: Includeable[] = [
  { model: Bed, as: 'bed', required: true },
  { model: Variety, as: 'variety', required: true },
  { model: SeedLot, as: 'seedLot', required: false },
];

const logCount = literal('(SELECT COUNT(*) FROM planting_logs AS l WHERE l.planting_id = `Planting`.`id`)');
// The latest log entry's day, for the stale-planting flag (an index-only read of planting_logs_planting_date).
const lastLogOn = literal('(SELECT MAX(l.entry_on) FROM planting_logs AS l WHERE l.planting_id = `Planting`.`id`)');

const CACHED_SORT = { progress: 'percent', ready: 'ready_on', risk: 'bolt_rank' } as const;

function orderFor(q: PlantingListQuery): Order {
  const dir = q.order === 'desc' ? 'DESC' : 'ASC';
  const byVariety = (field: string): OrderItem => [{ model: Variety, as: 'variety' }, field, dir];
  const tail: OrderItem[] = [['startOn', dir], ['id', dir]];
  switch (q.sort) {
    case 'crop':
      return [byVariety('cropKey'), byVariety('name'), ...tail];
    case 'variety':
      return [byVariety('name'), ...tail];
    case 'bed':
      return [[{ model: Bed, as: 'bed' }, 'name', dir], ...tail];
    case 'status':
      return [['status', dir], ...tail];
    // The progress cache holds these as columns (refreshed for today before a list is read);
    // plantings without the figure come last either way.
    case 'progress':
    case 'ready':
    case 'risk': {
      const figure = literal(`(SELECT pp.${CACHED_SORT[q.sort]} FROM planting_progress pp WHERE pp.planting_id = \`Planting\`.\`id\`)`);
      return [[fn('ISNULL', figure), 'ASC'], [figure, dir], ...tail];
    }
    default:
      // Undated (planned) plantings come last whichever way the dates run.
      return [[literal('`Planting`.`start_on` IS NULL'), 'ASC'], ...tail];
  }
}

export async function listPlantings(gardenId: number, q: PlantingListQuery) {
  const and: WhereOptions<Planting>[] = [{ gardenId }];
  if (q.status) and.push({ status: q.status });
  if (q.bedId) and.push({ bedId: q.bedId });
  if (q.varietyId) and.push({ varietyId: q.varietyId });
  if (q.seedLotId) and.push({ seedLotId: q.seedLotId });
  if (q.crop) and.push({ '$variety.crop_key$': q.crop });
  if (q.sownFrom) and.push({ startOn: { [Op.gte]: q.sownFrom } });
  if (q.sownTo) and.push({ startOn: { [Op.lte]: q.sownTo } });
  // The stored season, read through the (garden_id, season_year) index.
  if (q.season !== undefined) and.push({ seasonYear: q.season });
  if (q.q) {
    const like = { [Op.like]: likeText(q.q) };
    and.push({ [Op.or]: [{ '$variety.name$': like }, { '$bed.name$': like }, { notes: like }] });
  }
  const where = { [Op.and]: and };
  // Joined only to filter and sort: no columns of theirs are read in the first two steps.
  const narrow: Includeable[] = [
    { model: Bed, as: 'bed', required: true, attributes: [] },
    { model: Variety, as: 'variety', required: true, attributes: [] },
  ];
  // 1. The page's ids in order: a sort of narrow rows, not of whole plantings with their log counts.
  // 2. How many match. 3. The page's plantings in full, put back in the page's order.
  const [page, count] = await Promise.all([
    Planting.findAll({ where, include: narrow, attributes: ['id'], order: orderFor(q), subQuery: false, raw: true, ...limitOffset(q) }),
    Planting.count({ where, include: narrow, distinct: true, col: 'id' }),
  ]);
  const ids = page.map((p) => p.id);
  if (!ids.length) return { rows: [], count };
  const full = await Planting.findAll({ where: { id: ids }, include: plantingIncludes, attributes: { include: [[logCount, 'logCount'], [lastLogOn, 'lastLogOn']] } });
  const byId = new Map(full.map((p) => [p.id, p]));
  return { rows: ids.map((id) => byId.get(id)!).filter(Boolean), count };
}

export async function getPlanting(gardenId: number, plantingId: number, transaction?: Transaction) {
  const planting = await Planting.findOne({
    where: { id: plantingId, gardenId },
    include: plantingIncludes,
    attributes: { include: [[logCount, 'logCount'], [lastLogOn, 'lastLogOn']] },
    transaction,
  });
  if (!planting) throw AppError.notFound('That planting');
  return planting;
}

/** Bed, variety and seed lot must all be this garden's, and the lot must be seed of the variety. */
async function checkReferences(gardenId: number, p: Pick<PlantingCreateInput, 'bedId' | 'varietyId' | 'seedLotId'>, transaction: Transaction) {
  await bedInGarden(gardenId, p.bedId, transaction);
  await varietyInGarden(gardenId, p.varietyId, transaction);
  if (p.seedLotId !== null) {
    const lot = await seedLotInGarden(gardenId, p.seedLotId, transaction);
    if (lot.varietyId !== p.varietyId) {
      throw new AppError(400, 'validation_failed', 'Please check the fields: seedLotId.', { seedLotId: 'This seed lot is seed of another variety.' });
    }
  }
}

export async function createPlanting(gardenId: number, actor: AuditActor, input: PlantingCreateInput) {
  const id = await inTransaction(Planting.sequelize!, async (transaction) => {
    await checkReferences(gardenId, input, transaction);
    const planting = await uniqueOr409(() => Planting.create({ gardenId, createdBy: actor.id, ...input }, { transaction }), duplicatePlanting);
    const made = await getPlanting(gardenId, planting.id, transaction);
    await recordAudit(transaction, { gardenId, actor, entity: 'planting', entityId: made.id, action: 'created', summary: `Added a planting of ${plantingSubject(made)}`, changes: fieldsOf(plantingView(made), 'to') });
    return planting.id;
  });
  return getPlanting(gardenId, id);
}


export async function updatePlanting(gardenId: number, plantingId: number, actor: AuditActor, input: PlantingUpdateInput) {
  await inTransaction(Planting.sequelize!, async (transaction) => {
    const planting = await Planting.findOne({ where: { id: plantingId, gardenId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!planting) throw AppError.notFound('That planting');
    // The change must leave a whole, consistent planting (stage order, dates its status needs).
    const merged = plantingCreateSchema.safeParse({ ...plantingFields(planting), ...input });
    if (!merged.success) throw validationError(merged.error);
    await checkReferences(gardenId, merged.data, transaction);
    const before = await getPlanting(gardenId, plantingId, transaction);
    await uniqueOr409(() => planting.update(input, { transaction }), duplicatePlanting);
    const after = await getPlanting(gardenId, plantingId, transaction);
    const changes = changedFields(plantingView(before), plantingView(after), PLANTING_FIELDS);
    if (Object.keys(changes).length) {
      await recordAudit(transaction, { gardenId, actor, entity: 'planting', entityId: plantingId, action: 'changed', summary: changedSummary(changes, plantingSubject(after)), changes });
    }
  });
  return getPlanting(gardenId, plantingId);
}

/** Returns the photo files to remove once the rows are gone. */
export async function deletePlanting(gardenId: number, plantingId: number, actor: AuditActor): Promise<string[]> {
  return inTransaction(Planting.sequelize!, async (transaction) => {
    const planting = await Planting.findOne({ where: { id: plantingId, gardenId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!planting) throw AppError.notFound('That planting');
    const photos = await PlantingPhoto.findAll({ where: { plantingId }, attributes: ['storageName'], transaction });
    const gone = await getPlanting(gardenId, plantingId, transaction);
    await planting.destroy({ transaction });
    await recordAudit(transaction, { gardenId, actor, entity: 'planting', entityId: plantingId, action: 'deleted', summary: `Deleted the planting of ${plantingSubject(gone)}`, changes: fieldsOf(plantingView(gone), 'from') });
    return photos.map((p) => p.storageName);
  });
}
