import { Op } from 'sequelize';
import type { WhereOptions } from 'sequelize';
import type { z } from 'zod';
import type { VarietyCreateInput, VarietyUpdateInput, varietyListQuerySchema } from '#shared/schemas/varieties';
import { varietyCreateSchema } from '#shared/schemas/varieties';
import { basisOfValues } from '#shared/crops/basis';
import { Planting, SeedLot, Variety } from '../../db/models';
import { AppError, validationError } from '../../errors';
import { likeText, limitOffset } from '../records/paging';
import { unreferencedOr409, uniqueOr409 } from '../records/unique';
import { varietyFields } from './varieties.presenter';
import { effectiveValues, getCrop } from '../crops/crops.service';
import { inTransaction } from '../../lib/transaction';
import { countOf } from '#shared/format/count-words';
import { changedFields, fieldsOf, recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { changedSummary } from '../audit/audit-words';
import { VARIETY_FIELDS, varietyView } from '../audit/audit-views';

type VarietyListQuery = z.output<typeof varietyListQuerySchema>;

const duplicate = 'This garden already has a variety of that crop with that name.';

export async function listVarieties(gardenId: number, q: VarietyListQuery) {
  const where: WhereOptions<Variety> = { gardenId };
  const and: WhereOptions<Variety>[] = [];
  if (q.crop) and.push({ cropKey: q.crop });
  if (q.q) and.push({ name: { [Op.like]: likeText(q.q) } });
  if (q.trait) and.push({ traits: { [Op.like]: likeText(q.trait) } as never });
  if (and.length) Object.assign(where, { [Op.and]: and });
  return Variety.findAndCountAll({ where, order: [['cropKey', 'ASC'], ['name', 'ASC']], ...limitOffset(q) });
}

export async function getVariety(gardenId: number, varietyId: number) {
  const variety = await Variety.findOne({ where: { id: varietyId, gardenId } });
  if (!variety) throw AppError.notFound('That variety');
  return variety;
}

/** A grower's target is read in the crop's method as it stands when the target is set. */
async function targetBasisColumns(gardenId: number, cropKey: string, override: number | null) {
  if (override === null) return { gddTargetBaseC: null, gddTargetUpperC: null, gddTargetMethod: null, gddTargetCutoff: null };
  const b = basisOfValues(effectiveValues(await getCrop(gardenId, cropKey)));
  return { gddTargetBaseC: b.baseC, gddTargetUpperC: b.upperC, gddTargetMethod: b.method, gddTargetCutoff: b.cutoff };
}

export async function createVariety(gardenId: number, actor: AuditActor, input: VarietyCreateInput) {
  const basis = await targetBasisColumns(gardenId, input.cropKey, input.gddTargetOverrideC);
  // Each write in a transaction, so the garden's counters move with the row (progress-invalidation.ts).
  return uniqueOr409(
    () =>
      inTransaction(Variety.sequelize!, async (transaction) => {
        const variety = await Variety.create({ gardenId, ...input, ...basis }, { transaction });
        await recordAudit(transaction, { gardenId, actor, entity: 'variety', entityId: variety.id, action: 'created', summary: `Added the variety ${variety.name}`, changes: fieldsOf(varietyView(variety), 'to') });
        return variety;
      }),
    duplicate,
    'name',
  );
}

export async function updateVariety(gardenId: number, varietyId: number, actor: AuditActor, input: VarietyUpdateInput) {
  const variety = await getVariety(gardenId, varietyId);
  // A partial change must still leave a consistent variety (e.g. traits, emergence range).
  const merged = { ...varietyFields(variety), ...input };
  const check = varietyCreateSchema.safeParse(merged);
  if (!check.success) throw validationError(check.error);
  if (input.cropKey && input.cropKey !== variety.cropKey) {
    const [lots, plantings] = await Promise.all([SeedLot.count({ where: { varietyId } }), Planting.count({ where: { varietyId } })]);
    if (lots || plantings) {
      const msg = 'This variety already has plantings or seed lots on record, so its crop cannot change; add a new variety instead.';
      throw new AppError(409, 'in_use', msg, { cropKey: msg });
    }
  }
  // Sending the target again, even unchanged, re-reads it in the crop's current method.
  const basis = input.gddTargetOverrideC !== undefined ? await targetBasisColumns(gardenId, merged.cropKey, input.gddTargetOverrideC) : {};
  const before = varietyView(variety);
  return uniqueOr409(
    () =>
      inTransaction(Variety.sequelize!, async (transaction) => {
        await variety.update({ ...input, ...basis }, { transaction });
        const changes = changedFields(before, varietyView(variety), VARIETY_FIELDS);
        if (Object.keys(changes).length) {
          await recordAudit(transaction, { gardenId, actor, entity: 'variety', entityId: varietyId, action: 'changed', summary: changedSummary(changes, variety.name), changes });
        }
        return variety;
      }),
    duplicate,
    'name',
  );
}

export async function deleteVariety(gardenId: number, varietyId: number, actor: AuditActor) {
  const variety = await getVariety(gardenId, varietyId);
  const [lots, plantings] = await Promise.all([SeedLot.count({ where: { varietyId } }), Planting.count({ where: { varietyId } })]);
  if (lots || plantings) {
    throw new AppError(409, 'in_use', `This variety has ${countOf(plantings, 'planting')} and ${countOf(lots, 'seed lot')} on record; delete those first.`);
  }
  await unreferencedOr409(
    () =>
      inTransaction(Variety.sequelize!, async (transaction) => {
        await variety.destroy({ transaction });
        await recordAudit(transaction, { gardenId, actor, entity: 'variety', entityId: varietyId, action: 'deleted', summary: `Deleted the variety ${variety.name}`, changes: fieldsOf(varietyView(variety), 'from') });
      }),
    'A planting or seed lot was just added for this variety; delete it first.');
}
