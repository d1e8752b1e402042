import { describe, expect, it } from 'vitest';
import { addMember, createGarden, createUser, signIn } from '../../helpers/factories';
import { agent, testDb } from '../../helpers/test-app';
import { REFUSED_DOMAIN } from '../../../fixtures/mail/smtp-fake';
import { enqueueAlertMail } from '../../../server/modules/notifications/alert-mail';
import { capturedFor, fakeSmtp, inTx, insertAlert, mailApp, outboxFor, sender, setPreference } from './mail-helpers';

async function queuedMessage(email?: string) {
  const garden = await createGarden();
  const grower = await createUser(email ? { email } : {});
  await addMember(grower.id, garden.id, 'grower');
  await setPreference(grower.id, garden.id, 'immediate');
  const alertId = await insertAlert(garden.id);
  await inTx((t) => enqueueAlertMail(t, garden.id, [alertId]));
  return { garden, grower };
}

/** Time passing: the retry becomes due now instead of after its backoff. */
async function makeDue(gardenId: number) {
  await testDb().sequelize.query('UPDATE mail_outbox SET run_after = UTC_TIMESTAMP(3) WHERE garden_id = ?', { replacements: [gardenId] });
}

describe('mail delivery through outages and crashes', () => {
  it('when the SMTP server is down, then the message stays pending with backoff, and once it is back it is sent once', async () => {
    const fake = await fakeSmtp();
    mailApp(fake.port);
    const { garden, grower } = await queuedMessage();
    const send = sender(fake.port, garden.id, { backoffMs: 60_000 });
    await fake.close();

    await send.drain();
    const [waiting] = await outboxFor(garden.id);
    expect(waiting).toMatchObject({ status: 'pending', attempts: 1 });
    expect(waiting.last_error).toMatch(/ECONNREFUSED|connect/i);
    expect(Number(waiting.dueInMs)).toBeGreaterThan(50_000);
    await send.drain();
    expect((await outboxFor(garden.id))[0].attempts).toBe(1);

    await fakeSmtp(fake.port);
    await makeDue(garden.id);
    await send.drain();
    await send.drain();

    expect(await capturedFor(grower.email)).toHaveLength(1);
    expect(await outboxFor(garden.id)).toMatchObject([{ status: 'sent', attempts: 2, last_error: null }]);
  });

  it('when a sender died mid-send (row left sending, lease expired), then after restart the message is sent once', async () => {
    const fake = await fakeSmtp();
    mailApp(fake.port);
    const { garden, grower } = await queuedMessage();
    await testDb().sequelize.query(
      `UPDATE mail_outbox SET status = 'sending', attempts = 1, lease_owner = 'gone:1', lease_until = UTC_TIMESTAMP(3) - INTERVAL 1 SECOND WHERE garden_id = ?`,
      { replacements: [garden.id] },
    );

    await Promise.all([sender(fake.port, garden.id).drain(), sender(fake.port, garden.id).drain()]);

    expect(await capturedFor(grower.email)).toHaveLength(1);
    expect(await outboxFor(garden.id)).toMatchObject([{ status: 'sent', attempts: 2 }]);
  });

  it('when a sender holds a live lease, then another sender leaves the row alone', async () => {
    const fake = await fakeSmtp();
    const { garden, grower } = await queuedMessage();
    await testDb().sequelize.query(
      `UPDATE mail_outbox SET status = 'sending', lease_owner = 'busy:1', lease_until = UTC_TIMESTAMP(3) + INTERVAL 1 MINUTE WHERE garden_id = ?`,
      { replacements: [garden.id] },
    );

    await sender(fake.port, garden.id).drain();

    expect(await capturedFor(grower.email)).toEqual([]);
  });

  it('when an address is refused every time, then sending stops after 5 tries and the owner sees it, a grower may not', async () => {
    const fake = await fakeSmtp();
    const app = mailApp(fake.port);
    const { garden } = await queuedMessage(`nobody-${Date.now()}@${REFUSED_DOMAIN}`);
    const owner = await createUser();
    await addMember(owner.id, garden.id, 'owner');
    const grower = await createUser();
    await addMember(grower.id, garden.id, 'grower');

    await sender(fake.port, garden.id, { backoffMs: 0 }).drain();

    expect(await outboxFor(garden.id)).toMatchObject([{ status: 'failed', attempts: 5 }]);
    const asOwner = agent(app);
    await signIn(asOwner, owner.email);
    const res = await asOwner.get(`/api/gardens/${garden.id}/mail/failed`);
    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([
      expect.objectContaining({ to: expect.stringContaining(REFUSED_DOMAIN), attempts: 5, lastError: expect.stringMatching(/550/), subject: expect.any(String) }),
    ]);
    const asGrower = agent(app);
    await signIn(asGrower, grower.email);
    expect((await asGrower.get(`/api/gardens/${garden.id}/mail/failed`)).status).toBe(403);
  });
});
