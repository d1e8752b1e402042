import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { AlertSeverity, AlertType } from '#shared/schemas/alerts';
import type { MailAlert, MailContent, MailContext } from './mail-content';
import { mailSettings } from './mail-settings';
import { ensureNonce } from './preferences.repository';
import { signUnsubscribe } from './unsubscribe-token';
import { mailQueued } from './mail-sender';

export interface Recipient {
  userId: number;
  email: string;
  name: string;
}

export interface StoredAlert extends MailAlert {
  id: number;
  updatedAt: string;
}

interface AlertRow {
  id: number;
  type: AlertType;
  severity: AlertSeverity;
  subject: string;
  title: string;
  reasonsJson: string;
  action: string;
  caution: string | null;
  firstOn: string;
  endsOn: string | null;
  updatedAt: Date;
}

/**
 * Alerts for messages, oldest first: given ids, those not resolved (a worsened alert that was
 * acknowledged is news again); without ids, every open one (a digest's list).
 */
export async function readAlerts(db: Sequelize, gardenIds: number[], ids: number[] | null, transaction?: Transaction) {
  const rows = await db.query<AlertRow & { gardenId: number }>(
    `SELECT id, garden_id AS gardenId, type, severity, subject, title, reasons_json AS reasonsJson, action, caution,
            first_on AS firstOn, ends_on AS endsOn, updated_at AS updatedAt
       FROM alerts WHERE garden_id IN (?) AND ${ids ? "status <> 'resolved' AND id IN (?)" : "status = 'open'"}
      ORDER BY first_on, id`,
    { replacements: ids ? [gardenIds, ids] : [gardenIds], type: QueryTypes.SELECT, transaction },
  );
  return rows.map((r) => ({
    gardenId: r.gardenId,
    alert: { ...r, reasons: JSON.parse(r.reasonsJson) as string[], updatedAt: new Date(r.updatedAt).toISOString() },
  }));
}

/** Links for one member and garden; the unsubscribe link carries the member's current nonce. */
export async function contextFor(db: Sequelize, r: Recipient, garden: { id: number; name: string }, transaction: Transaction) {
  const { appUrl, unsubscribeKey } = mailSettings();
  const nonce = await ensureNonce(db, r.userId, garden.id, transaction);
  const ctx: MailContext = {
    memberName: r.name,
    gardenName: garden.name,
    gardenUrl: `${appUrl}/g/${garden.id}`,
    settingsUrl: `${appUrl}/g/${garden.id}/settings#email`,
    unsubscribeUrl: `${appUrl}/unsubscribe/${signUnsubscribe(unsubscribeKey, { userId: r.userId, gardenId: garden.id, nonce })}`,
  };
  return ctx;
}

/**
 * One outbox row, unless its dedupe key exists (a re-run or another instance queued it): true
 * when this call added it. The sender is told after commit, so mail goes out without waiting a poll.
 */
export async function queueMessage(
  db: Sequelize,
  transaction: Transaction,
  m: { userId: number; gardenId: number; kind: 'alert' | 'digest'; dedupeKey: string; to: string; content: MailContent; ctx: MailContext },
): Promise<boolean> {
  // RFC 8058: a one-click POST to the same link the footer shows.
  const headers = { 'List-Unsubscribe': `<${m.ctx.unsubscribeUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' };
  const [, affected] = await db.query(
    `INSERT IGNORE INTO mail_outbox (user_id, garden_id, kind, dedupe_key, to_addr, subject, text_body, html_body, headers_json, status, attempts, run_after, created_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, 'pending', 0, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`,
    {
      replacements: [m.userId, m.gardenId, m.kind, m.dedupeKey, m.to, m.content.subject.slice(0, 300), m.content.text, m.content.html, JSON.stringify(headers)],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
  if (affected === 1) transaction.afterCommit(mailQueued);
  return affected === 1;
}
