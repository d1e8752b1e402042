/**
 * Who is in a garden and with which role. Every change locks the garden's memberships first
 * (SELECT … FOR UPDATE), then re-reads the acting owner's and the target's rows under that lock:
 * two owners demoting each other at once are serialised, and the second sees one owner left and
 * is refused, so a garden never ends up without an owner. Each change moves the garden's revision
 * (cached answers are keyed on it) and writes its audit entry in the same transaction.
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { Role } from '#shared/schemas/gardens';
import { AppError } from '../../errors';
import { endSessionsOf } from '../auth/session-store';
import { inTransaction } from '../../lib/transaction';
import { moveGardenRevisions } from '../../lib/garden-revision';
import { recordAudit } from '../audit/audit';

export interface Actor {
  id: number;
  name: string;
}

export interface MemberRow {
  userId: number;
  name: string;
  email: string;
  role: Role;
  joinedAt: Date | string;
}

const ORDER: Record<Role, number> = { owner: 0, grower: 1, viewer: 2 };

export async function listMembers(db: Sequelize, gardenId: number): Promise<MemberRow[]> {
  const rows = await db.query<MemberRow>(
    `SELECT m.user_id AS userId, u.name, u.email, m.role, m.created_at AS joinedAt
       FROM memberships m JOIN users u ON u.id = m.user_id
      WHERE m.garden_id = ? ORDER BY m.id`,
    { replacements: [gardenId], type: QueryTypes.SELECT },
  );
  return rows.sort((a, b) => ORDER[a.role] - ORDER[b.role] || a.name.localeCompare(b.name));
}

const lastOwner = (field: string, what: string) =>
  new AppError(409, 'last_owner', `${what}: a garden needs at least one owner. Make another member an owner first.`, {
    [field]: 'This is the only owner of the garden, so this cannot be done until someone else is an owner too.',
  });

const notOwnerAnyMore = () => AppError.forbidden('Only the garden owner can do this. Your role in this garden has just changed.');

interface Locked {
  userId: number;
  role: Role;
}

/** Locks every membership of the garden, so owners are counted and roles read under one lock. */
export async function lockMemberships(db: Sequelize, gardenId: number, transaction: Transaction): Promise<Locked[]> {
  return db.query<Locked>('SELECT user_id AS userId, role FROM memberships WHERE garden_id = ? ORDER BY id FOR UPDATE', {
    replacements: [gardenId],
    type: QueryTypes.SELECT,
    transaction,
  });
}

async function nameOf(db: Sequelize, userId: number, transaction: Transaction): Promise<string> {
  const [row] = await db.query<{ name: string }>('SELECT name FROM users WHERE id = ?', { replacements: [userId], type: QueryTypes.SELECT, transaction });
  return row?.name ?? 'A member';
}

/** After any membership change: the garden's cached answers are no longer served. */
export async function membershipChanged(db: Sequelize, gardenId: number, transaction: Transaction) {
  await moveGardenRevisions(db, [gardenId], transaction);
}

export async function changeRole(db: Sequelize, gardenId: number, actor: Actor, userId: number, role: Role): Promise<MemberRow> {
  await inTransaction(db, async (transaction) => {
    const rows = await lockMemberships(db, gardenId, transaction);
    if (rows.find((r) => r.userId === actor.id)?.role !== 'owner') throw notOwnerAnyMore();
    const target = rows.find((r) => r.userId === userId);
    if (!target) throw AppError.notFound('That member');
    if (target.role === role) return;
    if (target.role === 'owner' && rows.filter((r) => r.role === 'owner').length <= 1) throw lastOwner('role', 'This owner cannot be given another role');
    await db.query('UPDATE memberships SET role = ?, updated_at = UTC_TIMESTAMP() WHERE garden_id = ? AND user_id = ?', { replacements: [role, gardenId, userId], transaction });
    await membershipChanged(db, gardenId, transaction);
    const name = userId === actor.id ? actor.name : await nameOf(db, userId, transaction);
    await recordAudit(transaction, {
      gardenId,
      actor,
      entity: 'member',
      entityId: userId,
      action: 'changed',
      summary: `Role of ${name}: ${target.role} → ${role}`,
      changes: { role: { from: target.role, to: role } },
    });
  });
  const member = (await listMembers(db, gardenId)).find((m) => m.userId === userId);
  if (!member) throw AppError.notFound('That member');
  return member;
}

/**
 * Removes a member (an owner removing someone) or the actor themselves (leaving). Their
 * mail choices for the garden go with them, so nothing about it is sent to them any more.
 */
export async function removeMember(db: Sequelize, gardenId: number, actor: Actor, userId: number): Promise<void> {
  const leaving = userId === actor.id;
  await inTransaction(db, async (transaction) => {
    const rows = await lockMemberships(db, gardenId, transaction);
    const me = rows.find((r) => r.userId === actor.id);
    if (!me) throw AppError.notFound('That garden');
    if (!leaving && me.role !== 'owner') throw notOwnerAnyMore();
    const target = rows.find((r) => r.userId === userId);
    if (!target) throw AppError.notFound('That member');
    if (target.role === 'owner' && rows.filter((r) => r.role === 'owner').length <= 1) {
      throw leaving ? lastOwner('userId', 'You cannot leave this garden') : lastOwner('userId', 'This owner cannot be removed');
    }
    const name = leaving ? actor.name : await nameOf(db, userId, transaction);
    await db.query('DELETE FROM memberships WHERE garden_id = ? AND user_id = ?', { replacements: [gardenId, userId], transaction });
    await db.query('DELETE FROM notification_preferences WHERE garden_id = ? AND user_id = ?', { replacements: [gardenId, userId], transaction });
    // Mail about the garden not yet out to them is not sent to someone who is no longer in it.
    await db.query("DELETE FROM mail_outbox WHERE garden_id = ? AND user_id = ? AND status = 'pending'", { replacements: [gardenId, userId], transaction });
    // A removed member is signed out everywhere (RELIABILITY.md); one who leaves stays signed in.
    if (!leaving) await endSessionsOf(db, userId, undefined, transaction);
    await membershipChanged(db, gardenId, transaction);
    await recordAudit(transaction, {
      gardenId,
      actor,
      entity: 'member',
      entityId: userId,
      action: leaving ? 'left' : 'removed',
      summary: leaving ? `${name} left the garden (was ${target.role})` : `${name} was removed from the garden (was ${target.role})`,
      changes: { role: { from: target.role } },
    });
  });
}
