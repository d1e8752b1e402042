import { describe, expect, it } from 'vitest';
import { testApp } from '../helpers/test-app';
import { gardenWithClients, makeLot, makeVariety, makePlanting } from '../helpers/garden-records';
import { createGarden } from '../helpers/factories';

const app = testApp();

const packet = {
  cropKey: 'spinach',
  name: 'Test Savoy',
  dtmDays: 42,
  dtmFrom: 'emergence',
  emergenceDaysMin: 6,
  emergenceDaysMax: 10,
  boltTolerance: 4,
  heatTolerance: 2,
  traits: ['f1-hybrid', 'treated', 'pelleted'],
  containerFriendly: true,
  sunHours: 6,
  waterCmPerWeek: 2.5,
  sowDepthCm: 1.5,
  spacingCm: 8,
  thinSpacingCm: 10,
  gddTargetOverrideC: null,
  notes: '',
};

describe('varieties', () => {
  it('when a grower adds a variety, then its packet facts, trait guidance and target basis come back', async () => {
    const { clients, base } = await gardenWithClients(app);
    const res = await clients.grower.post(`${base}/varieties`).send(packet);
    expect(res.status).toBe(201);
    const v = res.body.variety;
    expect(v).toMatchObject({ name: 'Test Savoy', crop: { key: 'spinach', name: 'Spinach', season: 'cool' }, dtmFrom: 'emergence', traits: ['f1-hybrid', 'treated', 'pelleted'] });
    const text = v.guidance.map((g: { text: string }) => g.text).join(' ');
    expect(text).toMatch(/does not come true/);
    expect(text).toMatch(/wear gloves/i);
    expect(text).toMatch(/label/);
    expect(text).toMatch(/Pelleted seed/);
    expect(v.gddTarget.basis).toMatch(/derived|none/);
  });

  it('when the target is overridden, then the variety reports the override in °C-days', async () => {
    const { clients, base } = await gardenWithClients(app);
    const id = (await clients.grower.post(`${base}/varieties`).send(packet)).body.variety.id;
    const res = await clients.grower.patch(`${base}/varieties/${id}`).send({ gddTargetOverrideC: 480 });
    expect(res.body.variety.gddTarget).toMatchObject({ valueC: 480, basis: 'override', countsFrom: 'sowing' });
  });

  it('when traits conflict or fields are unknown, then 400 names them', async () => {
    const { clients, base } = await gardenWithClients(app);
    const res = await clients.grower.post(`${base}/varieties`).send({ ...packet, traits: ['f1-hybrid', 'heirloom'], emergenceDaysMin: 9, emergenceDaysMax: 3, cropKey: 'mandrake', id: 4 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['cropKey', 'emergenceDaysMax', 'id', 'traits']);
    const id = (await clients.grower.post(`${base}/varieties`).send(packet)).body.variety.id;
    // A partial change is checked against the whole record.
    const partial = await clients.grower.patch(`${base}/varieties/${id}`).send({ traits: ['open-pollinated', 'f1-hybrid'] });
    expect(partial.status).toBe(400);
  });

  it('when roles differ, then viewers read, growers write, outsiders see nothing', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id);
    expect((await clients.viewer.get(`${base}/varieties/${v.id}`)).status).toBe(200);
    expect((await clients.viewer.patch(`${base}/varieties/${v.id}`).send({ notes: 'x' })).status).toBe(403);
    expect((await clients.viewer.post(`${base}/varieties`).send(packet)).status).toBe(403);
    expect((await clients.outsider.get(`${base}/varieties/${v.id}`)).status).toBe(404);
    const list = await clients.viewer.get(`${base}/varieties?crop=lettuce&trait=open-pollinated`);
    expect(list.body.total).toBe(1);
    expect((await clients.grower.delete(`${base}/varieties/${v.id}`)).status).toBe(204);
  });

  it('when a variety has seed lots, or belongs to another garden, then delete is refused', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id);
    await makeLot(garden.id, v.id);
    expect((await clients.grower.delete(`${base}/varieties/${v.id}`)).status).toBe(409);
    const other = await makeVariety((await createGarden()).id);
    expect((await clients.grower.delete(`${base}/varieties/${other.id}`)).status).toBe(404);
  });
});

describe('a variety in use keeps its crop', () => {
  it('when a variety with plantings is moved to another crop, then 409 names the crop field and nothing changes', async () => {
    const app = testApp();
    const { garden, clients, base } = await gardenWithClients(app);
    const planting = await makePlanting(garden.id);
    const res = await clients.grower.patch(`${base}/varieties/${planting.varietyId}`).send({ cropKey: 'spinach' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.cropKey).toMatch(/cannot change/);
    const again = await clients.grower.get(`${base}/varieties/${planting.varietyId}`).expect(200);
    expect(again.body.variety.crop.key).toBe('lettuce');
  });
});
