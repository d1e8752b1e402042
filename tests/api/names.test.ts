import { describe, expect, it } from 'vitest';
import { testApp, agent } from '../helpers/test-app';
import { gardenWithClients } from '../helpers/garden-records';
import { uniqueEmail } from '../helpers/factories';
import { Bed } from '../../server/db/models';

const app = testApp();

describe('names that people tell apart', () => {
  it('when beds are named with different emoji, then they are different beds; the same name in another case still clashes', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const make = (name: string) => clients.grower.post(`${base}/beds`).send({ name, kind: 'bed', lengthM: null, widthM: null, notes: '' });
    expect((await make('🍅 bed')).status).toBe(201);
    expect((await make('🥕 bed')).status).toBe(201);
    const again = await make('🍅 BED');
    expect(again.status).toBe(409);
    expect(await Bed.count({ where: { gardenId: garden.id } })).toBe(2);
  });

  it('when a name holds a control character, a direction override or a broken surrogate, then 400 names the field and nothing is stored', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    for (const name of ['a\u0000b', 'north\u202Ebed', 'tab\there', 'x\uD83Cy']) {
      const res = await clients.grower.post(`${base}/beds`).send({ name, kind: 'bed', lengthM: null, widthM: null, notes: '' });
      expect(res.status, JSON.stringify(name)).toBe(400);
      expect(res.body.error.fields.name).toMatch(/control characters|broken character/);
    }
    expect(await Bed.count({ where: { gardenId: garden.id } })).toBe(0);
    // Composed and decomposed é are one name (NFC).
    expect((await clients.grower.post(`${base}/beds`).send({ name: 'Cafe\u0301 row', kind: 'bed', lengthM: null, widthM: null, notes: '' })).status).toBe(201);
    const dup = await clients.grower.post(`${base}/beds`).send({ name: 'Caf\u00e9 row', kind: 'bed', lengthM: null, widthM: null, notes: '' });
    expect(dup.status).toBe(409);
    expect((await Bed.findOne({ where: { gardenId: garden.id } }))!.name).toBe('Caf\u00e9 row');
  });

  it('when a registration name is too long, then the message says so rather than that it is missing', async () => {
    const res = await agent(app).post('/api/auth/register').send({ email: uniqueEmail('long'), password: 'tomato violin harbour seven', name: 'n'.repeat(121), gardenName: 'Plot' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.name).toBe('Your name must be at most 120 characters.');
  });
});
