/**
 * Sign-up in two steps, so the answer to a sign-up never tells whether an address has an account:
 * the request is answered the same either way and what differs goes to the address by e-mail
 * (a link that finishes the account, or a note that it already has one). Both ways hash the
 * password and run one transaction of the same shape (look up the address, tidy expired rows,
 * write or clear the address's pending row, queue one message).
 */
import { createHash, randomBytes } from 'node:crypto';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { RegisterInput } from '#shared/schemas/auth';
import { AppError } from '../../errors';
import { Garden, Membership, User } from '../../db/models';
import { inTransaction } from '../../lib/transaction';
import { hashPassword } from './password';
import { LINK_HOURS, confirmUrlFor, queueAccountMail, renderExistingAccountMail, renderFinishMail, signInUrl } from './account-mail';

/** The one answer to every accepted sign-up request. */
export const CHECK_EMAIL = Object.freeze({
  status: 'check-email' as const,
  message: 'Check your e-mail: we sent a link to finish creating your account.',
});

const TOKEN = /^[A-Za-z0-9_-]{43}$/;
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

export async function requestRegistration(sequelize: Sequelize, input: RegisterInput): Promise<void> {
  // Needed for the pending row; spent all the same when the address has an account.
  const passwordHash = await hashPassword(input.password);
  const token = randomBytes(32).toString('base64url');
  await inTransaction(sequelize, async (transaction) => {
    const [existing] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM users WHERE email = ?', {
      replacements: [input.email],
      type: QueryTypes.SELECT,
      transaction,
    });
    // Expired rows are kept a week, so their link is still answered "expired" rather than "does not work".
    await sequelize.query('DELETE FROM pending_registrations WHERE expires_at < UTC_TIMESTAMP(3) - INTERVAL 7 DAY ORDER BY expires_at LIMIT 50', { transaction });
    if (existing) {
      // A link asked for before the account existed can never finish now.
      await sequelize.query('DELETE FROM pending_registrations WHERE email = ?', { replacements: [input.email], transaction });
      await queueAccountMail(sequelize, transaction, { userId: existing.id, to: input.email, content: renderExistingAccountMail(existing.name, input.email, signInUrl()) });
      return;
    }
    // One pending sign-up per address: asking again replaces the earlier one and its link.
    await sequelize.query(
      `INSERT INTO pending_registrations (email, name, garden_name, password_hash, token_hash, expires_at, created_at)
       VALUES (?, ?, ?, ?, ?, UTC_TIMESTAMP(3) + INTERVAL ${LINK_HOURS} HOUR, UTC_TIMESTAMP(3))
       ON DUPLICATE KEY UPDATE name = VALUES(name), garden_name = VALUES(garden_name), password_hash = VALUES(password_hash),
         token_hash = VALUES(token_hash), expires_at = VALUES(expires_at), created_at = VALUES(created_at)`,
      { replacements: [input.email, input.name, input.gardenName, passwordHash, sha256(token)], transaction },
    );
    await queueAccountMail(sequelize, transaction, { userId: null, to: input.email, content: renderFinishMail(input.email, confirmUrlFor(token)) });
  });
}

const INVALID = () =>
  new AppError(
    400,
    'link_invalid',
    'This link does not work: it has been used already, was replaced by a newer one, or was copied incompletely. If your account was created, sign in; otherwise register again.',
  );
const EXPIRED = () =>
  new AppError(410, 'link_expired', `This link has expired: links to finish an account work for ${LINK_HOURS} hours. Register again to get a new one.`);
const TAKEN = () => new AppError(409, 'email_taken', 'An account with this e-mail already exists, so no new one was created. Sign in instead.');

interface PendingRow {
  id: number;
  email: string;
  name: string;
  gardenName: string;
  passwordHash: string;
  expired: number;
}

async function createAccount(transaction: Transaction, p: PendingRow) {
  const user = await User.create({ email: p.email, name: p.name, passwordHash: p.passwordHash }, { transaction });
  const garden = await Garden.create({ name: p.gardenName, timeZone: 'UTC', units: 'F' }, { transaction });
  await Membership.create({ userId: user.id, gardenId: garden.id, role: 'owner' }, { transaction });
  return { user, garden };
}

/**
 * Uses a link once: creates the user, their first garden and the owner membership and removes the
 * pending row, all in one transaction. A used, replaced, forged or expired link is refused in words.
 */
export async function confirmRegistration(sequelize: Sequelize, token: string) {
  if (!TOKEN.test(token)) throw INVALID();
  const outcome = await inTransaction(sequelize, async (transaction) => {
    const [pending] = await sequelize.query<PendingRow>(
      `SELECT id, email, name, garden_name AS gardenName, password_hash AS passwordHash, expires_at <= UTC_TIMESTAMP(3) AS expired
         FROM pending_registrations WHERE token_hash = ? FOR UPDATE`,
      { replacements: [sha256(token)], type: QueryTypes.SELECT, transaction },
    );
    if (!pending) return { kind: 'invalid' as const };
    const remove = () => sequelize.query('DELETE FROM pending_registrations WHERE id = ?', { replacements: [pending.id], transaction });
    if (Number(pending.expired)) {
      await remove();
      return { kind: 'expired' as const };
    }
    const taken = await User.count({ where: { email: pending.email }, transaction });
    if (taken) {
      await remove();
      return { kind: 'taken' as const };
    }
    const created = await createAccount(transaction, pending);
    await remove();
    return { kind: 'created' as const, ...created };
  }).catch((err: unknown) => {
    // The address got an account between the check and the insert (another tab, another instance).
    if (err instanceof UniqueConstraintError) return { kind: 'taken' as const };
    throw err;
  });
  if (outcome.kind === 'invalid') throw INVALID();
  if (outcome.kind === 'expired') throw EXPIRED();
  if (outcome.kind === 'taken') throw TAKEN();
  return { user: outcome.user, garden: outcome.garden };
}
