import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { Delivery, UnsubscribeInfoDto } from '#shared/schemas/notifications';
import { AppError } from '../../errors';
import { mailSettings } from './mail-settings';
import { newNonce, verifyUnsubscribe } from './unsubscribe-token';
import type { UnsubscribeClaim } from './unsubscribe-token';

const invalid = () => new AppError(404, 'unsubscribe_invalid', 'This unsubscribe link is not valid. Check that it was copied whole.');
const used = () =>
  new AppError(410, 'unsubscribe_used', 'This unsubscribe link has already been used. Sign in to change which e-mail you receive.');

function maskEmail(email: string): string {
  const at = email.lastIndexOf('@');
  return `${email.slice(0, 1)}…${email.slice(at)}`;
}

function claimOf(token: string): UnsubscribeClaim {
  const claim = verifyUnsubscribe(mailSettings().unsubscribeKey, token);
  if (!claim) throw invalid();
  return claim;
}

async function describe(db: Sequelize, claim: UnsubscribeClaim): Promise<UnsubscribeInfoDto & { nonce: string }> {
  const [row] = await db.query<{ delivery: Delivery; nonce: string; memberName: string; email: string; gardenName: string }>(
    `SELECT p.delivery, p.unsubscribe_nonce AS nonce, u.name AS memberName, u.email, g.name AS gardenName
       FROM notification_preferences p JOIN users u ON u.id = p.user_id JOIN gardens g ON g.id = p.garden_id
      WHERE p.user_id = ? AND p.garden_id = ?`,
    { replacements: [claim.userId, claim.gardenId], type: QueryTypes.SELECT },
  );
  if (!row) throw invalid();
  return { gardenName: row.gardenName, memberName: row.memberName, maskedEmail: maskEmail(row.email), delivery: row.delivery, nonce: row.nonce };
}

/** Who and which garden a link is for; changes nothing. */
export async function unsubscribeInfo(db: Sequelize, token: string): Promise<UnsubscribeInfoDto> {
  const claim = claimOf(token);
  const { nonce, ...info } = await describe(db, claim);
  if (nonce !== claim.nonce) throw used();
  return info;
}

/** Turns the member's e-mail for that garden off and replaces the nonce, which retires the link. */
export async function unsubscribe(db: Sequelize, token: string): Promise<UnsubscribeInfoDto> {
  const claim = claimOf(token);
  const [, changed] = await db.query(
    `UPDATE notification_preferences SET delivery = 'off', unsubscribe_nonce = ?, updated_at = UTC_TIMESTAMP(3)
      WHERE user_id = ? AND garden_id = ? AND unsubscribe_nonce = ?`,
    { replacements: [newNonce(), claim.userId, claim.gardenId, claim.nonce], type: QueryTypes.UPDATE },
  );
  const { nonce: _rotated, ...info } = await describe(db, claim);
  if (changed !== 1) throw used();
  return info;
}
