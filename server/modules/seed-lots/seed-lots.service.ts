import { unreferencedOr409 } from '../records/unique';
import { Op } from 'sequelize';
import type { WhereOptions } from 'sequelize';
import type { z } from 'zod';
import type { GerminationTestCreateInput, SeedLotCreateInput, SeedLotUpdateInput, seedLotListQuerySchema, seedsToSowQuerySchema } from '#shared/schemas/seed-lots';
import { germinationPercent, seedsToSow } from '#shared/thermal/index';
import { GerminationTest, Planting, SeedLot, Variety } from '../../db/models';
import { AppError } from '../../errors';
import { likeText, limitOffset } from '../records/paging';
import { varietyInGarden } from '../records/scope';
import { inTransaction } from '../../lib/transaction';
import { countOf } from '#shared/format/count-words';
import { dayToken } from '#shared/format/dates';
import { changedFields, fieldsOf, recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { changedSummary } from '../audit/audit-words';
import { SEED_LOT_FIELDS, germinationTestView, seedLotSubject, seedLotView } from '../audit/audit-views';

type SeedLotListQuery = z.output<typeof seedLotListQuerySchema>;
type SeedsToSowQuery = z.output<typeof seedsToSowQuerySchema>;


export async function listSeedLots(gardenId: number, q: SeedLotListQuery) {
  const where: WhereOptions<SeedLot> = { gardenId };
  if (q.varietyId) Object.assign(where, { varietyId: q.varietyId });
  const varietyWhere: WhereOptions<Variety> = {};
  if (q.crop) Object.assign(varietyWhere, { cropKey: q.crop });
  if (q.q) {
    const like = { [Op.like]: likeText(q.q) };
    Object.assign(where, { [Op.or]: [{ supplier: like }, { lotNumber: like }, { '$variety.name$': like }] });
  }
  const { rows, count } = await SeedLot.findAndCountAll({
    where,
    include: [{ model: Variety, as: 'variety', required: true, where: varietyWhere }],
    subQuery: false,
    order: [
      [{ model: Variety, as: 'variety' }, 'cropKey', 'ASC'],
      [{ model: Variety, as: 'variety' }, 'name', 'ASC'],
      ['packedForYear', 'DESC'],
      ['id', 'ASC'],
    ],
    ...limitOffset(q),
  });
  return { rows, count, tests: await testsOf(rows.map((r) => r.id)) };
}

/** Germination tests of the given lots, newest first, by lot. */
export async function testsOf(seedLotIds: number[]): Promise<Map<number, GerminationTest[]>> {
  const out = new Map<number, GerminationTest[]>();
  if (!seedLotIds.length) return out;
  const tests = await GerminationTest.findAll({ where: { seedLotId: seedLotIds }, order: [['testedOn', 'DESC'], ['id', 'DESC']] });
  for (const t of tests) out.set(t.seedLotId, [...(out.get(t.seedLotId) ?? []), t]);
  return out;
}

export async function getSeedLot(gardenId: number, seedLotId: number) {
  const lot = await SeedLot.findOne({ where: { id: seedLotId, gardenId }, include: [{ model: Variety, as: 'variety', required: true }] });
  if (!lot) throw AppError.notFound('That seed lot');
  return lot;
}

export async function createSeedLot(gardenId: number, actor: AuditActor, input: SeedLotCreateInput) {
  const variety = await varietyInGarden(gardenId, input.varietyId);
  // In a transaction, so the garden's revision moves with the row (progress-invalidation.ts).
  const lot = await inTransaction(SeedLot.sequelize!, async (transaction) => {
    const made = await SeedLot.create({ gardenId, ...input }, { transaction });
    made.variety = variety;
    await recordAudit(transaction, { gardenId, actor, entity: 'seed-lot', entityId: made.id, action: 'created', summary: `Added ${seedLotSubject(made)}`, changes: fieldsOf(seedLotView(made), 'to') });
    return made;
  });
  return getSeedLot(gardenId, lot.id);
}

export async function updateSeedLot(gardenId: number, seedLotId: number, actor: AuditActor, input: SeedLotUpdateInput) {
  const lot = await getSeedLot(gardenId, seedLotId);
  const before = seedLotView(lot);
  return inTransaction(SeedLot.sequelize!, async (transaction) => {
    if (input.varietyId !== undefined && input.varietyId !== lot.varietyId) {
      lot.variety = await varietyInGarden(gardenId, input.varietyId, transaction);
      // A lot is seed of one variety; plantings sown from it must not silently change crop.
      const used = await Planting.count({ where: { seedLotId }, transaction });
      if (used) throw new AppError(409, 'in_use', 'Plantings were sown from this lot, so its variety cannot change.');
    }
    await lot.update(input, { transaction });
    const changes = changedFields(before, seedLotView(lot), SEED_LOT_FIELDS);
    if (Object.keys(changes).length) await recordAudit(transaction, { gardenId, actor, entity: 'seed-lot', entityId: seedLotId, action: 'changed', summary: changedSummary(changes, seedLotSubject(lot)), changes });
    return lot;
  }).then(() => getSeedLot(gardenId, seedLotId));
}

export async function deleteSeedLot(gardenId: number, seedLotId: number, actor: AuditActor) {
  const lot = await getSeedLot(gardenId, seedLotId);
  const used = await Planting.count({ where: { seedLotId } });
  if (used) throw new AppError(409, 'in_use', `${countOf(used, 'planting was', 'plantings were')} sown from this lot; they keep it on record.`);
  await unreferencedOr409(
    () =>
      inTransaction(SeedLot.sequelize!, async (transaction) => {
        // The lot first, so a germination test being added either lands before (and goes with it) or gets 404.
        const locked = await SeedLot.findOne({ where: { id: lot.id, gardenId }, transaction, lock: transaction.LOCK.UPDATE });
        if (!locked) throw AppError.notFound('That seed lot');
        await GerminationTest.destroy({ where: { seedLotId: lot.id }, transaction });
        await locked.destroy({ transaction });
        await recordAudit(transaction, { gardenId, actor, entity: 'seed-lot', entityId: seedLotId, action: 'deleted', summary: `Deleted ${seedLotSubject(lot)}`, changes: fieldsOf(seedLotView(lot), 'from') });
      }),
    'A planting sown from this lot was just recorded; it keeps the lot on record.',
  );
}

export async function addGerminationTest(gardenId: number, seedLotId: number, actor: AuditActor, input: GerminationTestCreateInput) {
  return inTransaction(SeedLot.sequelize!, async (transaction) => {
    // Locked for share: a delete of the lot waits for this test, or this test waits and answers 404.
    const lot = await SeedLot.findOne({ where: { id: seedLotId, gardenId }, attributes: ['id'], transaction, lock: transaction.LOCK.SHARE });
    if (!lot) throw AppError.notFound('That seed lot');
    const test = await GerminationTest.create({ gardenId, seedLotId: lot.id, notes: '', ...input }, { transaction });
    const full = await SeedLot.findOne({ where: { id: lot.id }, include: [{ model: Variety, as: 'variety', required: true }], transaction });
    const summary = `Recorded a germination test of ${full ? seedLotSubject(full) : 'a seed lot'}: ${test.germinated} of ${test.seedsTested} seeds came up`;
    await recordAudit(transaction, { gardenId, actor, entity: 'germination-test', entityId: test.id, action: 'created', summary, changes: fieldsOf(germinationTestView(test), 'to') });
    return test;
  });
}

export async function deleteGerminationTest(gardenId: number, seedLotId: number, testId: number, actor: AuditActor) {
  const test = await GerminationTest.findOne({ where: { id: testId, seedLotId, gardenId } });
  if (!test) throw AppError.notFound('That germination test');
  const lot = await getSeedLot(gardenId, seedLotId);
  await inTransaction(SeedLot.sequelize!, async (transaction) => {
    await test.destroy({ transaction });
    const summary = `Deleted the germination test of ${seedLotSubject(lot)} from ${dayToken(test.testedOn)}`;
    await recordAudit(transaction, { gardenId, actor, entity: 'germination-test', entityId: testId, action: 'deleted', summary, changes: fieldsOf(germinationTestView(test), 'from') });
  });
}

/** Tests come newest first from testsOf. */
export function latestTest(tests: readonly GerminationTest[]): GerminationTest | null {
  return tests[0] ?? null;
}

/** Seeds to sow from the lot's latest germination test (thermal engine, SCIENCE §7). */
export async function seedsToSowFor(gardenId: number, seedLotId: number, q: SeedsToSowQuery) {
  const lot = await getSeedLot(gardenId, seedLotId);
  const test = latestTest((await testsOf([lot.id])).get(lot.id) ?? []);
  if (!test) throw new AppError(422, 'no_germination_test', 'This lot has no germination test yet: record one to work out how many seeds to sow.');
  const percent = germinationPercent(test.germinated, test.seedsTested);
  if (percent === 0) throw new AppError(422, 'nothing_germinated', 'No seed germinated in the latest test: this lot will not give plants.');
  return {
    plants: q.plants,
    emergenceFactor: q.emergenceFactor,
    germinationPercent: percent,
    basedOn: { testId: test.id, testedOn: test.testedOn },
    seeds: seedsToSow(q.plants, percent, q.emergenceFactor),
  };
}
