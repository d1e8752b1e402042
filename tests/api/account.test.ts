import { describe, expect, it } from 'vitest';
import { agent, testApp } from '../helpers/test-app';
import type { TestAgent } from '../helpers/test-app';
import { createUser, PASSWORD, signIn, uniqueEmail } from '../helpers/factories';
import { accountMailFor } from '../helpers/registration';
import type { AccountMail } from '../helpers/registration';
import { Session, User } from '../../server/db/models';

const app = testApp();
const NEW_PASSWORD = 'lantern otter quarry maple';
const CHROME_LINUX = 'Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36';
const SAFARI_IPHONE = 'Mozilla/5.0 (iPhone; CPU iPhone OS 18_1 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/18.1 Mobile/15E148 Safari/604.1';

async function signedIn(email: string, userAgent = CHROME_LINUX): Promise<TestAgent> {
  const a = agent(app).set('User-Agent', userAgent);
  await signIn(a, email);
  return a;
}

function confirmEmailTokenOf(mail: Pick<AccountMail, 'text_body'>): string {
  const m = /\/account\/confirm-email\/([A-Za-z0-9_-]{43})(?![A-Za-z0-9_-])/.exec(mail.text_body);
  if (!m) throw new Error(`no confirmation link in: ${mail.text_body}`);
  return m[1];
}

describe('account: name and password', () => {
  it('when a grower changes their name, then me reads the new name; an empty change or a bad name is refused naming the field', async () => {
    const user = await createUser({ name: 'Old Name' });
    const a = await signedIn(user.email);

    const res = await a.patch('/api/me').send({ name: '  Mara Quill ' });

    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({ id: user.id, email: user.email, name: 'Mara Quill' });
    expect((await a.get('/api/auth/me')).body.user.name).toBe('Mara Quill');
    expect((await a.patch('/api/me').send({})).body.error.code).toBe('nothing_to_change');
    const blank = await a.patch('/api/me').send({ name: ' ' });
    expect(blank.status).toBe(400);
    expect(Object.keys(blank.body.error.fields)).toEqual(['name']);
    expect((await a.patch('/api/me').send({ name: 'X', email: 'x@y.org' })).body.error.fields).toHaveProperty('email');
  });

  it('when the password is changed, then other sessions get 401, this one stays signed in, and the new password works', async () => {
    const user = await createUser();
    const here = await signedIn(user.email);
    const other = await signedIn(user.email, SAFARI_IPHONE);

    const res = await here.post('/api/me/password').send({ currentPassword: PASSWORD, password: NEW_PASSWORD });

    expect(res.status).toBe(200);
    expect(res.body.endedSessions).toBe(1);
    expect((await here.get('/api/auth/me')).status).toBe(200);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    await signIn(agent(app), user.email, NEW_PASSWORD);
    expect((await accountMailFor(user.email)).map((m) => m.subject)).toEqual(['Your Heatclock password was changed']);
  });

  it('when the current password is wrong or the new one weak, then 400 names that field and nothing changes', async () => {
    const user = await createUser();
    const a = await signedIn(user.email);
    const other = await signedIn(user.email);

    const wrong = await a.post('/api/me/password').send({ currentPassword: 'not my password', password: NEW_PASSWORD });
    const weak = await a.post('/api/me/password').send({ currentPassword: PASSWORD, password: 'password1234' });
    const missing = await a.post('/api/me/password').send({ password: NEW_PASSWORD });

    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toEqual({ currentPassword: 'This is not your current password.' });
    expect(weak.status).toBe(400);
    expect(Object.keys(weak.body.error.fields)).toEqual(['password']);
    expect(Object.keys(missing.body.error.fields)).toEqual(['currentPassword']);
    expect((await other.get('/api/auth/me')).status).toBe(200);
    await signIn(agent(app), user.email, PASSWORD);
  });
});

