import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import { PREF_COLUMNS, withDefaults } from './preferences.repository';
import type { PreferenceRow } from './preferences.repository';
import { renderAlertMail } from './mail-content';
import { contextFor, queueMessage, readAlerts } from './outbox';
import type { Recipient, StoredAlert } from './outbox';

// Sequelize 6 keeps its instance on every transaction; the type declarations just do not list it.
const sequelizeOf = (t: Transaction) => (t as unknown as { sequelize: Sequelize }).sequelize;

/**
 * Same alerts at the same last change → same key, so a re-run or a second instance adds nothing;
 * an alert that changes again (worse severity, new dates) is news and gets its own message.
 */
export function alertDedupeKey(userId: number, alerts: StoredAlert[]): string {
  const ids = alerts.map((a) => a.id).sort((a, b) => a - b).join(',');
  const latest = Math.max(...alerts.map((a) => Date.parse(a.updatedAt)));
  const key = `alert:${userId}:${ids}:${latest}`;
  return key.length <= 255 ? key : `alert:${userId}:sha256-${createHash('sha256').update(ids).digest('hex')}:${latest}`;
}

/**
 * Queues, inside the caller's transaction, one message per member of the garden who wants
 * immediate e-mail for at least one of these alerts' types, listing those alerts. Resolved alerts
 * are left out. Returns how many messages this call added.
 */
export async function enqueueAlertMail(transaction: Transaction, gardenId: number, alertIds: number[]): Promise<number> {
  if (!alertIds.length) return 0;
  const db = sequelizeOf(transaction);
  const alerts = (await readAlerts(db, [gardenId], alertIds, transaction)).map((a) => a.alert);
  if (!alerts.length) return 0;
  const [garden] = await db.query<{ id: number; name: string }>('SELECT id, name FROM gardens WHERE id = ?', {
    replacements: [gardenId],
    type: QueryTypes.SELECT,
    transaction,
  });
  const members = await db.query<Recipient & PreferenceRow>(
    `SELECT u.id AS userId, u.email, u.name, ${PREF_COLUMNS}
       FROM memberships m JOIN users u ON u.id = m.user_id
       JOIN notification_preferences p ON p.user_id = m.user_id AND p.garden_id = m.garden_id
      WHERE m.garden_id = ? AND p.delivery = 'immediate' ORDER BY u.id`,
    { replacements: [gardenId], type: QueryTypes.SELECT, transaction },
  );
  let queued = 0;
  for (const member of members) {
    const wanted = new Set(withDefaults(member.userId, gardenId, member).types);
    const mine = alerts.filter((a) => wanted.has(a.type));
    if (!mine.length) continue;
    const ctx = await contextFor(db, member, garden, transaction);
    const added = await queueMessage(db, transaction, {
      userId: member.userId,
      gardenId,
      kind: 'alert',
      dedupeKey: alertDedupeKey(member.userId, mine),
      to: member.email,
      content: renderAlertMail(ctx, mine),
      ctx,
    });
    if (added) queued++;
  }
  return queued;
}
