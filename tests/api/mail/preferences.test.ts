import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { addMember, createGarden, createUser, signIn } from '../../helpers/factories';
import { agent, testApp, testDb } from '../../helpers/test-app';

const app = testApp();
const URL_ = '/api/me/notification-preferences';

async function member() {
  const user = await createUser();
  const first = await createGarden({ name: 'A first garden' });
  const second = await createGarden({ name: 'B second garden' });
  await addMember(user.id, first.id, 'viewer');
  await addMember(user.id, second.id, 'grower');
  const client = agent(app);
  await signIn(client, user.email);
  return { user, first, second, client };
}

const rowsOf = (userId: number) =>
  testDb().sequelize.query('SELECT garden_id FROM notification_preferences WHERE user_id = ?', { replacements: [userId], type: QueryTypes.SELECT });

describe('notification preferences', () => {
  it('when nothing is stored, then each garden reads as a 7 o’clock digest of every type', async () => {
    const { first, second, client } = await member();

    const res = await client.get(URL_);

    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([
      { gardenId: first.id, gardenName: 'A first garden', delivery: 'digest', digestHour: 7, types: ['bolt-risk', 'frost', 'heat-stress', 'chilling', 'harvest-window', 'data-gap'] },
      { gardenId: second.id, gardenName: 'B second garden', delivery: 'digest', digestHour: 7, types: ['bolt-risk', 'frost', 'heat-stress', 'chilling', 'harvest-window', 'data-gap'] },
    ]);
  });

  it('when preferences are saved, then they read back in the fixed type order and saving again updates them', async () => {
    const { first, second, client } = await member();

    const res = await client.put(URL_).send({ items: [{ gardenId: second.id, delivery: 'immediate', digestHour: 18, types: ['frost', 'bolt-risk'] }] });
    const again = await client.put(URL_).send({ items: [{ gardenId: second.id, delivery: 'off', digestHour: 5, types: [] }] });

    expect(res.status).toBe(200);
    expect(res.body.items[1]).toEqual({ gardenId: second.id, gardenName: 'B second garden', delivery: 'immediate', digestHour: 18, types: ['bolt-risk', 'frost'] });
    expect(again.body.items.map((i: { gardenId: number; delivery: string }) => [i.gardenId, i.delivery])).toEqual([
      [first.id, 'digest'],
      [second.id, 'off'],
    ]);
  });

  it('when the input is bad, then 400 names each field and nothing is written', async () => {
    const { user, first, client } = await member();
    const good = { gardenId: first.id, delivery: 'digest', digestHour: 6, types: ['frost'] };

    const cases: [object, string][] = [
      [{ items: [{ ...good, digestHour: 24 }] }, 'items.0.digestHour'],
      [{ items: [good, { ...good, digestHour: 6.5 }] }, 'items.1.digestHour'],
      [{ items: [{ ...good, delivery: 'weekly' }] }, 'items.0.delivery'],
      [{ items: [{ ...good, types: ['frost', 'hail'] }] }, 'items.0.types.1'],
      [{ items: [{ ...good, types: ['frost', 'frost'] }] }, 'items.0.types'],
      [{ items: [{ ...good, userId: 1 }] }, 'items.0.userId'],
      [{ items: [] }, 'items'],
      [{ items: [good], extra: true }, 'extra'],
    ];
    for (const [body, field] of cases) {
      const res = await client.put(URL_).send(body);
      expect(res.status, field).toBe(400);
      expect(Object.keys(res.body.error.fields), field).toContain(field);
    }
    expect(await rowsOf(user.id)).toEqual([]);
  });

  it('when one item names a garden the user is not a member of, then the whole request is refused and nothing is written', async () => {
    const { user, first, client } = await member();
    const stranger = await createGarden();

    const res = await client.put(URL_).send({
      items: [
        { gardenId: first.id, delivery: 'off', digestHour: 7, types: [] },
        { gardenId: stranger.id, delivery: 'immediate', digestHour: 7, types: ['frost'] },
      ],
    });

    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'items.1.gardenId': 'You are not a member of this garden.' });
    expect(await rowsOf(user.id)).toEqual([]);
  });
});