describe('account: e-mail change', () => {
  it('when a new e-mail is asked for, then nothing changes until the link mailed to the new address is followed', async () => {
    const user = await createUser();
    const a = await signedIn(user.email);
    const next = uniqueEmail('moved');

    const res = await a.post('/api/me/email-change').send({ email: next, password: PASSWORD });

    expect(res.status).toBe(202);
    expect(res.body.status).toBe('check-email');
    expect((await User.findByPk(user.id))!.email).toBe(user.email);
    expect((await a.get('/api/auth/me')).body.user.email).toBe(user.email);
    const [mail] = await accountMailFor(next);
    expect(mail.subject).toBe('Confirm your new e-mail for Heatclock');
    const token = confirmEmailTokenOf(mail);

    const done = await a.post(`/api/me/email-change/${token}`).send({});

    expect(done.status).toBe(200);
    expect(done.body.user.email).toBe(next);
    expect((await a.get('/api/auth/me')).body.user.email).toBe(next);
    expect((await accountMailFor(user.email)).map((m) => m.subject)).toContain('Your Heatclock e-mail was changed');
    await signIn(agent(app), next, PASSWORD);
    const again = await a.post(`/api/me/email-change/${token}`).send({});
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('link_used');
  });

  it('when the link is followed by another account, the password is wrong, or the address is the same, then it is refused in words', async () => {
    const user = await createUser();
    const stranger = await createUser();
    const a = await signedIn(user.email);
    const next = uniqueEmail('moved');

    const wrong = await a.post('/api/me/email-change').send({ email: next, password: 'not my password' });
    const same = await a.post('/api/me/email-change').send({ email: user.email, password: PASSWORD });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toEqual({ password: 'This is not your current password.' });
    expect(same.body.error.fields).toEqual({ email: 'This is already your e-mail address.' });
    expect(await accountMailFor(next)).toEqual([]);

    await a.post('/api/me/email-change').send({ email: next, password: PASSWORD });
    const token = confirmEmailTokenOf((await accountMailFor(next))[0]);
    const other = await (await signedIn(stranger.email)).post(`/api/me/email-change/${token}`).send({});

    expect(other.status).toBe(403);
    expect(other.body.error.code).toBe('link_other_account');
    expect((await User.findByPk(user.id))!.email).toBe(user.email);
    expect((await agent(app).post(`/api/me/email-change/${token}`).send({})).status).toBe(401);
    expect((await a.post(`/api/me/email-change/${'B'.repeat(43)}`).send({})).status).toBe(404);
  });

  it('when e-mail changes are asked for again and again, then the fourth in an hour is refused with 429 and no more mail goes out', async () => {
    const user = await createUser();
    const a = await signedIn(user.email);
    const targets = [uniqueEmail('flood'), uniqueEmail('flood'), uniqueEmail('flood'), uniqueEmail('flood')];
    const statuses = [];
    for (const email of targets) statuses.push((await a.post('/api/me/email-change').send({ email, password: PASSWORD })).status);
    expect(statuses).toEqual([202, 202, 202, 429]);
    expect(await accountMailFor(targets[3])).toEqual([]);
  });

  it('when the new address already has an account, then the answer is the same and that address gets a note instead of a link', async () => {
    const user = await createUser();
    const taken = await createUser();
    const a = await signedIn(user.email);

    const res = await a.post('/api/me/email-change').send({ email: taken.email, password: PASSWORD });
    const free = await a.post('/api/me/email-change').send({ email: uniqueEmail('free'), password: PASSWORD });

    expect(res.status).toBe(202);
    expect(res.body).toEqual(free.body);
    const [note] = await accountMailFor(taken.email);
    expect(note.subject).toBe('Someone tried to move a Heatclock account to your e-mail');
    expect(note.text_body).not.toMatch(/confirm-email/);
  });
});

describe('account: signed-in devices', () => {
  it('when a grower lists their sessions, then each shows its device in words and last-seen time, this one marked, no session id exposed', async () => {
    const user = await createUser();
    const here = await signedIn(user.email);
    await signedIn(user.email, SAFARI_IPHONE);
    const someoneElse = await createUser();
    await signedIn(someoneElse.email);

    const res = await here.get('/api/me/sessions');

    expect(res.status).toBe(200);
    expect(res.body.items).toHaveLength(2);
    const [current, phone] = res.body.items;
    expect(current).toMatchObject({ device: 'Chrome on Linux', current: true });
    expect(phone).toMatchObject({ device: 'Safari on iPhone', current: false });
    for (const item of res.body.items) {
      expect(Object.keys(item).sort()).toEqual(['current', 'device', 'id', 'lastSeenAt', 'signedInAt']);
      expect(new Date(item.lastSeenAt).getTime()).toBeGreaterThan(Date.now() - 60_000);
    }
    const sids = (await Session.findAll({ where: { userId: user.id }, raw: true })).map((s) => s.sid);
    expect(sids).toHaveLength(2);
    for (const sid of sids) expect(JSON.stringify(res.body)).not.toContain(sid);
  });

  it('when one other session is signed out, then only it gets 401; an unknown id is 404', async () => {
    const user = await createUser();
    const here = await signedIn(user.email);
    const phone = await signedIn(user.email, SAFARI_IPHONE);
    const tablet = await signedIn(user.email, 'Mozilla/5.0 (iPad; CPU OS 18_1 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/18.1 Mobile/15E148 Safari/604.1');
    const items = (await here.get('/api/me/sessions')).body.items as { id: string; device: string }[];
    const phoneId = items.find((s) => s.device === 'Safari on iPhone')!.id;

    const res = await here.delete(`/api/me/sessions/${phoneId}`).set('X-Requested-With', 'test');

    expect(res.status).toBe(204);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await tablet.get('/api/auth/me')).status).toBe(200);
    expect((await here.get('/api/auth/me')).status).toBe(200);
    expect((await here.get('/api/me/sessions')).body.items).toHaveLength(2);
    const again = await here.delete(`/api/me/sessions/${phoneId}`).set('X-Requested-With', 'test');
    expect(again.status).toBe(404);
    expect(again.body.error.message).toMatch(/signed-in device/);
  });

  it('when a grower signs out everywhere else, then every other session gets 401 and this one stays', async () => {
    const user = await createUser();
    const here = await signedIn(user.email);
    const others = [await signedIn(user.email, SAFARI_IPHONE), await signedIn(user.email)];

    const res = await here.post('/api/me/sessions/sign-out-others').send({});

    expect(res.status).toBe(200);
    expect(res.body.ended).toBe(2);
    for (const o of others) expect((await o.get('/api/auth/me')).status).toBe(401);
    expect((await here.get('/api/auth/me')).status).toBe(200);
    expect((await here.get('/api/me/sessions')).body.items.map((s: { current: boolean }) => s.current)).toEqual([true]);
  });

  it('when a session of another user is named, then it is not found and stays signed in', async () => {
    const user = await createUser();
    const stranger = await createUser();
    const theirs = await signedIn(stranger.email);
    const theirId = (await theirs.get('/api/me/sessions')).body.items[0].id as string;
    const mine = await signedIn(user.email);

    expect((await mine.delete(`/api/me/sessions/${theirId}`).set('X-Requested-With', 'test')).status).toBe(404);
    expect((await theirs.get('/api/auth/me')).status).toBe(200);
  });
});
