import { describe, expect, it } from 'vitest';
import { createHmac, randomUUID } from 'node:crypto';
import request from 'supertest';
import { testApp, testDb, agent } from '../helpers/test-app';
import { createUser, PASSWORD, uniqueEmail, signIn } from '../helpers/factories';
import { registerAndConfirm } from '../helpers/registration';
import { User, Session } from '../../server/db/models';
import { hashParams } from '../../server/modules/auth/password';

const app = testApp();

function sidOf(res: { headers: Record<string, unknown> }) {
  const cookies = ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []);
  const c = cookies.find((x) => x.startsWith('heatclock.sid='));
  return c?.split(';')[0];
}

/** The cookie express-session sends for a session id: `s:` + id + `.` + base64 HMAC-SHA256 of the id (cookie-signature), URL-encoded. */
function cookieFor(sid: string) {
  const mac = createHmac('sha256', testDb().config.sessionSecret).update(sid).digest('base64').replace(/=+$/, '');
  return `heatclock.sid=${encodeURIComponent(`s:${sid}.${mac}`)}`;
}

describe('registration and sign-in', () => {
  it('when a grower registers, signs out and signs in again, then me follows each step', async () => {
    const a = agent(app);
    const email = uniqueEmail('reg');
    const reg = await registerAndConfirm(a, { email, password: PASSWORD, name: 'Mara', gardenName: 'Back plot' });
    expect(reg.status).toBe(201);
    expect(reg.body.user).toMatchObject({ email, name: 'Mara' });
    expect(reg.body.garden).toMatchObject({ name: 'Back plot', role: 'owner' });
    expect(reg.body.user).not.toHaveProperty('passwordHash');

    expect((await a.get('/api/auth/me')).body.user.email).toBe(email);
    const gardens = await a.get('/api/gardens');
    expect(gardens.body.gardens).toHaveLength(1);

    expect((await a.post('/api/auth/logout').set('X-Requested-With', 'heatclock')).status).toBe(204);
    const after = await a.get('/api/auth/me');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('unauthenticated');

    await signIn(a, email);
    expect((await a.get('/api/auth/me')).body.user.email).toBe(email);
  });

  it('when a new password is long enough but easy to guess, then registration refuses it under the password field and creates nothing', async () => {
    // Weak ones found by probing the running app; the strength estimate is zxcvbn-ts with its common-password and English lists.
    for (const weak of ['1234567890', 'aaaaaaaaaa', 'password12', ' '.repeat(10), 'heatclock-demo', 'own e-mail']) {
      const email = uniqueEmail('weak');
      const password = weak === 'own e-mail' ? email : weak;
      const res = await agent(app).post('/api/auth/register').send({ email, password, name: 'Mara Quill', gardenName: 'Back plot' });
      expect(res.status, password).toBe(400);
      expect(res.body.error.fields.password, password).toMatch(/^This password is too easy to guess\./);
      expect(await User.count({ where: { email } })).toBe(0);
    }
    const ok = await agent(app).post('/api/auth/register').send({ email: uniqueEmail('strong'), password: 'tomato violin harbour seven', name: 'Mara Quill', gardenName: 'Back plot' });
    expect(ok.status).toBe(202);
  });

  it('when an e-mail is registered twice, then the second answer is the same as the first and no second account is made', async () => {
    const email = uniqueEmail('dup');
    const first = await registerAndConfirm(agent(app), { email, password: PASSWORD, name: 'A', gardenName: 'G' });
    expect(first.status).toBe(201);
    const again = await agent(app)
      .post('/api/auth/register')
      .send({ email: email.toUpperCase(), password: PASSWORD, name: 'B', gardenName: 'H' });
    expect(again.status).toBe(202);
    expect(again.body).toEqual({ status: 'check-email', message: 'Check your e-mail: we sent a link to finish creating your account.' });
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it('when a password is stored, then it is a slow scrypt hash, never the password', async () => {
    const email = uniqueEmail('hash');
    expect((await registerAndConfirm(agent(app), { email, password: PASSWORD, name: 'A', gardenName: 'G' })).status).toBe(201);
    const user = await User.findOne({ where: { email } });
    expect(user!.passwordHash).not.toContain(PASSWORD);
    // OWASP Password Storage Cheat Sheet: scrypt with N ≥ 2^15, r = 8, p ≥ 3 (or the listed equivalents).
    const p = hashParams(user!.passwordHash);
    expect(p.N * p.r * p.p).toBeGreaterThanOrEqual(2 ** 15 * 8 * 3);
  });

  it('when the password is wrong or the e-mail unknown, then both answers are identical', async () => {
    const user = await createUser();
    const wrong = await agent(app).post('/api/auth/login').send({ email: user.email, password: 'not the password' });
    const unknown = await agent(app).post('/api/auth/login').send({ email: uniqueEmail('nobody'), password: 'not the password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    const strip = (b: { error: { requestId?: string } }) => ({ ...b.error, requestId: undefined });
    expect(strip(wrong.body)).toEqual(strip(unknown.body));
  });

  it('when a visitor signs in with a session id planted by someone else, then the id changes and the planted cookie is not signed in', async () => {
    const user = await createUser();
    // The crafted cookie is the real thing: a signed-in session's own id, signed this way, is accepted.
    const real = await agent(app).post('/api/auth/login').send({ email: user.email, password: PASSWORD });
    const realSid = (await Session.findOne({ where: { userId: user.id }, raw: true }))!.sid;
    expect(cookieFor(realSid)).toBe(sidOf(real));
    expect((await request(app).get('/api/auth/me').set('Cookie', cookieFor(realSid))).status).toBe(200);

    // Session fixation: an anonymous session whose id the attacker knows, handed to the victim.
    const planted = `planted-${randomUUID()}`;
    const expires = new Date(Date.now() + 3_600_000);
    await new Promise<void>((resolve, reject) =>
      app.locals.sessions.set(planted, { cookie: { originalMaxAge: 3_600_000, expires, httpOnly: true, path: '/' } }, (err: unknown) => (err instanceof Error ? reject(err) : resolve())),
    );
    const ok = await request(app).post('/api/auth/login').set('Cookie', cookieFor(planted)).send({ email: user.email, password: PASSWORD });
    expect(ok.status).toBe(200);
    const after = sidOf(ok);
    expect(after).toBeDefined();
    expect(after).not.toBe(cookieFor(planted));
    // The planted session was read (and so ended by the rotation), not merely ignored.
    expect(await Session.count({ where: { sid: planted } })).toBe(0);
    expect((await request(app).get('/api/auth/me').set('Cookie', cookieFor(planted))).status).toBe(401);
    expect((await request(app).get('/api/auth/me').set('Cookie', after!)).status).toBe(200);
    expect(String(ok.headers['set-cookie'])).toMatch(/HttpOnly/i);
    expect(String(ok.headers['set-cookie'])).toMatch(/SameSite=Lax/i);
  });

  it('when someone signs in, then the session is stored in MariaDB with the user id, and logout removes it', async () => {
    const user = await createUser();
    const a = agent(app);
    await signIn(a, user.email);
    expect(await Session.count({ where: { userId: user.id } })).toBe(1);
    await a.post('/api/auth/logout').set('X-Requested-With', 'heatclock');
    expect(await Session.count({ where: { userId: user.id } })).toBe(0);
  });

  it('when sign-in fails too often for one e-mail and address, then 429 with Retry-After, even for the right password', async () => {
    const limited = testApp({ loginMaxFailures: 3 });
    const user = await createUser();
    for (let i = 0; i < 3; i++) {
      expect((await agent(limited).post('/api/auth/login').send({ email: user.email, password: 'wrong-password' })).status).toBe(401);
    }
    const blocked = await agent(limited).post('/api/auth/login').send({ email: user.email, password: PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    // Another account from the same address is not locked out.
    const other = await createUser();
    expect((await agent(limited).post('/api/auth/login').send({ email: other.email, password: PASSWORD })).status).toBe(200);
  });

  it('when one address fails sign-ins with many made-up e-mails, or signs up again and again, then it is limited per address as well', async () => {
    // Behind a proxy the address is the X-Forwarded-For one: a fresh invented address per run keeps the shared counts apart.
    const limited = testApp({ trustProxy: 'loopback', loginMaxFailuresPerIp: 4, registerMaxPerIp: 2, registerMaxPerEmail: 100 });
    const ip = `198.51.100.${1 + Math.floor(Math.random() * 250)}`;
    for (let i = 0; i < 4; i++) {
      expect((await agent(limited).post('/api/auth/login').set('X-Forwarded-For', ip).send({ email: uniqueEmail('ghost'), password: 'not the password' })).status).toBe(401);
    }
    const user = await createUser();
    const blocked = await agent(limited).post('/api/auth/login').set('X-Forwarded-For', ip).send({ email: user.email, password: PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/^Too many sign-in attempts from your network\. Try again in \d+ seconds\.$/);
    // Another address is not affected.
    expect((await agent(limited).post('/api/auth/login').set('X-Forwarded-For', '203.0.113.9').send({ email: user.email, password: PASSWORD })).status).toBe(200);

    const signUp = () => agent(limited).post('/api/auth/register').set('X-Forwarded-For', ip).send({ email: uniqueEmail('flood'), password: 'tomato violin harbour seven', name: 'Flood', gardenName: 'Plot' });
    expect((await signUp()).status).toBe(202);
    expect((await signUp()).status).toBe(202);
    const third = await signUp();
    expect(third.status).toBe(429);
    expect(Number(third.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('when more password hashes are asked for at once than the queue holds, then the extra ones get 503 with Retry-After, and the rest finish', async () => {
    // Made-up e-mails cost a hash too (the same time as a wrong password), so they queue with the rest.
    const attempts = await Promise.all(Array.from({ length: 40 }, () => agent(app).post('/api/auth/login').send({ email: uniqueEmail('queue'), password: 'not the password' })));
    const statuses = attempts.map((r) => r.status);
    // 2 hashing and 16 waiting at most (server/modules/auth/password.ts); every other attempt is refused at once.
    expect(statuses.filter((s) => s === 401).length).toBeGreaterThanOrEqual(18);
    const refused = attempts.filter((r) => r.status === 503);
    expect(refused.length).toBeGreaterThan(0);
    for (const r of refused) expect(r.headers['retry-after']).toBe('2');
    expect(statuses.every((s) => s === 401 || s === 503)).toBe(true);
  });

  it('when sessions older than the absolute lifetime come back, then they are signed out', async () => {
    const short = testApp({ sessionAbsoluteMs: 50 });
    const user = await createUser();
    const a = agent(short);
    await signIn(a, user.email);
    await new Promise((r) => setTimeout(r, 80));
    expect((await a.get('/api/auth/me')).status).toBe(401);
  });
});
