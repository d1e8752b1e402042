import type { Transaction } from 'sequelize';
import { plantingCreateSchema } from '#shared/schemas/plantings';
import { LOG_KIND_WORDS } from '#shared/schemas/plantings';
import type { LogEntryCreateInput } from '#shared/schemas/plantings';
import { plantingFields } from './plantings.presenter';
import { Planting, PlantingLog, User } from '../../db/models';
import { AppError } from '../../errors';
import { limitOffset } from '../records/paging';
import { inTransaction } from '../../lib/transaction';
import { changedFields, recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { changedSummary } from '../audit/audit-words';
import { PLANTING_FIELDS, plantingSubject, plantingView } from '../audit/audit-views';
import { getPlanting } from './plantings.service';

async function plantingOf(gardenId: number, plantingId: number, transaction?: Transaction) {
  const planting = await Planting.findOne({
    where: { id: plantingId, gardenId },
    transaction,
    ...(transaction ? { lock: transaction.LOCK.UPDATE } : {}),
  });
  if (!planting) throw AppError.notFound('That planting');
  return planting;
}

export async function listLog(gardenId: number, plantingId: number, q: { page: number; pageSize: number }) {
  await plantingOf(gardenId, plantingId);
  return PlantingLog.findAndCountAll({
    where: { plantingId, gardenId },
    include: [{ model: User, as: 'author', attributes: ['id', 'name'], required: false }],
    order: [['entryOn', 'DESC'], ['id', 'DESC']],
    ...limitOffset(q),
  });
}

const earliest = (a: string | null, b: string) => (a && a < b ? a : b);
const latest = (a: string | null, b: string) => (a && a > b ? a : b);

/**
 * What a log entry says about the planting's stages, so a grower's two taps in the garden keep
 * the planting's dates and status current without a second form.
 */
function stageChanges(p: Planting, e: LogEntryCreateInput): Partial<Planting> {
  switch (e.kind) {
    case 'thinned':
      return p.thinnedOn ? {} : { thinnedOn: e.entryOn };
    case 'harvest':
      return {
        firstHarvestOn: earliest(p.firstHarvestOn, e.entryOn),
        lastHarvestOn: latest(p.lastHarvestOn, e.entryOn),
        ...(p.status === 'planned' ? { status: 'growing' as const } : {}),
      };
    case 'bolted':
      return { boltedOn: earliest(p.boltedOn, e.entryOn), status: 'bolted' };
    default:
      return {};
  }
}

export async function addLogEntry(gardenId: number, plantingId: number, actor: AuditActor, input: LogEntryCreateInput, transaction?: Transaction) {
  const work = async (t: Transaction) => {
    const planting = await plantingOf(gardenId, plantingId, t);
    const start = planting.sownOn ?? planting.transplantedOn;
    if (start && input.entryOn < start && input.kind !== 'observation') {
      throw new AppError(400, 'validation_failed', 'Please check the fields: entryOn.', {
        entryOn: `This planting started on ${start}; the entry cannot be earlier.`,
      });
    }
    const changes = stageChanges(planting, input);
    if (Object.keys(changes).length) {
      // The entry must leave a whole planting, as an edit must (e.g. no harvest before transplanting).
      const merged = plantingCreateSchema.safeParse({ ...plantingFields(planting), ...changes });
      if (!merged.success) {
        const why = merged.error.issues[0]?.message ?? 'it does not fit the planting’s dates';
        throw new AppError(400, 'validation_failed', 'Please check the fields: entryOn.', {
          entryOn: `This ${input.kind} entry does not fit the planting: ${why}`,
        });
      }
      const before = await getPlanting(gardenId, plantingId, t);
      await planting.update(changes, { transaction: t });
      const after = await getPlanting(gardenId, plantingId, t);
      const changed = changedFields(plantingView(before), plantingView(after), PLANTING_FIELDS);
      if (Object.keys(changed).length) {
        const summary = `${changedSummary(changed, plantingSubject(after))} (log entry: ${LOG_KIND_WORDS[input.kind]})`;
        await recordAudit(t, { gardenId, actor, entity: 'planting', entityId: plantingId, action: 'changed', summary, changes: changed });
      }
    }
    return PlantingLog.create(
      {
        gardenId,
        plantingId,
        entryOn: input.entryOn,
        kind: input.kind,
        amount: input.amount ?? null,
        amountUnit: input.amountUnit ?? null,
        note: input.note ?? '',
        photoId: null,
        createdBy: actor.id,
      },
      { transaction: t },
    );
  };
  const entry = transaction ? await work(transaction) : await inTransaction(Planting.sequelize!, work);
  return entry;
}

export async function getLogEntry(gardenId: number, plantingId: number, entryId: number) {
  const entry = await PlantingLog.findOne({
    where: { id: entryId, plantingId, gardenId },
    include: [{ model: User, as: 'author', attributes: ['id', 'name'], required: false }],
  });
  if (!entry) throw AppError.notFound('That log entry');
  return entry;
}

export async function deleteLogEntry(gardenId: number, plantingId: number, entryId: number) {
  const entry = await getLogEntry(gardenId, plantingId, entryId);
  if (entry.photoId !== null) {
    throw new AppError(409, 'photo_entry', 'This entry belongs to a photo: delete the photo instead.');
  }
  await inTransaction(PlantingLog.sequelize!, (transaction) => entry.destroy({ transaction }));
}
