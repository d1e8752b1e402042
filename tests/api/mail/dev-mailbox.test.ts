import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { addMember, createGarden, createUser, signIn } from '../../helpers/factories';
import { agent, testApp, testDb } from '../../helpers/test-app';
import { enqueueAlertMail } from '../../../server/modules/notifications/alert-mail';
import { fakeSmtp, inTx, insertAlert, mailApp, sender, setPreference } from './mail-helpers';

describe('the local test mailbox', () => {
  it('when mail went to the local fake, then a signed-in user sees it newest first with text and HTML', async () => {
    const fake = await fakeSmtp();
    const app = mailApp(fake.port);
    const garden = await createGarden({ name: 'Mailbox Garden' });
    const grower = await createUser();
    await addMember(grower.id, garden.id, 'grower');
    await setPreference(grower.id, garden.id, 'immediate');
    const send = sender(fake.port, garden.id);
    const older = await insertAlert(garden.id);
    await inTx((t) => enqueueAlertMail(t, garden.id, [older]));
    await send.drain();
    const newer = await insertAlert(garden.id, { type: 'frost', severity: 'severe' });
    await inTx((t) => enqueueAlertMail(t, garden.id, [newer]));
    await send.drain();
    const client = agent(app);
    await signIn(client, grower.email);

    const res = await client.get('/api/dev/mail');

    expect(res.status).toBe(200);
    const mine = res.body.messages.filter((m: { to: string }) => m.to === grower.email);
    expect(mine.map((m: { subject: string }) => m.subject)).toEqual([
      'Severe · Frost: Bolt risk high from 9 Jun · Mailbox Garden',
      'Warning · Bolt risk: Bolt risk high from 9 Jun · Mailbox Garden',
    ]);
    expect(mine[0]).toEqual({ to: grower.email, subject: expect.any(String), text: expect.stringContaining('Hello'), html: expect.stringContaining('<h1>'), receivedAt: expect.any(String) });
    expect((await request(app).get('/api/dev/mail')).status).toBe(401);
  });

  it('when a real SMTP server is configured, then the mailbox route answers 404', async () => {
    const { config } = testDb();
    const app = testApp({ mail: { ...config.mail, mode: 'smtp', smtpUrl: 'smtp://127.0.0.1:1' } });
    const user = await createUser();
    const client = agent(app);
    await signIn(client, user.email);

    expect((await client.get('/api/dev/mail')).status).toBe(404);
  });

  it('when someone has just signed up, then the sign-up messages to that address, and only those, can be read without signing in while mail is caught locally', async () => {
    const { sequelize, config } = testDb();
    const app = testApp();
    const email = `signup-${Date.now()}@example.org`;
    const put = (to: string, subject: string) =>
      sequelize.query('INSERT INTO captured_mail (to_addr, subject, text_body, html_body, headers_json, received_at) VALUES (?, ?, ?, NULL, ?, UTC_TIMESTAMP(3))', {
        replacements: [to, subject, `Open http://127.0.0.1:3000/register/confirm/abc123 to finish.`, '{}'],
      });
    await put(email, 'Finish creating your Heatclock account');
    await put(email, 'Warning · Frost: a personal alert · Some Garden');
    await put('someone-else@example.org', 'Finish creating your Heatclock account');
    const res = await request(app).get(`/api/dev/mail/sign-up?email=${encodeURIComponent(email.toUpperCase())}`);
    expect(res.status).toBe(200);
    expect(res.body.messages.map((m: { to: string; subject: string }) => [m.to, m.subject])).toEqual([[email, 'Finish creating your Heatclock account']]);
    expect((await request(app).get('/api/dev/mail/sign-up?email=not-an-address')).status).toBe(400);
    const real = testApp({ mail: { ...config.mail, mode: 'smtp', smtpUrl: 'smtp://127.0.0.1:1' } });
    expect((await request(real).get(`/api/dev/mail/sign-up?email=${encodeURIComponent(email)}`)).status).toBe(404);
  });
});
