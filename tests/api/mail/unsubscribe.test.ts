import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { addMember, createGarden, createUser } from '../../helpers/factories';
import { testDb } from '../../helpers/test-app';
import { enqueueAlertMail } from '../../../server/modules/notifications/alert-mail';
import { capturedFor, fakeSmtp, inTx, insertAlert, mailApp, sender, setPreference } from './mail-helpers';

async function linkFromMail() {
  const fake = await fakeSmtp();
  const app = mailApp(fake.port);
  const garden = await createGarden({ name: 'Creekside' });
  const grower = await createUser({ name: 'Ada Furrow' });
  await addMember(grower.id, garden.id, 'grower');
  await setPreference(grower.id, garden.id, 'immediate');
  const alertId = await insertAlert(garden.id);
  await inTx((t) => enqueueAlertMail(t, garden.id, [alertId]));
  await sender(fake.port, garden.id).drain();
  const [mail] = await capturedFor(grower.email);
  const url = new URL(mail.headers['list-unsubscribe'].slice(1, -1));
  return { app, garden, grower, path: `/api${url.pathname}`, token: url.pathname.split('/').pop()! };
}

async function deliveryOf(userId: number, gardenId: number) {
  const [row] = await testDb().sequelize.query<{ delivery: string }>(
    'SELECT delivery FROM notification_preferences WHERE user_id = ? AND garden_id = ?',
    { replacements: [userId, gardenId], type: QueryTypes.SELECT },
  );
  return row.delivery;
}

const oneClick = (app: ReturnType<typeof mailApp>, path: string) =>
  request(app).post(path).type('form').send('List-Unsubscribe=One-Click');

describe('one-click unsubscribe', () => {
  it('when the link is opened without signing in, then it names the garden and member and changes nothing', async () => {
    const { app, garden, grower, path } = await linkFromMail();

    const res = await request(app).get(path);

    expect(res.status).toBe(200);
    expect(res.body).toEqual({ gardenName: 'Creekside', memberName: 'Ada Furrow', maskedEmail: expect.stringMatching(/^u…@test\.example$/), delivery: 'immediate' });
    expect(await deliveryOf(grower.id, garden.id)).toBe('immediate');
  });

  it('when a mail provider posts the RFC 8058 one-click body, then e-mail is off, and the same link is refused afterwards', async () => {
    const { app, garden, grower, path } = await linkFromMail();

    const res = await oneClick(app, path);

    expect(res.status).toBe(200);
    expect(res.body.delivery).toBe('off');
    expect(await deliveryOf(grower.id, garden.id)).toBe('off');
    const reused = await oneClick(app, path);
    expect(reused.status).toBe(410);
    expect(reused.body.error.code).toBe('unsubscribe_used');
    expect((await request(app).get(path)).status).toBe(410);
  });

  it('when the page posts JSON with the app header, then it works the same', async () => {
    const { app, garden, grower, path } = await linkFromMail();

    const res = await request(app).post(path).set('X-Requested-With', 'heatclock').send({});

    expect(res.status).toBe(200);
    expect(await deliveryOf(grower.id, garden.id)).toBe('off');
  });

  it('when the token is tampered with or names another member, then it is refused and nothing changes', async () => {
    const { app, garden, grower, token } = await linkFromMail();
    const other = await createUser();
    await addMember(other.id, garden.id, 'viewer');
    await setPreference(other.id, garden.id, 'immediate');
    const [, , nonce, mac] = token.split('.');
    const flipped = mac.slice(0, -2) + (mac.at(-2) === 'A' ? 'B' : 'A') + mac.at(-1);

    for (const bad of [`${grower.id}.${garden.id}.${nonce}.${flipped}`, `${other.id}.${garden.id}.${nonce}.${mac}`, 'not-a-token']) {
      const res = await oneClick(app, `/api/unsubscribe/${bad}`);
      expect(res.status, bad).toBe(404);
      expect(res.body.error.code).toBe('unsubscribe_invalid');
    }
    expect(await deliveryOf(grower.id, garden.id)).toBe('immediate');
    expect(await deliveryOf(other.id, garden.id)).toBe('immediate');
  });

  it('when a form post carries another body or comes from another site, then it is refused', async () => {
    const { app, garden, grower, path } = await linkFromMail();

    const wrongBody = await request(app).post(path).type('form').send('List-Unsubscribe=Yes');
    const crossSite = await oneClick(app, path).set('Sec-Fetch-Site', 'cross-site');
    const bare = await request(app).post(path).type('text/plain').send('hello');

    expect(wrongBody.status).toBe(400);
    expect(crossSite.status).toBe(403);
    expect(bare.status).toBe(415);
    expect(await deliveryOf(grower.id, garden.id)).toBe('immediate');
  });
});
