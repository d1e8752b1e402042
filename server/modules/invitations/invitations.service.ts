/**
 * Invitations by e-mail: an owner names an address and a role; the address gets a single-use
 * link that works for INVITATION_DAYS. Only the token's SHA-256 is stored. Using the link either
 * creates the account (the address has none) or adds the signed-in user whose address it is.
 * A row is kept after it is used or revoked, so its link is refused in words saying which.
 */
import { createHash, randomBytes } from 'node:crypto';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { Role } from '#shared/schemas/gardens';
import { INVITATION_DAYS } from '#shared/schemas/invitations';
import type { InvitationCreateInput, InvitationDto, InvitationPreviewDto, NewAccountAcceptInput } from '#shared/schemas/invitations';
import type { UserDto } from '#shared/schemas/auth';
import type { CapturedMailDto } from '#shared/schemas/notifications';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import { Garden, User } from '../../db/models';
import { recordAudit } from '../audit/audit';
import { hashPassword } from '../auth/password';
import { assertStrongPassword } from '../auth/password-strength';
import { lockMemberships, membershipChanged } from '../members/members.service';
import type { Actor } from '../members/members.service';
import { INVITATION_HEADER, invitationUrlFor, queueInvitationMail, renderInvitationMail } from './invitation-mail';

const TOKEN = /^[A-Za-z0-9_-]{43}$/;
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

interface InvitationRow {
  id: number;
  gardenId: number;
  gardenName: string;
  email: string;
  role: Role;
  invitedBy: string;
  createdAt: Date | string;
  expiresAt: Date | string;
  acceptedAt: Date | string | null;
  revokedAt: Date | string | null;
  expired: number;
}

const COLUMNS = `i.id, i.garden_id AS gardenId, g.name AS gardenName, i.email, i.role, i.invited_by_name AS invitedBy,
  i.created_at AS createdAt, i.expires_at AS expiresAt, i.accepted_at AS acceptedAt, i.revoked_at AS revokedAt,
  i.expires_at <= UTC_TIMESTAMP(3) AS expired`;
const PENDING = 'i.accepted_at IS NULL AND i.revoked_at IS NULL AND i.expires_at > UTC_TIMESTAMP(3)';

const iso = (d: Date | string) => new Date(d).toISOString();

function present(r: InvitationRow): InvitationDto {
  return { id: r.id, email: r.email, role: r.role, invitedBy: r.invitedBy, createdAt: iso(r.createdAt), expiresAt: iso(r.expiresAt) };
}

const UNKNOWN = () =>
  new AppError(404, 'invitation_unknown', 'This invitation link does not work: it may have been copied incompletely. Ask the garden’s owner to invite you again.');

/** A used, revoked or expired invitation, refused in words saying which. */
function refusal(r: InvitationRow): AppError | null {
  if (r.acceptedAt) return new AppError(410, 'invitation_used', 'This invitation has been used already: each link works once. If it was you, sign in to open the garden.');
  if (r.revokedAt) return new AppError(410, 'invitation_revoked', 'This invitation was withdrawn by the garden’s owner. Ask them to invite you again if you should be in.');
  if (Number(r.expired)) return new AppError(410, 'invitation_expired', `This invitation has expired: links work for ${INVITATION_DAYS} days. Ask the garden’s owner to invite you again.`);
  return null;
}

const alreadyMember = () =>
  new AppError(409, 'already_member', 'This e-mail already belongs to a member of this garden.', { email: 'This person is already a member of this garden.' });

const accountExists = () =>
  new AppError(409, 'account_exists', 'This e-mail already has a Heatclock account: sign in with it, then join.', {
    email: 'This e-mail already has an account. Sign in first, then press Join.',
  });

