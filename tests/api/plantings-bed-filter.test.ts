import { describe, expect, it } from 'vitest';
import { testApp } from '../helpers/test-app';
import { createGarden } from '../helpers/factories';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';

const app = testApp();

const idsOf = (body: { items: { id: number }[] }) => body.items.map((p) => p.id).sort((a, b) => a - b);

describe('plantings of one bed (?bedId=, as each bed card links)', () => {
  it('when the list is asked for one bed, then only that bed’s plantings come, counted and paged among themselves', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const [north, south] = [await makeBed(garden.id, 'North 1'), await makeBed(garden.id, 'South 1')];
    const variety = await makeVariety(garden.id);
    const inNorth = [
      await makePlanting(garden.id, { bedId: north.id, varietyId: variety.id, sownOn: '2026-03-02' }),
      await makePlanting(garden.id, { bedId: north.id, varietyId: variety.id, sownOn: '2026-04-06' }),
      await makePlanting(garden.id, { bedId: north.id, varietyId: variety.id, sownOn: '2026-05-11' }),
    ];
    await makePlanting(garden.id, { bedId: south.id, varietyId: variety.id, sownOn: '2026-03-02' });

    const all = await clients.viewer.get(`${base}/plantings?bedId=${north.id}`);
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(3);
    expect(idsOf(all.body)).toEqual(inNorth.map((p) => p.id).sort((a, b) => a - b));
    expect(all.body.items.every((p: { bed: { id: number } }) => p.bed.id === north.id)).toBe(true);

    const second = await clients.viewer.get(`${base}/plantings?bedId=${north.id}&pageSize=2&page=2`);
    expect(second.body).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(second.body.items).toHaveLength(1);

    const south1 = await clients.viewer.get(`${base}/plantings?bedId=${south.id}`);
    expect(south1.body.total).toBe(1);
  });

  it('when the bed filter is combined with another, then both apply', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id);
    const other = await makeBed(garden.id);
    const variety = await makeVariety(garden.id);
    const planned = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, status: 'planned', sownOn: null });
    await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-04-01' });
    await makePlanting(garden.id, { bedId: other.id, varietyId: variety.id, status: 'planned', sownOn: null });

    const res = await clients.viewer.get(`${base}/plantings?bedId=${bed.id}&status=planned`);
    expect(res.status).toBe(200);
    expect(idsOf(res.body)).toEqual([planned.id]);
  });

  it('when the bed is another garden’s, then nothing of that garden comes back', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const neighbour = await createGarden({ name: 'Next door' });
    const theirBed = await makeBed(neighbour.id);
    const theirVariety = await makeVariety(neighbour.id);
    await makePlanting(neighbour.id, { bedId: theirBed.id, varietyId: theirVariety.id, sownOn: '2026-04-01' });
    await makePlanting(garden.id, { bedId: (await makeBed(garden.id)).id, varietyId: (await makeVariety(garden.id)).id, sownOn: '2026-04-01' });

    const res = await clients.viewer.get(`${base}/plantings?bedId=${theirBed.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: [], total: 0 });
  });

  it('when the bed id is not a record id, then the list is refused with a field message', async () => {
    const { clients, base } = await gardenWithClients(app);
    for (const bad of ['abc', '0', '-3']) {
      const res = await clients.viewer.get(`${base}/plantings?bedId=${bad}`);
      expect(res.status, bad).toBe(400);
      expect(res.body.error.fields).toHaveProperty('bedId');
    }
  });
});
