import { describe, expect, it } from 'vitest';
import { testApp } from '../helpers/test-app';
import { gardenWithClients, makeBed, makePlanting } from '../helpers/garden-records';
import { createGarden } from '../helpers/factories';

const app = testApp();

describe('beds', () => {
  it('when a grower creates, renames and deletes a bed, then each step is saved and presented', async () => {
    const { clients, base } = await gardenWithClients(app);
    const created = await clients.grower.post(`${base}/beds`).send({ name: 'Herb spiral', kind: 'bed', lengthM: 2, widthM: 1.5 });
    expect(created.status).toBe(201);
    expect(created.body.bed).toMatchObject({ name: 'Herb spiral', kind: 'bed', areaM2: 3, notes: '', activePlantings: 0, plantingsOnRecord: 0 });
    const id = created.body.bed.id;
    const renamed = await clients.grower.patch(`${base}/beds/${id}`).send({ name: 'Spiral', kind: 'container' });
    expect(renamed.body.bed).toMatchObject({ name: 'Spiral', kind: 'container' });
    expect((await clients.viewer.get(`${base}/beds/${id}`)).body.bed.name).toBe('Spiral');
    expect((await clients.grower.delete(`${base}/beds/${id}`)).status).toBe(204);
    expect((await clients.grower.get(`${base}/beds/${id}`)).status).toBe(404);
  });

  it('when a viewer or an outsider writes, then 403 and 404; the viewer still reads', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id, 'Kept');
    expect((await clients.viewer.post(`${base}/beds`).send({ name: 'No', kind: 'bed' })).status).toBe(403);
    expect((await clients.viewer.patch(`${base}/beds/${bed.id}`).send({ name: 'No' })).status).toBe(403);
    expect((await clients.viewer.delete(`${base}/beds/${bed.id}`)).status).toBe(403);
    expect((await clients.outsider.get(`${base}/beds`)).status).toBe(404);
    expect((await clients.outsider.delete(`${base}/beds/${bed.id}`)).status).toBe(404);
    const list = await clients.viewer.get(`${base}/beds`);
    expect(list.body).toMatchObject({ total: 1, page: 1, pageSize: 50 });
    expect(list.body.items[0].name).toBe('Kept');
  });

  it('when the list is filtered and paged, then only matching beds come back', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    for (const name of ['Alpha', 'Beta', 'Gamma', 'Alder']) await makeBed(garden.id, name);
    const res = await clients.owner.get(`${base}/beds?q=al&pageSize=1&page=2`);
    expect(res.body).toMatchObject({ total: 2, page: 2, pageSize: 1 });
    expect(res.body.items.map((b: { name: string }) => b.name)).toEqual(['Alpha']);
    expect((await clients.owner.get(`${base}/beds?colour=red`)).status).toBe(400);
  });

  it('when a bed name repeats or fields are wrong, then 409 or 400 naming the fields', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await makeBed(garden.id, 'Same');
    expect((await clients.grower.post(`${base}/beds`).send({ name: 'Same', kind: 'bed' })).status).toBe(409);
    const bad = await clients.grower.post(`${base}/beds`).send({ name: '', kind: 'pond', gardenId: 1, lengthM: -1 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['gardenId', 'kind', 'lengthM', 'name']);
  });

  it('when a bed has plantings, then it cannot be deleted; another garden’s bed is not found', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id, { status: 'harvested', firstHarvestOn: '2025-05-20', lastHarvestOn: '2025-05-30' } as never);
    const shown = await clients.viewer.get(`${base}/beds/${p.bedId}`).expect(200);
    expect(shown.body.bed).toMatchObject({ activePlantings: 0, plantingsOnRecord: 1 });
    expect((await clients.grower.delete(`${base}/beds/${p.bedId}`)).status).toBe(409);
    const other = await makeBed((await createGarden()).id);
    expect((await clients.grower.get(`${base}/beds/${other.id}`)).status).toBe(404);
    expect((await clients.grower.patch(`${base}/beds/${other.id}`).send({ name: 'Mine' })).status).toBe(404);
  });
});
