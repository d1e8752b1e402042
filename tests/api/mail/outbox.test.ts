import { describe, expect, it } from 'vitest';
import { addMember, createGarden, createUser } from '../../helpers/factories';
import { dayRange } from '#shared/format/dates';
import { enqueueAlertMail } from '../../../server/modules/notifications/alert-mail';
import { capturedFor, fakeSmtp, inTx, insertAlert, mailApp, outboxFor, sender, setPreference } from './mail-helpers';

async function gardenWithImmediateMember() {
  const garden = await createGarden({ name: 'Hillside Plots' });
  const grower = await createUser({ name: 'Rosa Field' });
  await addMember(grower.id, garden.id, 'grower');
  await setPreference(grower.id, garden.id, 'immediate');
  return { garden, grower };
}

describe('alert e-mail through the outbox', () => {
  it('when an alert is queued and the sender runs, then one message with text, accessible HTML and one-click unsubscribe headers arrives', async () => {
    const fake = await fakeSmtp();
    mailApp(fake.port);
    const { garden, grower } = await gardenWithImmediateMember();
    const digestMember = await createUser();
    await addMember(digestMember.id, garden.id, 'viewer');
    const frostOnly = await createUser();
    await addMember(frostOnly.id, garden.id, 'viewer');
    await setPreference(frostOnly.id, garden.id, 'immediate', ['frost']);
    const alertId = await insertAlert(garden.id);

    const queued = await inTx((t) => enqueueAlertMail(t, garden.id, [alertId]));
    await sender(fake.port, garden.id).drain();

    expect(queued).toBe(1);
    const [mail, ...more] = await capturedFor(grower.email);
    expect(more).toEqual([]);
    expect(mail.subject).toBe('Warning · Bolt risk: Bolt risk high from 9 Jun · Hillside Plots');
    expect(mail.text_body).toContain('Hello Rosa Field,');
    expect(mail.text_body).toContain('  - 4 days ≥ 80 °F forecast 9–12 Jun');
    expect(mail.text_body).toContain(`When: ${dayRange('2026-06-09', '2026-06-12')}`);
    expect(mail.text_body).toContain('Take care: Working outdoors in heat');
    expect(mail.html_body).toContain('<html lang="en">');
    expect(mail.html_body).toContain('<h2>Warning · Bolt risk: Bolt risk high from 9 Jun</h2>');
    expect(mail.html_body).toContain('<li>4 days ≥ 80 °F forecast 9–12 Jun</li>');
    expect(mail.headers['list-unsubscribe']).toMatch(/^<http:\/\/.+\/unsubscribe\/[\w.-]+>$/);
    expect(mail.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    expect(mail.text_body).toContain(mail.headers['list-unsubscribe'].slice(1, -1));
    expect(await capturedFor(digestMember.email)).toEqual([]);
    expect(await capturedFor(frostOnly.email)).toEqual([]);
    expect((await outboxFor(garden.id)).map((r) => r.status)).toEqual(['sent']);
  });

  it('when enqueue runs twice and two senders run twice, also at once, then one message is delivered', async () => {
    const fake = await fakeSmtp();
    mailApp(fake.port);
    const { garden, grower } = await gardenWithImmediateMember();
    const ids = [await insertAlert(garden.id), await insertAlert(garden.id, { type: 'frost', severity: 'severe', caution: null })];

    const first = await inTx((t) => enqueueAlertMail(t, garden.id, ids));
    const again = await inTx((t) => enqueueAlertMail(t, garden.id, [...ids].reverse()));
    const a = sender(fake.port, garden.id);
    const b = sender(fake.port, garden.id);
    await Promise.all([a.drain(), b.drain()]);
    await Promise.all([a.drain(), b.drain()]);

    expect([first, again]).toEqual([1, 0]);
    const mail = await capturedFor(grower.email);
    expect(mail.map((m) => m.subject)).toEqual(['2 new alerts · Hillside Plots']);
    expect(await outboxFor(garden.id)).toHaveLength(1);
  });

  it('when the alerts transaction rolls back, then no message is left behind', async () => {
    const { garden } = await gardenWithImmediateMember();
    const alertId = await insertAlert(garden.id);

    await expect(
      inTx(async (t) => {
        await enqueueAlertMail(t, garden.id, [alertId]);
        throw new Error('evaluation failed');
      }),
    ).rejects.toThrow('evaluation failed');

    expect(await outboxFor(garden.id)).toEqual([]);
  });

  it('when an alert is resolved or belongs to another garden, then it is not mailed', async () => {
    const { garden } = await gardenWithImmediateMember();
    const other = await createGarden();
    const resolved = await insertAlert(garden.id, { status: 'resolved' });
    const elsewhere = await insertAlert(other.id);

    expect(await inTx((t) => enqueueAlertMail(t, garden.id, [resolved, elsewhere]))).toBe(0);
  });
});
