/**
 * Writes one audit entry in the caller's transaction, so an entry exists exactly when its change
 * was committed. Secrets never reach the trail: any field whose name looks like a password, hash,
 * token or secret is dropped from `changes` before it is stored.
 */
import { QueryTypes } from 'sequelize';
import type { Transaction } from 'sequelize';
import type { AuditEntityKind } from '#shared/schemas/audit';

/** The kinds of record in the trail: the one list in shared/schemas/audit.ts. */
export type AuditEntity = AuditEntityKind;
export type AuditAction = 'created' | 'changed' | 'deleted' | 'imported' | 'invited' | 'revoked' | 'joined' | 'left' | 'removed';

/** The signed-in user who made a change, as the routes know them (`req.user`). */
export interface AuditActor {
  id: number;
  name: string;
}

/** The actor of a request's user: only id and name reach the trail, never the e-mail. */
export function actorOf(user: { id: number; name: string }): AuditActor {
  return { id: user.id, name: user.name };
}

/** Before and after of each changed field (either side absent for a create or a delete). */
export type AuditChanges = Record<string, { from?: unknown; to?: unknown }>;

export interface AuditEntry {
  gardenId: number;
  /** Who made the change; null for the system (a nightly job). */
  actor: { id: number; name: string } | null;
  entity: AuditEntity;
  entityId: number | string | null;
  action: AuditAction;
  /** One plain sentence for the trail, e.g. "Sowing date of Copperleaf Butterhead in North 2". */
  summary: string;
  changes?: AuditChanges;
}

// passwordHash, token_hash, tokenSealed, resetToken, sessionSecret, sid, salt … (cropKey and the like stay).
const SECRET = /password|hash$|token|secret|^sid$|^salt$/i;

/** `changes` without any secret-looking field, also inside nested values. */
export function withoutSecrets(changes: AuditChanges): AuditChanges {
  const clean = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(clean);
    if (v && typeof v === 'object' && !(v instanceof Date)) return Object.fromEntries(Object.entries(v).filter(([k]) => !SECRET.test(k)).map(([k, x]) => [k, clean(x)]));
    return v;
  };
  return Object.fromEntries(
    Object.entries(changes)
      .filter(([field]) => !SECRET.test(field))
      .map(([field, c]) => [field, { ...(c.from !== undefined ? { from: clean(c.from) } : {}), ...(c.to !== undefined ? { to: clean(c.to) } : {}) }]),
  );
}

/** The fields whose values differ between two plain records (Dates compared by value). */
export function changedFields(before: Record<string, unknown>, after: Record<string, unknown>, fields: readonly string[]): AuditChanges {
  const same = (a: unknown, b: unknown) => (a instanceof Date && b instanceof Date ? a.getTime() === b.getTime() : JSON.stringify(a) === JSON.stringify(b));
  const out: AuditChanges = {};
  for (const f of fields) if (!same(before[f], after[f])) out[f] = { from: before[f] ?? null, to: after[f] ?? null };
  return out;
}

/** A created record's fields as `to` values, or a deleted one's as `from` values (empty text and nulls left out). */
export function fieldsOf(record: Record<string, unknown>, side: 'from' | 'to'): AuditChanges {
  const out: AuditChanges = {};
  for (const [field, value] of Object.entries(record)) if (value !== null && value !== undefined && value !== '') out[field] = { [side]: value };
  return out;
}

export async function recordAudit(transaction: Transaction, entry: AuditEntry): Promise<void> {
  const sequelize = (transaction as unknown as { sequelize: import('sequelize').Sequelize }).sequelize;
  await sequelize.query(
    `INSERT INTO audit_entries (garden_id, actor_user_id, actor_name, entity, entity_id, action, summary, changes, created_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, UTC_TIMESTAMP(3))`,
    {
      replacements: [
        entry.gardenId,
        entry.actor?.id ?? null,
        entry.actor?.name ?? 'Heatclock',
        entry.entity,
        entry.entityId === null ? null : String(entry.entityId),
        entry.action,
        entry.summary.slice(0, 300),
        JSON.stringify(withoutSecrets(entry.changes ?? {})),
      ],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
}
