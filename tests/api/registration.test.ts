import { describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { agent, testApp, testDb } from '../helpers/test-app';
import { createUser, PASSWORD, signIn, uniqueEmail } from '../helpers/factories';
import { accountMailFor, confirmTokenOf, registerAndConfirm } from '../helpers/registration';
import { Membership, User } from '../../server/db/models';

const app = testApp();
const STRONG = 'tomato violin harbour seven';
const CHECK_EMAIL = { status: 'check-email', message: 'Check your e-mail: we sent a link to finish creating your account.' };

const input = (email: string) => ({ email, password: STRONG, name: 'Mara Quill', gardenName: 'Back plot' });

async function pendingFor(email: string) {
  return testDb().sequelize.query<{ id: number; token_hash: string }>('SELECT id, token_hash FROM pending_registrations WHERE email = ?', {
    replacements: [email],
    type: QueryTypes.SELECT,
  });
}

async function linkFor(email: string) {
  const mails = await accountMailFor(email);
  return confirmTokenOf(mails.at(-1)!);
}

describe('registration by e-mail link', () => {
  it('when a new e-mail registers, then 202 check-email, no account yet, and one mail with a link that creates it and signs in', async () => {
    const email = uniqueEmail('new');
    const a = agent(app);

    const res = await a.post('/api/auth/register').send(input(email));

    expect(res.status).toBe(202);
    expect(res.body).toEqual(CHECK_EMAIL);
    expect(await User.count({ where: { email } })).toBe(0);
    expect((await a.get('/api/auth/me')).status).toBe(401);
    const [mail, ...more] = await accountMailFor(email);
    expect(more).toEqual([]);
    expect(mail.subject).toBe('Finish creating your Heatclock account');
    expect(mail.user_id).toBeNull();
    const token = confirmTokenOf(mail);
    expect(mail.text_body).toContain(`${testDb().config.mail.appUrl}/register/confirm/${token}`);
    expect(mail.text_body).toContain('within 24 hours');
    expect(mail.html_body).toContain(`<a href="${testDb().config.mail.appUrl}/register/confirm/${token}">Finish creating my account</a>`);
    // Only the token's SHA-256 is stored.
    const [pending] = await pendingFor(email);
    expect(pending.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(pending.token_hash).not.toContain(token);

    const done = await a.post(`/api/auth/register/confirm/${token}`).send({});

    expect(done.status).toBe(201);
    expect(done.body.user).toMatchObject({ email, name: 'Mara Quill' });
    expect(done.body.user).not.toHaveProperty('passwordHash');
    expect(done.body.garden).toMatchObject({ name: 'Back plot', role: 'owner' });
    expect(String(done.headers['set-cookie'])).toMatch(/heatclock\.sid=.*HttpOnly/i);
    expect((await a.get('/api/auth/me')).body.user.email).toBe(email);
    const gardens = await a.get('/api/gardens');
    expect(gardens.body.gardens.map((g: { id: number }) => g.id)).toEqual([done.body.garden.id]);
    const user = await User.findOne({ where: { email } });
    expect(await Membership.findAll({ where: { userId: user!.id }, raw: true })).toEqual([
      expect.objectContaining({ userId: user!.id, gardenId: done.body.garden.id, role: 'owner' }),
    ]);
    expect(await pendingFor(email)).toEqual([]);
    // The password chosen at sign-up is the account's.
    await signIn(agent(app), email, STRONG);
  });

  it('when a link is used a second time, then it is refused in words and nothing more is created', async () => {
    const email = uniqueEmail('twice');
    await agent(app).post('/api/auth/register').send(input(email));
    const token = await linkFor(email);
    expect((await agent(app).post(`/api/auth/register/confirm/${token}`).send({})).status).toBe(201);

    const again = agent(app);
    const res = await again.post(`/api/auth/register/confirm/${token}`).send({});

    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('link_invalid');
    expect(res.body.error.message).toMatch(/^This link does not work: it has been used already/);
    expect(await User.count({ where: { email } })).toBe(1);
    expect((await again.get('/api/auth/me')).status).toBe(401);
  });

  it('when the link has expired, then 410 says so and no account is created', async () => {
    const email = uniqueEmail('late');
    await agent(app).post('/api/auth/register').send(input(email));
    const token = await linkFor(email);
    await testDb().sequelize.query('UPDATE pending_registrations SET expires_at = UTC_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE email = ?', { replacements: [email] });

    const a = agent(app);
    const res = await a.post(`/api/auth/register/confirm/${token}`).send({});

    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('link_expired');
    expect(res.body.error.message).toMatch(/expired.*24 hours.*Register again/);
    expect(await User.count({ where: { email } })).toBe(0);
    expect((await a.get('/api/auth/me')).status).toBe(401);
  });

  it('when a link is forged or malformed, then it is refused and nobody is signed in', async () => {
    for (const token of [randomBytes(32).toString('base64url'), 'short', 'x'.repeat(200), `${'A'.repeat(42)}%2F`]) {
      const a = agent(app);
      const res = await a.post(`/api/auth/register/confirm/${token}`).send({});
      expect(res.status, token).toBe(400);
      expect(res.body.error.code, token).toBe('link_invalid');
      expect((await a.get('/api/auth/me')).status).toBe(401);
    }
  });

  it('when the e-mail already has an account, then the answer is the same, nothing is created, and the owner is told by e-mail', async () => {
    const owner = await createUser({ name: 'Ida Furrow' });
    const freshEmail = uniqueEmail('fresh');

    const known = await agent(app).post('/api/auth/register').send({ ...input(owner.email.toUpperCase()), name: 'Someone Else' });
    const fresh = await agent(app).post('/api/auth/register').send(input(freshEmail));

    expect(known.status).toBe(202);
    expect(fresh.status).toBe(202);
    expect(known.body).toEqual(fresh.body);
    expect(known.body).toEqual(CHECK_EMAIL);
    expect(Object.keys(known.headers).sort()).toEqual(Object.keys(fresh.headers).sort());
    // Nothing is created for either (other test files create users at the same time: count by address).
    expect(await User.count({ where: { email: freshEmail } })).toBe(0);
    expect(await User.count({ where: { email: owner.email } })).toBe(1);
    expect(await pendingFor(owner.email)).toEqual([]);
    const [mail, ...more] = await accountMailFor(owner.email);
    expect(more).toEqual([]);
    expect(mail.subject).toBe('Someone tried to create a Heatclock account with your e-mail');
    expect(mail.user_id).toBe(owner.id);
    expect(mail.text_body).toContain('Hello Ida Furrow,');
    expect(mail.text_body).toContain(`${testDb().config.mail.appUrl}/sign-in`);
    expect(mail.text_body).toMatch(/If it was not you, you can ignore this e-mail/);
    expect(mail.text_body).not.toContain('/register/confirm/');
    expect(mail.text_body).not.toContain('Someone Else');
    // The account is untouched: the old password still signs in.
    await signIn(agent(app), owner.email, PASSWORD);
  });

  it('when the address gets an account while its link waits, then the link answers 409 and points to sign-in', async () => {
    const email = uniqueEmail('meanwhile');
    await agent(app).post('/api/auth/register').send(input(email));
    const token = await linkFor(email);
    await createUser({ email });

    const a = agent(app);
    const res = await a.post(`/api/auth/register/confirm/${token}`).send({});

    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('email_taken');
    expect(res.body.error.message).toMatch(/already exists.*Sign in instead/);
    expect(await User.count({ where: { email } })).toBe(1);
    expect((await a.get('/api/auth/me')).status).toBe(401);
    expect(await pendingFor(email)).toEqual([]);
  });

  it('when the same e-mail registers again before confirming, then only the newest link works', async () => {
    const email = uniqueEmail('again');
    await agent(app).post('/api/auth/register').send(input(email));
    const first = await linkFor(email);
    await agent(app).post('/api/auth/register').send({ ...input(email), gardenName: 'Front beds' });
    const second = await linkFor(email);
    expect(second).not.toBe(first);
    expect(await pendingFor(email)).toHaveLength(1);

    expect((await agent(app).post(`/api/auth/register/confirm/${first}`).send({})).status).toBe(400);
    const ok = await agent(app).post(`/api/auth/register/confirm/${second}`).send({});
    expect(ok.status).toBe(201);
    expect(ok.body.garden.name).toBe('Front beds');
  });

  it('when the password is weak or a field is missing, then 400 names the field and nothing is stored or mailed', async () => {
    const email = uniqueEmail('weak');
    const weak = await agent(app).post('/api/auth/register').send({ ...input(email), password: 'password12' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.password).toMatch(/^This password is too easy to guess\./);
    const missing = await agent(app).post('/api/auth/register').send({ email, password: STRONG, name: 'Mara' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.gardenName).toMatch(/required/);
    expect(await pendingFor(email)).toEqual([]);
    expect(await accountMailFor(email)).toEqual([]);
  });

  it('when the helper registers and confirms, then the agent is signed in as the new owner', async () => {
    const a = agent(app);
    const email = uniqueEmail('helper');
    const res = await registerAndConfirm(a, input(email));
    expect(res.status).toBe(201);
    expect((await a.get('/api/auth/me')).body.user.email).toBe(email);
  });
});
