/**
 * Sends the mail outbox. Any number of instances run one: a row is claimed by a conditional
 * UPDATE of its lease and the affected-row count decides who won (SKIP LOCKED and GET_LOCK are
 * node-local on Galera). A row is marked sent right after the server's 250 reply; a crash in
 * between leaves it 'sending' until its lease runs out and it is sent again (at least once, with
 * the same Message-ID, is the best SMTP allows). The claim counts the attempt, so a message that
 * keeps failing stops after maxAttempts as 'failed' with its last error.
 */
import { hostname } from 'node:os';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { Logger } from '../../lib/logger';
import { createPollingLoop } from '../../lib/polling-loop';
import type { MailTransport } from '../../integrations/mail/transport';

export interface MailSender {
  /** Polls every pollMs until stop(); also woken after a message is queued in this process. */
  start(): void;
  stop(): Promise<void>;
  kick(): void;
  /** Sends everything due now and resolves when nothing due is left (tests, the demo). */
  drain(): Promise<void>;
}

export interface MailSenderOptions {
  sequelize: Sequelize;
  transport: MailTransport;
  logger: Logger;
  pollMs?: number;
  /** Longer than the transport's timeouts together, so a live send never loses its lease. */
  leaseMs?: number;
  /** First retry delay; doubles per attempt up to maxBackoffMs. */
  backoffMs?: number;
  maxBackoffMs?: number;
  maxAttempts?: number;
  /** Only these gardens' messages: drills and tests share one database with other senders. */
  onlyGardens?: number[];
}

interface Claimed {
  id: number;
  toAddr: string;
  subject: string;
  textBody: string;
  htmlBody: string;
  headersJson: string;
  attempts: number;
  createdAt: Date;
  token: string;
}

const started = new Set<MailSender>();

/** Called after a commit that queued mail: this process's senders look at once instead of at the next poll. */
export function mailQueued(): void {
  for (const s of started) s.kick();
}

const DUE = `status IN ('pending', 'sending') AND run_after <= UTC_TIMESTAMP(3) AND (lease_until IS NULL OR lease_until < UTC_TIMESTAMP(3))`;

export function createMailSender(opts: MailSenderOptions): MailSender {
  const { sequelize: db, transport, logger } = opts;
  const pollMs = opts.pollMs ?? 2_000;
  const leaseMs = opts.leaseMs ?? 120_000;
  const backoffMs = opts.backoffMs ?? 30_000;
  const maxBackoffMs = opts.maxBackoffMs ?? 6 * 3_600_000;
  const maxAttempts = opts.maxAttempts ?? 5;
  const instance = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;

  async function claim(): Promise<Claimed | null> {
    const scope = opts.onlyGardens ? 'AND garden_id IN (?)' : '';
    const candidates = await db.query<{ id: number }>(`SELECT id FROM mail_outbox WHERE ${DUE} ${scope} ORDER BY run_after, id LIMIT 20`, {
      replacements: opts.onlyGardens ? [opts.onlyGardens] : [],
      type: QueryTypes.SELECT,
    });
    for (const { id } of candidates) {
      const token = `${instance}:${randomUUID().slice(0, 8)}`;
      const [, won] = await db.query(
        `UPDATE mail_outbox SET status = 'sending', attempts = attempts + 1, lease_owner = ?,
           lease_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND WHERE id = ? AND ${DUE}`,
        { replacements: [token, leaseMs * 1000, id], type: QueryTypes.UPDATE },
      );
      if (won !== 1) continue;
      const [row] = await db.query<Omit<Claimed, 'token'>>(
        `SELECT id, to_addr AS toAddr, subject, text_body AS textBody, html_body AS htmlBody, headers_json AS headersJson,
                attempts, created_at AS createdAt FROM mail_outbox WHERE id = ? AND lease_owner = ?`,
        { replacements: [id, token], type: QueryTypes.SELECT },
      );
      if (row) return { ...row, token };
    }
    return null;
  }

  async function markSent(m: Claimed) {
    // The message is out: a lost database here would mean a resend, so try a few times quickly.
    for (let attempt = 1; ; attempt++) {
      try {
        await db.query(
          `UPDATE mail_outbox SET status = 'sent', sent_at = UTC_TIMESTAMP(3), last_error = NULL, lease_owner = NULL, lease_until = NULL
            WHERE id = ? AND lease_owner = ?`,
          { replacements: [m.id, m.token] },
        );
        return;
      } catch (err) {
        if (attempt >= 5) throw err;
        await new Promise((r) => setTimeout(r, 100 * attempt));
      }
    }
  }

  async function markFailed(m: Claimed, error: Error) {
    const final = m.attempts >= maxAttempts;
    const delayMs = Math.min(maxBackoffMs, backoffMs * 2 ** (m.attempts - 1));
    await db.query(
      `UPDATE mail_outbox SET status = ?, last_error = ?, run_after = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND,
         lease_owner = NULL, lease_until = NULL WHERE id = ? AND lease_owner = ?`,
      { replacements: [final ? 'failed' : 'pending', error.message.slice(0, 1000), final ? 0 : delayMs * 1000, m.id, m.token] },
    );
    logger.warn('mail not sent', { outboxId: m.id, attempts: m.attempts, final, error: error.message });
  }

  async function sendOne(): Promise<boolean> {
    const m = await claim();
    if (!m) return false;
    try {
      await transport.send({
        to: m.toAddr,
        subject: m.subject,
        text: m.textBody,
        html: m.htmlBody,
        headers: JSON.parse(m.headersJson) as Record<string, string>,
        messageId: `<outbox.${m.id}.${new Date(m.createdAt).getTime()}@heatclock>`,
      });
    } catch (err) {
      await markFailed(m, err instanceof Error ? err : new Error(String(err)));
      return true;
    }
    await markSent(m);
    return true;
  }

  const loop = createPollingLoop({ step: sendOne, pollMs, logger, name: 'mail sender' });
  const sender: MailSender = {
    ...loop,
    start() {
      started.add(sender);
      loop.start();
    },
    async stop() {
      started.delete(sender);
      await loop.stop();
    },
  };
  return sender;
}