async function findByToken(db: Sequelize, token: string, transaction?: Transaction): Promise<InvitationRow> {
  if (!TOKEN.test(token)) throw UNKNOWN();
  const [row] = await db.query<InvitationRow>(
    `SELECT ${COLUMNS} FROM garden_invitations i JOIN gardens g ON g.id = i.garden_id WHERE i.token_hash = ?${transaction ? ' FOR UPDATE' : ''}`,
    { replacements: [sha256(token)], type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw UNKNOWN();
  const refused = refusal(row);
  if (refused) throw refused;
  return row;
}

async function userIdByEmail(db: Sequelize, email: string, transaction?: Transaction): Promise<number | null> {
  const [row] = await db.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { replacements: [email], type: QueryTypes.SELECT, transaction });
  return row?.id ?? null;
}

export async function listInvitations(db: Sequelize, gardenId: number): Promise<InvitationDto[]> {
  const rows = await db.query<InvitationRow>(`SELECT ${COLUMNS} FROM garden_invitations i JOIN gardens g ON g.id = i.garden_id WHERE i.garden_id = ? AND ${PENDING} ORDER BY i.id DESC`, {
    replacements: [gardenId],
    type: QueryTypes.SELECT,
  });
  return rows.map(present);
}

/**
 * Invites one address. A pending invitation to the same address is replaced (its link stops
 * working), so asking again is how an owner resends or changes the role.
 */
export async function createInvitation(db: Sequelize, gardenId: number, actor: Actor, input: InvitationCreateInput): Promise<InvitationDto> {
  const token = randomBytes(32).toString('base64url');
  return inTransaction(db, async (transaction) => {
    const rows = await lockMemberships(db, gardenId, transaction);
    if (rows.find((r) => r.userId === actor.id)?.role !== 'owner') throw AppError.forbidden('Only the garden owner can do this. Your role in this garden has just changed.');
    const existing = await userIdByEmail(db, input.email, transaction);
    if (existing !== null && rows.some((r) => r.userId === existing)) throw alreadyMember();
    await db.query(`UPDATE garden_invitations i SET i.revoked_at = UTC_TIMESTAMP(3) WHERE i.garden_id = ? AND i.email = ? AND ${PENDING}`, {
      replacements: [gardenId, input.email],
      transaction,
    });
    const [id] = await db.query(
      `INSERT INTO garden_invitations (garden_id, email, role, token_hash, invited_by_user_id, invited_by_name, created_at, expires_at)
       VALUES (?, ?, ?, ?, ?, ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3) + INTERVAL ${INVITATION_DAYS} DAY)`,
      { replacements: [gardenId, input.email, input.role, sha256(token), actor.id, actor.name], type: QueryTypes.INSERT, transaction },
    );
    const [row] = await db.query<InvitationRow>(`SELECT ${COLUMNS} FROM garden_invitations i JOIN gardens g ON g.id = i.garden_id WHERE i.id = ?`, {
      replacements: [id],
      type: QueryTypes.SELECT,
      transaction,
    });
    await queueInvitationMail(db, transaction, {
      gardenId,
      invitationId: row.id,
      userId: existing,
      to: input.email,
      content: renderInvitationMail({ gardenName: row.gardenName, inviterName: actor.name, role: input.role, url: invitationUrlFor(token) }),
    });
    await recordAudit(transaction, {
      gardenId,
      actor,
      entity: 'invitation',
      entityId: row.id,
      action: 'invited',
      summary: `Invited ${input.email} as ${input.role}`,
      changes: { email: { to: input.email }, role: { to: input.role } },
    });
    return present(row);
  });
}

export async function revokeInvitation(db: Sequelize, gardenId: number, actor: Actor, id: number): Promise<void> {
  await inTransaction(db, async (transaction) => {
    const [row] = await db.query<InvitationRow>(`SELECT ${COLUMNS} FROM garden_invitations i JOIN gardens g ON g.id = i.garden_id WHERE i.id = ? AND i.garden_id = ? FOR UPDATE`, {
      replacements: [id, gardenId],
      type: QueryTypes.SELECT,
      transaction,
    });
    if (!row) throw AppError.notFound('That invitation');
    if (refusal(row)) {
      const state = row.acceptedAt ? 'has been used already' : row.revokedAt ? 'was withdrawn already' : 'has expired';
      throw new AppError(409, 'invitation_not_pending', `This invitation ${state}, so there is nothing to withdraw.`);
    }
    await db.query('UPDATE garden_invitations SET revoked_at = UTC_TIMESTAMP(3) WHERE id = ?', { replacements: [id], transaction });
    // Its mail, if not out yet, is not sent with a dead link.
    await db.query("DELETE FROM mail_outbox WHERE dedupe_key = ? AND status = 'pending'", { replacements: [`invitation:${id}`], transaction });
    await recordAudit(transaction, {
      gardenId,
      actor,
      entity: 'invitation',
      entityId: id,
      action: 'revoked',
      summary: `Withdrew the invitation to ${row.email} (${row.role})`,
      changes: { email: { from: row.email }, role: { from: row.role } },
    });
  });
}

export async function previewInvitation(db: Sequelize, token: string, user: UserDto | undefined): Promise<InvitationPreviewDto> {
  const row = await findByToken(db, token);
  return {
    garden: { name: row.gardenName },
    role: row.role,
    email: row.email,
    invitedBy: row.invitedBy,
    expiresAt: iso(row.expiresAt),
    accountExists: (await userIdByEmail(db, row.email)) !== null,
    signedInMatches: !!user && user.email.toLowerCase() === row.email,
  };
}

export interface Accepted {
  user: UserDto;
  garden: Garden;
  role: Role;
  /** A new account was made: the caller signs it in. */
  created: boolean;
}

/**
 * Uses the link once. With `account` (name and password) it creates the account, which only an
 * address without one may do; without it, the signed-in user joins when the address is theirs.
 */
export async function acceptInvitation(db: Sequelize, token: string, user: UserDto | undefined, account: NewAccountAcceptInput | null): Promise<Accepted> {
  const first = await findByToken(db, token);
  let passwordHash: string | null = null;
  if (account) {
    if ((await userIdByEmail(db, first.email)) !== null) throw accountExists();
    assertStrongPassword(account.password, { email: first.email, name: account.name, gardenName: first.gardenName });
    passwordHash = await hashPassword(account.password);
  } else {
    if (!user) throw new AppError(401, 'unauthenticated', `Please sign in as ${first.email} first, then join.`);
    if (user.email.toLowerCase() !== first.email)
      throw AppError.forbidden(`This invitation is for ${first.email}, but you are signed in as ${user.email}. Sign out and sign in with the invited e-mail.`);
  }
  const outcome = await inTransaction(db, async (transaction) => {
    // Memberships first, then the invitation: the order creating an invitation locks them in.
    const rows = await lockMemberships(db, first.gardenId, transaction);
    const row = await findByToken(db, token, transaction);
    let joined: UserDto;
    if (account && passwordHash) {
      const made = await User.create({ email: row.email, name: account.name, passwordHash }, { transaction });
      joined = { id: made.id, email: made.email, name: made.name };
    } else {
      joined = user!;
      if (rows.some((r) => r.userId === joined.id)) throw alreadyMember();
    }
    await db.query('INSERT INTO memberships (user_id, garden_id, role, created_at, updated_at) VALUES (?, ?, ?, UTC_TIMESTAMP(), UTC_TIMESTAMP())', {
      replacements: [joined.id, row.gardenId, row.role],
      transaction,
    });
    await db.query('UPDATE garden_invitations SET accepted_at = UTC_TIMESTAMP(3), accepted_user_id = ? WHERE id = ?', { replacements: [joined.id, row.id], transaction });
    await membershipChanged(db, row.gardenId, transaction);
    await recordAudit(transaction, {
      gardenId: row.gardenId,
      actor: { id: joined.id, name: joined.name },
      entity: 'member',
      entityId: joined.id,
      action: 'joined',
      summary: `${joined.name} joined as ${row.role} (invited by ${row.invitedBy})`,
      changes: { role: { to: row.role }, invitation: { to: row.id } },
    });
    const garden = await Garden.findByPk(row.gardenId, { transaction });
    return { user: joined, garden: garden!, role: row.role, created: !!account };
  }).catch((err: unknown) => {
    // The address got an account between the check and the insert (another tab, another instance).
    if (err instanceof UniqueConstraintError) throw account ? accountExists() : alreadyMember();
    throw err;
  });
  return outcome;
}

/**
 * The copy of an invitation the local test mailbox caught (null until the sender has delivered
 * it). The invitee of a new address has no account to open the mailbox with, so while mail only
 * reaches the local fake the garden's owner can read the message there; with real SMTP there is
 * no copy and the route does not exist.
 */
export async function capturedInvitationMail(db: Sequelize, gardenId: number, id: number): Promise<CapturedMailDto | null> {
  const [inv] = await db.query<{ email: string }>('SELECT email FROM garden_invitations WHERE id = ? AND garden_id = ?', { replacements: [id, gardenId], type: QueryTypes.SELECT });
  if (!inv) throw AppError.notFound('That invitation');
  const [row] = await db.query<{ toAddr: string; subject: string; textBody: string; htmlBody: string | null; receivedAt: Date }>(
    `SELECT to_addr AS toAddr, subject, text_body AS textBody, html_body AS htmlBody, received_at AS receivedAt
       FROM captured_mail WHERE to_addr = ? AND JSON_VALUE(headers_json, ?) = ? ORDER BY id DESC LIMIT 1`,
    { replacements: [inv.email, `$."${INVITATION_HEADER.toLowerCase()}"`, String(id)], type: QueryTypes.SELECT },
  );
  return row ? { to: row.toAddr, subject: row.subject, text: row.textBody, html: row.htmlBody, receivedAt: iso(row.receivedAt) } : null;
}
