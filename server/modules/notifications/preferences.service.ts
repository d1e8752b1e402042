import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { NotificationPreferenceDto, NotificationPreferenceInput } from '#shared/schemas/notifications';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import { PREF_COLUMNS, upsertPreferences, withDefaults } from './preferences.repository';
import type { PreferenceRow } from './preferences.repository';

export async function listPreferences(db: Sequelize, userId: number): Promise<NotificationPreferenceDto[]> {
  const rows = await db.query<PreferenceRow & { gardenId: number; gardenName: string }>(
    `SELECT g.id AS gardenId, g.name AS gardenName, ${PREF_COLUMNS}
       FROM memberships m JOIN gardens g ON g.id = m.garden_id
       LEFT JOIN notification_preferences p ON p.user_id = m.user_id AND p.garden_id = m.garden_id
      WHERE m.user_id = ? ORDER BY g.name, g.id`,
    { replacements: [userId], type: QueryTypes.SELECT },
  );
  return rows.map((r) => {
    const p = withDefaults(userId, r.gardenId, r);
    return { gardenId: r.gardenId, gardenName: r.gardenName, delivery: p.delivery, digestHour: p.digestHour, types: p.types };
  });
}

/** All or nothing: one garden the user is not a member of refuses the whole request. */
export async function updatePreferences(db: Sequelize, userId: number, items: NotificationPreferenceInput[]) {
  await inTransaction(db, async (transaction) => {
    const member = await db.query<{ gardenId: number }>('SELECT garden_id AS gardenId FROM memberships WHERE user_id = ? AND garden_id IN (?)', {
      replacements: [userId, items.map((i) => i.gardenId)],
      type: QueryTypes.SELECT,
      transaction,
    });
    const mine = new Set(member.map((m) => m.gardenId));
    const fields: Record<string, string> = {};
    items.forEach((item, i) => {
      if (!mine.has(item.gardenId)) fields[`items.${i}.gardenId`] = 'You are not a member of this garden.';
    });
    if (Object.keys(fields).length) {
      throw new AppError(400, 'validation_failed', `Please check the fields: ${Object.keys(fields).join(', ')}.`, fields);
    }
    await upsertPreferences(db, userId, items, transaction);
  });
  return listPreferences(db, userId);
}
