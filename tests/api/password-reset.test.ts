import { describe, expect, it, vi } from 'vitest';
import { QueryTypes } from 'sequelize';
import { agent, testApp, testDb } from '../helpers/test-app';
import { createUser, PASSWORD, signIn, uniqueEmail } from '../helpers/factories';
import { accountMailFor } from '../helpers/registration';
import type { AccountMail } from '../helpers/registration';

const app = testApp();
const NEW_PASSWORD = 'lantern otter quarry maple';

function resetTokenOf(mail: Pick<AccountMail, 'text_body'>): string {
  const m = /\/reset-password\/([A-Za-z0-9_-]{43})(?![A-Za-z0-9_-])/.exec(mail.text_body);
  if (!m) throw new Error(`no reset link in: ${mail.text_body}`);
  return m[1];
}

async function requestReset(email: string) {
  return agent(app).post('/api/auth/password-reset').send({ email });
}

async function resetLinkFor(email: string) {
  const res = await requestReset(email);
  expect(res.status).toBe(202);
  const mails = (await accountMailFor(email)).filter((m) => m.subject === 'Choose a new Heatclock password');
  return resetTokenOf(mails.at(-1)!);
}

describe('password reset by e-mail link', () => {
  it('when a grower asks for a reset, then a 1-hour link is mailed, only its hash is stored, and it sets the new password', async () => {
    const user = await createUser();

    const res = await requestReset(user.email);

    expect(res.status).toBe(202);
    const [mail, ...more] = await accountMailFor(user.email);
    expect(more).toEqual([]);
    expect(mail.subject).toBe('Choose a new Heatclock password');
    expect(mail.user_id).toBe(user.id);
    const token = resetTokenOf(mail);
    expect(mail.text_body).toContain(`${testDb().config.mail.appUrl}/reset-password/${token}`);
    expect(mail.text_body).toContain('within 1 hour');
    const rows = await testDb().sequelize.query<{ token_hash: string }>('SELECT token_hash FROM account_tokens WHERE user_id = ?', {
      replacements: [user.id],
      type: QueryTypes.SELECT,
    });
    expect(rows).toHaveLength(1);
    expect(rows[0].token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(rows[0].token_hash).not.toContain(token);
    expect((await agent(app).get(`/api/auth/password-reset/${token}`)).body).toEqual({ status: 'usable' });

    const done = await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD });

    expect(done.status).toBe(200);
    expect(done.body.status).toBe('password-changed');
    await signIn(agent(app), user.email, NEW_PASSWORD);
    const old = await agent(app).post('/api/auth/login').send({ email: user.email, password: PASSWORD });
    expect(old.status).toBe(401);
    expect((await accountMailFor(user.email)).map((m) => m.subject)).toContain('Your Heatclock password was changed');
  });

  it('when the password is reset, then every session signed in before is refused with 401', async () => {
    const user = await createUser();
    const phone = agent(app);
    const laptop = agent(app);
    await signIn(phone, user.email);
    await signIn(laptop, user.email);
    const token = await resetLinkFor(user.email);

    expect((await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD })).status).toBe(200);

    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await laptop.get('/api/gardens')).status).toBe(401);
  });

  it('when an e-mail has no account, then the answer is identical to one that has, and no mail or link is made', async () => {
    const user = await createUser();
    const unknown = uniqueEmail('nobody');

    const known = await requestReset(user.email);
    const stranger = await requestReset(unknown);

    expect(stranger.status).toBe(known.status);
    expect(stranger.body).toEqual(known.body);
    expect(stranger.headers['content-type']).toBe(known.headers['content-type']);
    expect(stranger.headers['content-length']).toBe(known.headers['content-length']);
    expect(await accountMailFor(unknown)).toEqual([]);
    expect((await accountMailFor(user.email)).length).toBe(1);
  });

  it('when an e-mail has no account, then the request runs the very same statements as for one that has (no early return to time)', async () => {
    const user = await createUser();
    const statementsOf = async (email: string) => {
      const spy = vi.spyOn(testDb().sequelize, 'query');
      try {
        expect((await requestReset(email)).status).toBe(202);
        return spy.mock.calls.map(([sql]) => String(sql).replace(/\s+/g, ' '));
      } finally {
        spy.mockRestore();
      }
    };

    const known = await statementsOf(user.email);
    const unknown = await statementsOf(uniqueEmail('nobody'));

    expect(unknown).toEqual(known);
    expect(known.filter((sql) => /account_tokens|mail_outbox/.test(sql))).toHaveLength(4);
  });

  it('when a link is used a second time, then 410 in words and the password stays the one set first', async () => {
    const user = await createUser();
    const token = await resetLinkFor(user.email);
    expect((await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD })).status).toBe(200);

    const again = await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: 'another fine long phrase' });

    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('link_used');
    expect(again.body.error.message).toMatch(/used already/);
    expect((await agent(app).get(`/api/auth/password-reset/${token}`)).status).toBe(410);
    await signIn(agent(app), user.email, NEW_PASSWORD);
  });

  it('when a link is older than an hour, then 410 "expired" and nothing changes', async () => {
    const user = await createUser();
    const token = await resetLinkFor(user.email);
    await testDb().sequelize.query('UPDATE account_tokens SET expires_at = UTC_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE user_id = ?', { replacements: [user.id] });

    const res = await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD });

    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('link_expired');
    expect(res.body.error.message).toContain('1 hour');
    await signIn(agent(app), user.email, PASSWORD);
  });

  it('when a link is unknown, malformed or replaced by a newer one, then 404 in words, never a 500', async () => {
    const user = await createUser();
    const first = await resetLinkFor(user.email);
    const second = await resetLinkFor(user.email);

    for (const token of [first, 'A'.repeat(43), 'short', `${second}x`]) {
      const res = await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD });
      expect(res.status, token).toBe(404);
      expect(res.body.error.code).toBe('link_invalid');
    }
    expect((await agent(app).post(`/api/auth/password-reset/${second}`).send({ password: NEW_PASSWORD })).status).toBe(200);
  });

  it('when the new password is easy to guess, then 400 under the password field and the link still works', async () => {
    const user = await createUser();
    const token = await resetLinkFor(user.email);

    const weak = await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: 'password1234' });
    const short = await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: 'short' });

    expect(weak.status).toBe(400);
    expect(Object.keys(weak.body.error.fields)).toEqual(['password']);
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/at least 10/);
    expect((await agent(app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD })).status).toBe(200);
  });

  it('when one e-mail asks for resets too often, then 429 with Retry-After, the same for an e-mail without an account', async () => {
    const limited = testApp({ passwordResetMaxPerEmail: 2 });
    const user = await createUser();
    const unknown = uniqueEmail('nobody');
    for (const email of [user.email, unknown]) {
      for (let i = 0; i < 2; i++) expect((await agent(limited).post('/api/auth/password-reset').send({ email })).status).toBe(202);
      const res = await agent(limited).post('/api/auth/password-reset').send({ email });
      expect(res.status).toBe(429);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      expect(res.body.error.code).toBe('rate_limited');
    }
  });

  it('when the e-mail field is missing or malformed, then 400 names the email field', async () => {
    const res = await agent(app).post('/api/auth/password-reset').send({ email: uniqueEmail('malformed').replace('@', '-at-') });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['email']);
  });
});
