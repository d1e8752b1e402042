import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import { ALERT_TYPES } from '#shared/schemas/alerts';
import type { AlertType } from '#shared/schemas/alerts';
import { DEFAULT_DIGEST_HOUR } from '#shared/schemas/notifications';
import type { Delivery, NotificationPreferenceInput } from '#shared/schemas/notifications';
import { newNonce } from './unsubscribe-token';

/** A member's settings for one garden; members without a stored row get the defaults. */
export interface Preference {
  userId: number;
  gardenId: number;
  delivery: Delivery;
  digestHour: number;
  types: AlertType[];
  nonce: string | null;
}

export interface PreferenceRow {
  delivery: Delivery | null;
  digestHour: number | null;
  typesJson: string | null;
  nonce: string | null;
}

/** Stored types in the one fixed order; a type no longer known is dropped rather than failing a send. */
function parseTypes(json: string): AlertType[] {
  const stored = new Set(JSON.parse(json) as string[]);
  return ALERT_TYPES.filter((t) => stored.has(t));
}

export function withDefaults(userId: number, gardenId: number, row: PreferenceRow): Preference {
  return {
    userId,
    gardenId,
    delivery: row.delivery ?? 'digest',
    digestHour: row.digestHour ?? DEFAULT_DIGEST_HOUR,
    types: row.typesJson === null ? [...ALERT_TYPES] : parseTypes(row.typesJson),
    nonce: row.nonce,
  };
}

export const PREF_COLUMNS = 'p.delivery, p.digest_hour AS digestHour, p.types_json AS typesJson, p.unsubscribe_nonce AS nonce';

export async function upsertPreferences(db: Sequelize, userId: number, items: NotificationPreferenceInput[], transaction: Transaction) {
  const rows = items.map((i) => [userId, i.gardenId, i.delivery, i.digestHour, JSON.stringify(ALERT_TYPES.filter((t) => i.types.includes(t))), newNonce()]);
  // The nonce is kept on update: changing settings must not break links already sent.
  await db.query(
    `INSERT INTO notification_preferences (user_id, garden_id, delivery, digest_hour, types_json, unsubscribe_nonce, created_at, updated_at)
     VALUES ${rows.map(() => '(?, ?, ?, ?, ?, ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))').join(', ')}
     ON DUPLICATE KEY UPDATE delivery = VALUES(delivery), digest_hour = VALUES(digest_hour), types_json = VALUES(types_json), updated_at = VALUES(updated_at)`,
    { replacements: rows.flat(), transaction },
  );
}

/** The nonce of the member's row, storing the defaults first when there is none (links need a nonce). */
export async function ensureNonce(db: Sequelize, userId: number, gardenId: number, transaction: Transaction): Promise<string> {
  await db.query(
    `INSERT IGNORE INTO notification_preferences (user_id, garden_id, delivery, digest_hour, types_json, unsubscribe_nonce, created_at, updated_at)
     VALUES (?, ?, 'digest', ?, ?, ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`,
    { replacements: [userId, gardenId, DEFAULT_DIGEST_HOUR, JSON.stringify(ALERT_TYPES), newNonce()], transaction },
  );
  const [row] = await db.query<{ nonce: string }>(
    'SELECT unsubscribe_nonce AS nonce FROM notification_preferences WHERE user_id = ? AND garden_id = ?',
    { replacements: [userId, gardenId], type: QueryTypes.SELECT, transaction },
  );
  return row.nonce;
}
