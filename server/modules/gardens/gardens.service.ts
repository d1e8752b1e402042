import type { GardenUpdateInput } from '#shared/schemas/gardens';
import { QueryTypes } from 'sequelize';
import type { Role } from '#shared/schemas/gardens';
import { Garden, Membership } from '../../db/models';
import type { GardenRow } from './gardens.presenter';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import { refreshGardenSeasons } from '../../db/planting-season';
import { changedFields, recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { changedSummary } from '../audit/audit-words';
import { GARDEN_FIELDS, gardenView } from '../audit/audit-views';

/** The user's gardens with their role, by name: one indexed read, plain rows (sent on every page load). */
export async function listGardensFor(userId: number) {
  const rows = await Membership.sequelize!.query<GardenRow & { role: Role }>(
    `SELECT g.id, g.name, g.latitude, g.longitude, g.elevation_m AS elevationM, g.time_zone AS timeZone, g.units, m.role
       FROM memberships m JOIN gardens g ON g.id = m.garden_id
      WHERE m.user_id = ?
      ORDER BY g.name, g.id`,
    { replacements: [userId], type: QueryTypes.SELECT },
  );
  return rows.map(({ role, ...garden }) => ({ garden, role }));
}

export async function getGarden(gardenId: number) {
  const garden = await Garden.findByPk(gardenId);
  if (!garden) throw AppError.notFound('That garden');
  return garden;
}

export async function updateGarden(gardenId: number, actor: AuditActor, input: GardenUpdateInput) {
  // In a transaction, so the garden's counters move with its settings (progress-invalidation.ts).
  // Its plantings' stored seasons follow its hemisphere, in the same transaction. The garden is
  // read under a row lock inside it, so two edits at once are serialised and each audit entry's
  // "from" is what the change really replaced (also on a retry after a deadlock).
  return inTransaction(Garden.sequelize!, async (transaction) => {
    const garden = await Garden.findByPk(gardenId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!garden) throw AppError.notFound('That garden');
    const before = gardenView(garden);
    const moved = input.latitude !== undefined && input.latitude !== garden.latitude;
    await garden.update(input, { transaction });
    if (moved) await refreshGardenSeasons(Garden.sequelize!, gardenId, transaction);
    const changes = changedFields(before, gardenView(garden), GARDEN_FIELDS);
    if (Object.keys(changes).length) await recordAudit(transaction, { gardenId, actor, entity: 'garden-settings', entityId: gardenId, action: 'changed', summary: changedSummary(changes, 'the garden'), changes });
    return garden;
  });
}
