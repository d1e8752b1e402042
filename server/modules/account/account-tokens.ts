/**
 * Single-use links mailed about an existing account (password reset, e-mail change): 32 random
 * bytes as base64url in the link, only their SHA-256 in `account_tokens`. A used link keeps its
 * row, so opening it again reads "already used" instead of "does not work".
 */
import { createHash, randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import { AppError } from '../../errors';

export type TokenPurpose = 'password-reset' | 'email-change';

export const RESET_LINK_HOURS = 1;
export const EMAIL_LINK_HOURS = 24;

const TOKEN = /^[A-Za-z0-9_-]{43}$/;
export const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
export const newToken = () => randomBytes(32).toString('base64url');

export interface TokenRow {
  id: number;
  userId: number;
  email: string;
  name: string;
  newEmail: string | null;
  used: number;
  expired: number;
}

const WORDS: Record<TokenPurpose, { what: string; again: string; hours: number }> = {
  'password-reset': { what: 'password reset links', again: 'Ask for a new one from the sign-in page (“Forgot password?”).', hours: RESET_LINK_HOURS },
  'email-change': { what: 'links to confirm a new e-mail', again: 'Ask for the change again on your Account page.', hours: EMAIL_LINK_HOURS },
};

export function linkRefused(purpose: TokenPurpose, why: 'invalid' | 'used' | 'expired'): AppError {
  const w = WORDS[purpose];
  if (why === 'used') return new AppError(410, 'link_used', `This link has been used already: each link works once. ${w.again}`);
  if (why === 'expired') {
    const hours = w.hours === 1 ? '1 hour' : `${w.hours} hours`;
    return new AppError(410, 'link_expired', `This link has expired: ${w.what} work for ${hours}. ${w.again}`);
  }
  return new AppError(404, 'link_invalid', `This link does not work: it was replaced by a newer one or copied incompletely. ${w.again}`);
}

/** The link's row and its user, or a refusal in words; `lock` takes the row for the transaction. */
export async function readToken(db: Sequelize, purpose: TokenPurpose, token: string, opts: { transaction?: Transaction; lock?: boolean } = {}): Promise<TokenRow> {
  if (!TOKEN.test(token)) throw linkRefused(purpose, 'invalid');
  const [row] = await db.query<TokenRow>(
    `SELECT t.id, t.user_id AS userId, u.email, u.name, t.new_email AS newEmail, t.used_at IS NOT NULL AS used, t.expires_at <= UTC_TIMESTAMP(3) AS expired
       FROM account_tokens t JOIN users u ON u.id = t.user_id
      WHERE t.token_hash = ? AND t.purpose = ?${opts.lock ? ' FOR UPDATE' : ''}`,
    { replacements: [sha256(token), purpose], type: QueryTypes.SELECT, transaction: opts.transaction },
  );
  if (!row) throw linkRefused(purpose, 'invalid');
  if (Number(row.used)) throw linkRefused(purpose, 'used');
  if (Number(row.expired)) throw linkRefused(purpose, 'expired');
  return row;
}

/** Marks every open link of this kind of the user used (the one just followed, and any older ones). */
export async function useTokens(db: Sequelize, transaction: Transaction, userId: number, purpose: TokenPurpose) {
  await db.query('UPDATE account_tokens SET used_at = UTC_TIMESTAMP(3) WHERE user_id = ? AND purpose = ? AND used_at IS NULL', {
    replacements: [userId, purpose],
    transaction,
  });
}

/** A newer link replaces the open ones: they are removed, so they read "does not work". */
export async function dropOpenTokens(db: Sequelize, transaction: Transaction, userId: number, purpose: TokenPurpose) {
  await db.query('DELETE FROM account_tokens WHERE user_id = ? AND purpose = ? AND used_at IS NULL', { replacements: [userId, purpose], transaction });
}

/** Rows are kept a week past their expiry so their link is still answered in words. */
export async function tidyTokens(db: Sequelize, transaction: Transaction) {
  await db.query('DELETE FROM account_tokens WHERE expires_at < UTC_TIMESTAMP(3) - INTERVAL 7 DAY ORDER BY expires_at LIMIT 50', { transaction });
}
