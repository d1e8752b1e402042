import nodemailer from 'nodemailer';
import type { MailConfig } from '../../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  headers: Record<string, string>;
  /** The same id on every attempt, so a receiver can tell a resend after a crash from a new message. */
  messageId: string;
}

export interface MailTransport {
  /** True while messages go to the in-process fake (the dev mailbox may show them). */
  readonly isLocalFake: boolean;
  /** Resolves once the server has answered 250 to the message. */
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

// A server that does not answer must fail this attempt quickly; the outbox retries later.
const TIMEOUTS = { connectionTimeout: 5_000, greetingTimeout: 5_000, socketTimeout: 20_000 };

export function createMailTransport(mail: MailConfig): MailTransport {
  const transporter =
    mail.mode === 'smtp'
      ? nodemailer.createTransport({ url: mail.smtpUrl!, ...TIMEOUTS })
      : nodemailer.createTransport({ host: '127.0.0.1', port: mail.fakePort, secure: false, ignoreTLS: true, ...TIMEOUTS });
  return {
    isLocalFake: mail.mode === 'fake',
    async send(m) {
      await transporter.sendMail({ from: mail.from, to: m.to, subject: m.subject, text: m.text, html: m.html, headers: m.headers, messageId: m.messageId });
    },
    close: () => transporter.close(),
  };
}
