import { describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { testApp, agent } from '../helpers/test-app';
import { addMember, createGarden, createUser, PASSWORD, signIn } from '../helpers/factories';
import { Session } from '../../server/db/models';
import { TOUCH_EVERY_MS } from '../../server/modules/auth/session-store';

const app = testApp();

async function rowOf(userId: number) {
  const s = await Session.findOne({ where: { userId }, raw: true });
  if (!s) throw new Error('no session row');
  return s;
}

/** Counts the statements that write the sessions table while `run` runs (this file's app only). */
async function sessionWritesDuring(run: () => Promise<void>): Promise<number> {
  const db = Session.sequelize!;
  const spy = vi.spyOn(db, 'query');
  try {
    await run();
    return spy.mock.calls.filter(([sql]) => /^\s*(INSERT|UPDATE|DELETE|REPLACE)\b[\s\S]*\bsessions\b/i.test(String(sql))).length;
  } finally {
    spy.mockRestore();
  }
}

function setCookieLine(res: { headers: Record<string, unknown> }) {
  return ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('heatclock.sid='));
}

function cookieOf(res: { headers: Record<string, unknown> }) {
  const cookies = ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []);
  return cookies.find((c) => c.startsWith('heatclock.sid='))!.split(';')[0];
}

describe('sessions', () => {
  it('when a signed-in grower makes plain reads, then the session row is not rewritten', async () => {
    const user = await createUser();
    const a = agent(app);
    await signIn(a, user.email);
    const before = await rowOf(user.id);
    const writes = await sessionWritesDuring(async () => {
      for (let i = 0; i < 15; i++) {
        const res = await a.get(i % 2 ? '/api/auth/me' : '/api/gardens');
        expect(res.status).toBe(200);
      }
    });
    expect(writes).toBe(0);
    const after = await rowOf(user.id);
    expect(after.updatedAt).toEqual(before.updatedAt);
    expect(after.expires).toEqual(before.expires);
    expect(after.data).toBe(before.data);
  });

  it('when a garden page is read again, then the whole request is one database read: the session brings the member’s access', async () => {
    const user = await createUser();
    const garden = await createGarden();
    await addMember(user.id, garden.id, 'viewer');
    const a = agent(app);
    await signIn(a, user.email);
    expect((await a.get(`/api/gardens/${garden.id}/plantings`)).status).toBe(200);
    const db = Session.sequelize!;
    const spy = vi.spyOn(db, 'query');
    try {
      expect((await a.get(`/api/gardens/${garden.id}/plantings`)).status).toBe(200);
      expect(spy.mock.calls.map(([sql]) => String(sql).replace(/\s+/g, ' ').slice(0, 60))).toEqual([expect.stringMatching(/^SELECT s\.data, s\.expires/)]);
    } finally {
      spy.mockRestore();
    }
    // Demoted to nothing: the very next request, still one read, is refused.
    await db.query('DELETE FROM memberships WHERE user_id = ? AND garden_id = ?', { replacements: [user.id, garden.id] });
    expect((await a.get(`/api/gardens/${garden.id}/plantings`)).status).toBe(404);
  });

  it('when the stored expiry is older than the touch interval, then one read moves it forward once', async () => {
    const user = await createUser();
    const a = agent(app);
    await signIn(a, user.email);
    const aged = new Date(Date.now() + 60_000);
    await Session.update({ expires: aged }, { where: { userId: user.id } });
    const writes = await sessionWritesDuring(async () => {
      for (let i = 0; i < 5; i++) expect((await a.get('/api/auth/me')).status).toBe(200);
    });
    expect(writes).toBe(1);
    const moved = await rowOf(user.id);
    expect(moved.expires!.getTime()).toBeGreaterThan(aged.getTime() + TOUCH_EVERY_MS);
  });

  it('when a session is signed out on another instance, then this instance refuses it on the very next request', async () => {
    const other = testApp();
    const user = await createUser();
    const a = agent(app);
    const cookie = cookieOf(await signIn(a, user.email));
    expect((await a.get('/api/auth/me')).status).toBe(200);
    const out = await request(other).post('/api/auth/logout').set('Cookie', cookie).set('X-Requested-With', 'heatclock');
    expect(out.status).toBe(204);
    const next = await a.get('/api/auth/me');
    expect(next.status).toBe(401);
    expect(next.body.error.code).toBe('unauthenticated');
  });

  it('when a session row is revoked directly (all sessions of the user), then the next request is refused', async () => {
    const user = await createUser();
    const a = agent(app);
    await signIn(a, user.email);
    expect((await a.get('/api/gardens')).status).toBe(200);
    await app.locals.sessions.endAllFor(user.id);
    expect((await a.get('/api/gardens')).status).toBe(401);
  });

  it('when a user’s sessions are revoked while one of their requests is still running, then that request cannot write the session back to life', async () => {
    const user = await createUser();
    const a = agent(app);
    await signIn(a, user.email);
    const sid = (await rowOf(user.id)).sid;
    const store = app.locals.sessions;
    const loaded = await new Promise<Record<string, unknown>>((resolve, reject) => store.get(sid, (err: unknown, s: Record<string, unknown>) => (err ? reject(err) : resolve(s))));
    await store.endAllFor(user.id);
    // The in-flight request saves its (changed) session and touches it, as express-session would.
    const later = { ...loaded, cookie: { ...(loaded.cookie as object), expires: new Date(Date.now() + 3_600_000).toISOString() }, note: 'changed' };
    await new Promise<void>((resolve, reject) => store.set(sid, later, (err: unknown) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve, reject) => store.touch(sid, later, (err: unknown) => (err ? reject(err) : resolve())));
    expect((await rowOf(user.id)).expires!.getTime()).toBeLessThan(Date.now());
    expect((await a.get('/api/auth/me')).status).toBe(401);
  });

  it('when a session has expired in the store, then it is refused even if the cookie is still sent', async () => {
    const user = await createUser();
    const a = agent(app);
    await signIn(a, user.email);
    await Session.update({ expires: new Date(Date.now() - 1000) }, { where: { userId: user.id } });
    expect((await a.get('/api/auth/me')).status).toBe(401);
  });

  it('when a session is left idle longer than the idle timeout, then its next request is refused', async () => {
    const idleMs = 1500;
    const idle = testApp({ sessionIdleMs: idleMs });
    const user = await createUser();
    // Sent by hand: a cookie jar would drop the cookie at its Max-Age, and the server must refuse it on its own.
    const cookie = cookieOf(await signIn(agent(idle), user.email));
    expect((await request(idle).get('/api/auth/me').set('Cookie', cookie)).status).toBe(200);
    await new Promise((resolve) => setTimeout(resolve, idleMs + 500));
    const late = await request(idle).get('/api/auth/me').set('Cookie', cookie);
    expect(late.status).toBe(401);
    expect(late.body.error.code).toBe('unauthenticated');
  });

  it('when secure cookies are on behind a trusted proxy and the proxy says HTTPS, then the cookie is Secure, HttpOnly and SameSite=Lax and works', async () => {
    const proxied = testApp({ trustProxy: 'loopback', cookieSecure: true });
    const user = await createUser();
    const res = await request(proxied).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send({ email: user.email, password: PASSWORD });
    expect(res.status).toBe(200);
    const line = setCookieLine(res);
    expect(line).toBeDefined();
    const attrs = line!.split(';').map((a) => a.trim().toLowerCase());
    expect(attrs).toContain('secure');
    expect(attrs).toContain('httponly');
    expect(attrs).toContain('samesite=lax');
    expect(attrs).toContain('path=/');
    const me = await request(proxied).get('/api/auth/me').set('X-Forwarded-Proto', 'https').set('Cookie', line!.split(';')[0]);
    expect(me.status).toBe(200);
    expect(me.body.user.id).toBe(user.id);
  });

  it('when secure cookies are on and the request is plain HTTP (no proxy header, or one from an untrusted client), then no session cookie is sent at all', async () => {
    const user = await createUser();
    const proxied = testApp({ trustProxy: 'loopback', cookieSecure: true });
    const plain = await request(proxied).post('/api/auth/login').send({ email: user.email, password: PASSWORD });
    expect(plain.status).toBe(200);
    expect(setCookieLine(plain)).toBeUndefined();
    // Without TRUST_PROXY the header is anyone's to send, so it is not believed.
    const direct = testApp({ trustProxy: undefined, cookieSecure: true });
    const spoofed = await request(direct).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send({ email: user.email, password: PASSWORD });
    expect(spoofed.status).toBe(200);
    expect(setCookieLine(spoofed)).toBeUndefined();
  });
});
