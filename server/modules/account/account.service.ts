/**
 * Changes a signed-in person makes to their own account: name, e-mail (only once the new address
 * confirms through its link) and password (the current one required; other sessions end).
 */
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { EmailChangeInput, PasswordChangeInput } from '#shared/schemas/account';
import type { UserDto } from '#shared/schemas/auth';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import { queueAccountMail } from '../auth/account-mail';
import { hashPassword, verifyPassword } from '../auth/password';
import { assertStrongPassword } from '../auth/password-strength';
import type { SqlSessionStore } from '../auth/session-store';
import { EMAIL_LINK_HOURS, dropOpenTokens, newToken, readToken, sha256, tidyTokens, useTokens } from './account-tokens';
import { confirmEmailUrlFor, renderConfirmEmailMail, renderEmailChangedMail, renderEmailTakenMail, renderPasswordChangedMail } from './account-mail';

export const EMAIL_CHANGE_REQUESTED = Object.freeze({
  status: 'check-email' as const,
  message: `We sent a link to the new address. Your e-mail changes when that link is opened, within ${EMAIL_LINK_HOURS} hours; until then it stays as it is.`,
});

interface AccountRow {
  id: number;
  email: string;
  name: string;
  passwordHash: string;
}

async function accountOf(db: Sequelize, userId: number): Promise<AccountRow> {
  const [row] = await db.query<AccountRow>('SELECT id, email, name, password_hash AS passwordHash FROM users WHERE id = ?', {
    replacements: [userId],
    type: QueryTypes.SELECT,
  });
  if (!row) throw AppError.unauthenticated();
  return row;
}

const wrongPassword = (field: string) =>
  new AppError(400, 'validation_failed', `Please check the fields: ${field}.`, { [field]: 'This is not your current password.' });

export async function changeName(db: Sequelize, userId: number, name: string): Promise<UserDto> {
  await db.query('UPDATE users SET name = ?, updated_at = UTC_TIMESTAMP(3) WHERE id = ?', { replacements: [name, userId] });
  const { id, email } = await accountOf(db, userId);
  return { id, email, name };
}

/**
 * Mails a confirmation link to the new address. The answer is the same when that address already
 * has an account (its owner gets a note instead), so this form does not tell who has an account.
 */
export async function requestEmailChange(db: Sequelize, userId: number, input: EmailChangeInput): Promise<void> {
  const account = await accountOf(db, userId);
  if (!(await verifyPassword(input.password, account.passwordHash))) throw wrongPassword('password');
  if (input.email === account.email) {
    throw new AppError(400, 'validation_failed', 'Please check the fields: email.', { email: 'This is already your e-mail address.' });
  }
  const token = newToken();
  await inTransaction(db, async (transaction) => {
    await tidyTokens(db, transaction);
    // A newer request replaces the older ones.
    await dropOpenTokens(db, transaction, userId, 'email-change');
    const [taken] = await db.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { replacements: [input.email], type: QueryTypes.SELECT, transaction });
    if (taken) {
      await queueAccountMail(db, transaction, { userId: null, to: input.email, content: renderEmailTakenMail(input.email) });
      return;
    }
    await db.query(
      `INSERT INTO account_tokens (user_id, purpose, token_hash, new_email, expires_at, created_at)
       VALUES (?, 'email-change', ?, ?, UTC_TIMESTAMP(3) + INTERVAL ${EMAIL_LINK_HOURS} HOUR, UTC_TIMESTAMP(3))`,
      { replacements: [userId, sha256(token), input.email], transaction },
    );
    await queueAccountMail(db, transaction, { userId, to: input.email, content: renderConfirmEmailMail(account.name, input.email, confirmEmailUrlFor(token)) });
  });
}

const emailTaken = () =>
  new AppError(409, 'email_taken', 'Another account started using this e-mail after the link was sent, so your e-mail was not changed.', {
    email: 'This e-mail now belongs to another account.',
  });

/** Follows the link: the account signed in must be the one that asked; the old address gets a note. */
export async function confirmEmailChange(db: Sequelize, userId: number, token: string): Promise<UserDto> {
  try {
    return await inTransaction(db, async (transaction) => {
      const row = await readToken(db, 'email-change', token, { transaction, lock: true });
      if (row.userId !== userId) {
        throw new AppError(403, 'link_other_account', 'This link belongs to another account. Sign out, then sign in with the account that asked for the change.');
      }
      const newEmail = row.newEmail!;
      await db.query('UPDATE users SET email = ?, updated_at = UTC_TIMESTAMP(3) WHERE id = ?', { replacements: [newEmail, userId], transaction });
      await useTokens(db, transaction, userId, 'email-change');
      await queueAccountMail(db, transaction, { userId, to: row.email, content: renderEmailChangedMail(row.name, newEmail) });
      return { id: userId, email: newEmail, name: row.name };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError || (err as { parent?: { errno?: number } })?.parent?.errno === 1062) throw emailTaken();
    throw err;
  }
}

/** Checks the current password, sets the new one and ends every other session; this one stays signed in. */
export async function changePassword(db: Sequelize, sessions: SqlSessionStore, userId: number, currentSid: string, input: PasswordChangeInput): Promise<number> {
  const account = await accountOf(db, userId);
  if (!(await verifyPassword(input.currentPassword, account.passwordHash))) throw wrongPassword('currentPassword');
  assertStrongPassword(input.password, { email: account.email, name: account.name });
  const passwordHash = await hashPassword(input.password);
  return inTransaction(db, async (transaction) => {
    await db.query('UPDATE users SET password_hash = ?, updated_at = UTC_TIMESTAMP(3) WHERE id = ?', { replacements: [passwordHash, userId], transaction });
    // A reset link mailed earlier must not undo this change.
    await useTokens(db, transaction, userId, 'password-reset');
    const ended = await sessions.endAllFor(userId, currentSid, transaction);
    await queueAccountMail(db, transaction, { userId, to: account.email, content: renderPasswordChangedMail(account.name) });
    return ended;
  });
}
