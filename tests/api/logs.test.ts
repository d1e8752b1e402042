import { afterEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { agent, testDb, testWeather } from '../helpers/test-app';
import { gardenWithMembers, PASSWORD, signIn, uniqueEmail } from '../helpers/factories';
import { createApp } from '../../server/app';
import { createCapturingLogger } from '../../server/lib/logger';
import { Session } from '../../server/db/models';

const { sequelize, config } = testDb();
const { logger, lines } = createCapturingLogger();
const app = createApp({ config, sequelize, logger, clientDir: null, weather: testWeather() });

const triggers: string[] = [];
afterEach(async () => {
  for (const t of triggers.splice(0)) await sequelize.query(`DROP TRIGGER IF EXISTS ${t}`);
});

/** Makes every new bed of this garden fail in the database, as a real fault would. */
async function breakBedsOf(gardenId: number) {
  const name = `refuse_beds_${gardenId}`;
  await sequelize.query(
    `CREATE TRIGGER ${name} BEFORE INSERT ON beds FOR EACH ROW
       IF NEW.garden_id = ${gardenId} THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'beds refused for the test'; END IF`,
  );
  triggers.push(name);
}

function parsed(from: number) {
  return lines.slice(from).map((l) => JSON.parse(l) as Record<string, unknown>);
}

/** The cookie's value as sent, and the session id inside it (`s:<sid>.<signature>`). */
function secretsOf(res: { headers: Record<string, unknown> }) {
  const cookie = ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('heatclock.sid='))!;
  const value = cookie.split(';')[0].slice('heatclock.sid='.length);
  const sid = decodeURIComponent(value).slice(2).split('.')[0];
  return { value, sid };
}

describe('what the logs hold', () => {
  it('when a request carrying a link token in its path is logged, then the log holds :token, never the token', async () => {
    const token = 'Zq3kT0kenThatWorks_9f8e7d6c5b4a3210xyzABC';
    const from = lines.length;
    // A body that does not match its Content-Encoding is logged as a warning with the path.
    for (const path of [`/api/auth/password-reset/${token}`, `/api/invitations/${token}/accept`, `/api/me/email-change/${token}`]) {
      const res = await request(app).post(path).set('X-Requested-With', 'heatclock-test').set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send('not gzip at all');
      expect(res.status, path).toBe(400);
    }
    const text = lines.slice(from).join('\n');
    expect(text).toContain(':token');
    expect(text).not.toContain(token);
  });

  it('when a request fails on our side, then one error line carries the request id, the stack and the user, and no password or session id', async () => {
    const { garden, grower } = await gardenWithMembers();
    const c = agent(app).set('X-Requested-With', 'heatclock-test');
    const secrets = secretsOf(await signIn(c, grower.email));
    expect(await Session.count({ where: { sid: secrets.sid } })).toBe(1);
    await breakBedsOf(garden.id);
    const from = lines.length;
    const res = await c.post(`/api/gardens/${garden.id}/beds`).send({ name: 'North bed', kind: 'bed', lengthM: 3, widthM: 1 });
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('internal_error');
    expect(JSON.stringify(res.body)).not.toMatch(/beds refused|SIGNAL|at .*\.ts/);
    const errors = parsed(from).filter((l) => l.level === 'error');
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatchObject({ msg: 'request failed', requestId: res.body.error.requestId, userId: grower.id, method: 'POST' });
    expect(res.headers['x-request-id']).toBe(res.body.error.requestId);
    // A stack, not only a message: the error's name and message, then frames.
    expect(errors[0].error).toMatch(/\n\s+at .*beds\.router\.ts/);
    expect(errors[0].cause).toMatch(/beds refused for the test/);
    expect(errors[0].cause).not.toMatch(/INSERT|sql:/i);
    const text = lines.slice(from).join('\n');
    for (const secret of [PASSWORD, secrets.value, decodeURIComponent(secrets.value), secrets.sid]) expect(text).not.toContain(secret);
  });

  it('when a sign-in is refused, then one warning carries the request id and a fingerprint of the account, never the password, the e-mail or a session id', async () => {
    const { grower } = await gardenWithMembers();
    const wrongPassword = `not-the-password-${Date.now()}`;
    const unknown = uniqueEmail('nobody');
    for (const email of [grower.email, unknown]) {
      const from = lines.length;
      const res = await request(app).post('/api/auth/login').send({ email, password: wrongPassword });
      expect(res.status).toBe(401);
      const warnings = parsed(from).filter((l) => l.msg === 'sign-in refused');
      expect(warnings).toHaveLength(1);
      expect(warnings[0]).toMatchObject({ level: 'warn', requestId: res.body.error.requestId, path: '/api/auth/login' });
      expect(warnings[0].account).toMatch(/^[0-9a-f]{16}$/);
      const text = lines.slice(from).join('\n');
      expect(text).not.toContain(wrongPassword);
      expect(text.toLowerCase()).not.toContain(email.toLowerCase());
      expect(text).not.toContain('heatclock.sid');
    }
    // The same account gives the same fingerprint, so repeated guesses can be followed in the log.
    const again = lines.length;
    await request(app).post('/api/auth/login').send({ email: grower.email.toUpperCase(), password: wrongPassword });
    const first = parsed(0).find((l) => l.msg === 'sign-in refused')!;
    expect(parsed(again).find((l) => l.msg === 'sign-in refused')!.account).toBe(first.account);
    // A session that was signed in before and then fails a sign-in: its session id stays out of the log too.
    const c = agent(app);
    const secrets = secretsOf(await signIn(c, grower.email));
    const from = lines.length;
    expect((await c.post('/api/auth/login').send({ email: grower.email, password: wrongPassword })).status).toBe(401);
    const text = lines.slice(from).join('\n');
    expect(text).toContain('sign-in refused');
    for (const secret of [PASSWORD, wrongPassword, secrets.value, decodeURIComponent(secrets.value), secrets.sid]) expect(text).not.toContain(secret);
  });
});
