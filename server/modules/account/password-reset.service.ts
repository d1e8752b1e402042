/**
 * "Forgot password?": a reset request is answered the same whether or not the address has an
 * account, and does the same work either way: one token is made and hashed, and one transaction
 * runs the same four statements. The token row and the message are written by INSERT … SELECT
 * from `users`, so for an unknown address they simply insert nothing; there is no early return
 * whose timing could tell the two apart.
 */
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { inTransaction } from '../../lib/transaction';
import { mailQueued } from '../notifications/mail-sender';
import { queueAccountMail } from '../auth/account-mail';
import { hashPassword } from '../auth/password';
import { assertStrongPassword } from '../auth/password-strength';
import type { SqlSessionStore } from '../auth/session-store';
import { RESET_LINK_HOURS, newToken, readToken, sha256, tidyTokens, useTokens } from './account-tokens';
import { renderPasswordChangedMail, renderResetMail, resetUrlFor } from './account-mail';

export const RESET_REQUESTED = Object.freeze({
  status: 'check-email' as const,
  message: 'If an account uses this e-mail, we sent it a link to choose a new password. The link works for 1 hour.',
});

export const PASSWORD_RESET_DONE = Object.freeze({
  status: 'password-changed' as const,
  message: 'Your password is changed and your account is signed out everywhere. Sign in with the new password.',
});

export async function requestPasswordReset(db: Sequelize, email: string): Promise<void> {
  const token = newToken();
  const mail = renderResetMail(email, resetUrlFor(token));
  await inTransaction(db, async (transaction) => {
    await tidyTokens(db, transaction);
    // A newer link replaces the older ones (which then read "does not work", like a mistyped link).
    await db.query(
      `DELETE t FROM account_tokens t JOIN users u ON u.id = t.user_id
        WHERE u.email = ? AND t.purpose = 'password-reset' AND t.used_at IS NULL`,
      { replacements: [email], transaction },
    );
    await db.query(
      `INSERT INTO account_tokens (user_id, purpose, token_hash, new_email, expires_at, created_at)
       SELECT id, 'password-reset', ?, NULL, UTC_TIMESTAMP(3) + INTERVAL ${RESET_LINK_HOURS} HOUR, UTC_TIMESTAMP(3) FROM users WHERE email = ?`,
      { replacements: [sha256(token), email], transaction },
    );
    const [, queued] = await db.query(
      `INSERT INTO mail_outbox (user_id, garden_id, kind, dedupe_key, to_addr, subject, text_body, html_body, headers_json, status, attempts, run_after, created_at)
       SELECT id, NULL, 'account', ?, email, ?, ?, ?, '{}', 'pending', 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3) FROM users WHERE email = ?`,
      { replacements: [`account:${randomUUID()}`, mail.subject, mail.text, mail.html, email], type: QueryTypes.INSERT, transaction },
    );
    if (queued) transaction.afterCommit(mailQueued);
  });
}

/** Whether a reset link can still be used (the page asks before the grower types a new password). */
export async function checkResetLink(db: Sequelize, token: string): Promise<void> {
  await readToken(db, 'password-reset', token);
}

/**
 * Sets the new password, uses the link (and any other open reset link of the account) and ends
 * every session of the account, all in one transaction; a note goes to the account's address.
 */
export async function resetPassword(db: Sequelize, sessions: SqlSessionStore, token: string, password: string): Promise<void> {
  const found = await readToken(db, 'password-reset', token);
  assertStrongPassword(password, { email: found.email, name: found.name });
  const passwordHash = await hashPassword(password);
  await inTransaction(db, async (transaction) => {
    // Read again under lock: a second tab may have used the link while the hash was made.
    const row = await readToken(db, 'password-reset', token, { transaction, lock: true });
    await db.query('UPDATE users SET password_hash = ?, updated_at = UTC_TIMESTAMP(3) WHERE id = ?', { replacements: [passwordHash, row.userId], transaction });
    await useTokens(db, transaction, row.userId, 'password-reset');
    await sessions.endAllFor(row.userId, undefined, transaction);
    await queueAccountMail(db, transaction, { userId: row.userId, to: row.email, content: renderPasswordChangedMail(row.name) });
  });
}
