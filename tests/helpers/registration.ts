import { QueryTypes } from 'sequelize';
import type { RegisterInput } from '#shared/schemas/auth';
import { testDb } from './test-app';
import type { TestAgent } from './test-app';

export interface AccountMail {
  id: number;
  user_id: number | null;
  to_addr: string;
  subject: string;
  text_body: string;
  html_body: string;
  headers_json: string;
}

/**
 * Account mail (sign-up links, "someone tried" notes) queued for an address, oldest first. It is
 * read from the outbox row the request wrote: it has no garden, so a test's own sender (limited
 * to its gardens, as the database is shared by test files) cannot pick it out to deliver.
 */
export async function accountMailFor(email: string): Promise<AccountMail[]> {
  return testDb().sequelize.query<AccountMail>(
    `SELECT id, user_id, to_addr, subject, text_body, html_body, headers_json FROM mail_outbox WHERE kind = 'account' AND to_addr = ? ORDER BY id`,
    { replacements: [email.toLowerCase()], type: QueryTypes.SELECT },
  );
}

export function confirmTokenOf(mail: Pick<AccountMail, 'text_body'>): string {
  const m = /\/register\/confirm\/([A-Za-z0-9_-]{43})(?![A-Za-z0-9_-])/.exec(mail.text_body);
  if (!m) throw new Error(`no confirmation link in: ${mail.text_body}`);
  return m[1];
}

/** Registers, opens the newest link mailed to the address and confirms it: the old one-step sign-up, signed in on `agent`. */
export async function registerAndConfirm(agent: TestAgent, input: RegisterInput) {
  const reg = await agent.post('/api/auth/register').send(input);
  if (reg.status !== 202) throw new Error(`register failed: ${reg.status} ${JSON.stringify(reg.body)}`);
  const mails = await accountMailFor(input.email);
  const last = mails.at(-1);
  if (!last) throw new Error(`no account mail for ${input.email}`);
  return agent.post(`/api/auth/register/confirm/${confirmTokenOf(last)}`).send({});
}
