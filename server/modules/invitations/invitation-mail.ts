/**
 * The invitation e-mail. The garden's and the inviter's names are typed by an owner, so they are
 * escaped in the HTML; the subject names the garden so the invitee knows what it is about.
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { Role } from '#shared/schemas/gardens';
import { INVITATION_DAYS } from '#shared/schemas/invitations';
import { esc, mailPage } from '../notifications/mail-content';
import type { MailContent } from '../notifications/mail-content';
import { mailSettings } from '../notifications/mail-settings';
import { mailQueued } from '../notifications/mail-sender';

/** Names the invitation a message carries, so the local test mailbox can find its copy. */
export const INVITATION_HEADER = 'X-Heatclock-Invitation';

export const ROLE_MEANING: Record<Role, string> = {
  owner: 'an owner: you can change the garden’s settings, invite people and change their roles',
  grower: 'a grower: you can add and change plantings, varieties, beds and seed lots',
  viewer: 'a viewer: you can look at everything in the garden but not change it',
};

export const invitationUrlFor = (token: string) => `${mailSettings().appUrl}/invitations/${token}`;

export const invitationSubject = (gardenName: string) => `You are invited to the garden “${gardenName}” on Heatclock`;

export function renderInvitationMail(m: { gardenName: string; inviterName: string; role: Role; url: string }): MailContent {
  const subject = invitationSubject(m.gardenName);
  const intro = `${m.inviterName} invited you to join the garden “${m.gardenName}” on Heatclock as ${ROLE_MEANING[m.role]}.`;
  const act = `To join, open this link within ${INVITATION_DAYS} days. It works once:`;
  const ignore = 'If you do not want to join, ignore this e-mail: nothing happens and the link stops working by itself.';
  return {
    subject,
    text: ['Hello,', '', intro, '', act, m.url, '', ignore].join('\n'),
    html: mailPage(
      subject,
      [
        'Hello,',
        esc(intro),
        `${esc(act)}<br><a href="${esc(m.url)}">Open the invitation</a>`,
        `If the link does not open, copy this address into your browser: ${esc(m.url)}`,
        esc(ignore),
      ].map((p) => `<p>${p}</p>`),
    ),
  };
}

/**
 * One outbox row in the caller's transaction, as account mail (no unsubscribe: it is not about
 * alerts) but under the garden, so a message that keeps failing shows on the owner's failed-mail
 * list. The sender is told after commit.
 */
export async function queueInvitationMail(db: Sequelize, transaction: Transaction, m: { gardenId: number; invitationId: number; userId: number | null; to: string; content: MailContent }) {
  await db.query(
    `INSERT INTO mail_outbox (user_id, garden_id, kind, dedupe_key, to_addr, subject, text_body, html_body, headers_json, status, attempts, run_after, created_at)
     VALUES (?, ?, 'account', ?, ?, ?, ?, ?, ?, 'pending', 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`,
    {
      replacements: [m.userId, m.gardenId, `invitation:${m.invitationId}`, m.to, m.content.subject, m.content.text, m.content.html, JSON.stringify({ [INVITATION_HEADER]: String(m.invitationId) })],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
  transaction.afterCommit(mailQueued);
}
