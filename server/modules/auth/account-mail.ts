/**
 * Mail about an account itself (not about a garden): the link that finishes a sign-up, and the
 * note to an address that already has an account. Both are queued in the mail outbox in the
 * request's own transaction, so either answer does the same work and the sender delivers them
 * later with its retries. Nothing a visitor typed is put in these messages except the address
 * they go to, so the sign-up form cannot be used to mail someone else words of its choosing.
 */
import { esc, mailPage } from '../notifications/mail-content';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { MailContent } from '../notifications/mail-content';
import { mailSettings } from '../notifications/mail-settings';
import { mailQueued } from '../notifications/mail-sender';

export const FINISH_SUBJECT = 'Finish creating your Heatclock account';
export const EXISTING_SUBJECT = 'Someone tried to create a Heatclock account with your e-mail';
export const LINK_HOURS = 24;

const page = (subject: string, paragraphs: string[]) => mailPage(subject, paragraphs.map((p) => `<p>${p}</p>`));

export function renderFinishMail(email: string, confirmUrl: string): MailContent {
  const intro = `You, or someone using your address, asked to create a Heatclock account for ${email}.`;
  const act = `To finish, open this link within ${LINK_HOURS} hours. It works once:`;
  const ignore = 'If you did not ask for an account, ignore this e-mail: no account is created and the link stops working by itself.';
  return {
    subject: FINISH_SUBJECT,
    text: ['Hello,', '', intro, '', act, confirmUrl, '', ignore].join('\n'),
    html: page(FINISH_SUBJECT, [
      'Hello,',
      esc(intro),
      `${esc(act)}<br><a href="${esc(confirmUrl)}">Finish creating my account</a>`,
      `If the link does not open, copy this address into your browser: ${esc(confirmUrl)}`,
      esc(ignore),
    ]),
  };
}

export function renderExistingAccountMail(name: string, email: string, signInUrl: string): MailContent {
  const intro = `Someone just tried to create a new Heatclock account with ${email}. This address already has an account, so nothing was created or changed.`;
  const mine = 'If it was you, there is no need for a second account: sign in with your e-mail and password:';
  const notMine = 'If it was not you, you can ignore this e-mail. Your account and your gardens are as they were.';
  return {
    subject: EXISTING_SUBJECT,
    text: [`Hello ${name},`, '', intro, '', mine, signInUrl, '', notMine].join('\n'),
    html: page(EXISTING_SUBJECT, [`Hello ${esc(name)},`, esc(intro), `${esc(mine)}<br><a href="${esc(signInUrl)}">Sign in to Heatclock</a>`, esc(notMine)]),
  };
}

export const confirmUrlFor = (token: string) => `${mailSettings().appUrl}/register/confirm/${token}`;
export const signInUrl = () => `${mailSettings().appUrl}/sign-in`;

/** One outbox row (kind 'account', no garden); the sender is told after commit. */
export async function queueAccountMail(db: Sequelize, transaction: Transaction, m: { userId: number | null; to: string; content: MailContent }) {
  await db.query(
    `INSERT INTO mail_outbox (user_id, garden_id, kind, dedupe_key, to_addr, subject, text_body, html_body, headers_json, status, attempts, run_after, created_at)
     VALUES (?, NULL, 'account', ?, ?, ?, ?, ?, '{}', 'pending', 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`,
    {
      replacements: [m.userId, `account:${randomUUID()}`, m.to, m.content.subject, m.content.text, m.content.html],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
  transaction.afterCommit(mailQueued);
}
