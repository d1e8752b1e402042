import { Op, fn, col, literal } from 'sequelize';
import type { WhereOptions } from 'sequelize';
import type { BedCreateInput, BedUpdateInput, bedListQuerySchema } from '#shared/schemas/beds';
import type { z } from 'zod';
import { Bed, Planting } from '../../db/models';
import { AppError } from '../../errors';
import { likeText, limitOffset } from '../records/paging';
import { unreferencedOr409, uniqueOr409 } from '../records/unique';
import { inTransaction } from '../../lib/transaction';
import { countOf } from '#shared/format/count-words';
import { changedFields, fieldsOf, recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { changedSummary } from '../audit/audit-words';
import { BED_FIELDS, bedView } from '../audit/audit-views';

type BedListQuery = z.output<typeof bedListQuerySchema>;

const duplicate = 'This garden already has a bed with that name.';

export async function listBeds(gardenId: number, q: BedListQuery) {
  const where: WhereOptions<Bed> = { gardenId };
  if (q.q) Object.assign(where, { name: { [Op.like]: likeText(q.q) } });
  if (q.kind) Object.assign(where, { kind: q.kind });
  const { rows, count } = await Bed.findAndCountAll({ where, order: [['name', 'ASC'], ['id', 'ASC']], ...limitOffset(q) });
  return { rows, count, counts: await plantingCounts(gardenId, rows.map((b) => b.id)) };
}

export interface BedCounts {
  active: number;
  onRecord: number;
}

/** Planned or growing plantings, and all plantings on record, per bed, for the beds shown. */
export async function plantingCounts(gardenId: number, bedIds: number[]): Promise<Map<number, BedCounts>> {
  if (!bedIds.length) return new Map();
  const rows = (await Planting.findAll({
    attributes: ['bedId', [fn('COUNT', col('id')), 'onRecord'], [literal("SUM(status IN ('planned', 'growing'))"), 'active']],
    where: { gardenId, bedId: bedIds },
    group: ['bedId'],
    raw: true,
  })) as unknown as { bedId: number; onRecord: number; active: number }[];
  return new Map(rows.map((r) => [r.bedId, { active: Number(r.active), onRecord: Number(r.onRecord) }]));
}

export async function getBed(gardenId: number, bedId: number) {
  const bed = await Bed.findOne({ where: { id: bedId, gardenId } });
  if (!bed) throw AppError.notFound('That bed');
  return bed;
}

export async function createBed(gardenId: number, actor: AuditActor, input: BedCreateInput) {
  return uniqueOr409(
    // Each write in a transaction, so the garden's revision moves with the row (progress-invalidation.ts).
    () =>
      // `.then` rather than an async callback, so a failed insert's logged stack still reaches the route within Node's 10 frames.
      inTransaction(Bed.sequelize!, (transaction) =>
        Bed.create({ gardenId, name: input.name, kind: input.kind, lengthM: input.lengthM ?? null, widthM: input.widthM ?? null, notes: input.notes ?? '' }, { transaction }).then(async (bed) => {
          await recordAudit(transaction, { gardenId, actor, entity: 'bed', entityId: bed.id, action: 'created', summary: `Added the bed ${bed.name}`, changes: fieldsOf(bedView(bed), 'to') });
          return bed;
        }),
      ),
    duplicate,
    'name',
  );
}

export async function updateBed(gardenId: number, bedId: number, actor: AuditActor, input: BedUpdateInput) {
  const bed = await getBed(gardenId, bedId);
  const before = bedView(bed);
  return uniqueOr409(
    () =>
      inTransaction(Bed.sequelize!, async (transaction) => {
        await bed.update(input, { transaction });
        const changes = changedFields(before, bedView(bed), BED_FIELDS);
        if (Object.keys(changes).length) await recordAudit(transaction, { gardenId, actor, entity: 'bed', entityId: bedId, action: 'changed', summary: changedSummary(changes, `the bed ${bed.name}`), changes });
        return bed;
      }),
    duplicate,
    'name',
  );
}

export async function deleteBed(gardenId: number, bedId: number, actor: AuditActor) {
  const bed = await getBed(gardenId, bedId);
  const used = await Planting.count({ where: { gardenId, bedId } });
  if (used) {
    throw new AppError(409, 'in_use', `This bed has ${countOf(used, 'planting')} on record; move or delete them first.`);
  }
  await unreferencedOr409(
    () =>
      inTransaction(Bed.sequelize!, async (transaction) => {
        await bed.destroy({ transaction });
        await recordAudit(transaction, { gardenId, actor, entity: 'bed', entityId: bedId, action: 'deleted', summary: `Deleted the bed ${bed.name}`, changes: fieldsOf(bedView(bed), 'from') });
      }),
    'A planting was just added to this bed; move or delete it first.');
}
