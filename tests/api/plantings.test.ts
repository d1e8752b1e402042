import { describe, expect, it } from 'vitest';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { gardenWithClients, makeBed, makeLot, makePlanting, makeVariety } from '../helpers/garden-records';
import { createGarden } from '../helpers/factories';
import { Planting } from '../../server/db/models';

const app = testApp();

function plantingBody(ids: { bedId: number; varietyId: number; seedLotId?: number | null }) {
  return {
    bedId: ids.bedId,
    varietyId: ids.varietyId,
    seedLotId: ids.seedLotId ?? null,
    method: 'direct-sow',
    status: 'growing',
    quantity: 3,
    quantityUnit: 'row-m',
    sownOn: '2025-04-02',
    emergedOn: null,
    thinnedOn: null,
    transplantedOn: null,
    firstHarvestOn: null,
    lastHarvestOn: null,
    boltedOn: null,
    notes: 'By the gate',
  };
}

describe('plantings', () => {
  it('when a grower sows a planting, then it is presented with bed, crop, season and next event', async () => {
    const { clients, base, garden } = await gardenWithClients(testApp({}, testWeather({}, () => new Date('2025-04-05T17:00:00Z'))));
    await giveGardenWeather(testDb().sequelize, garden, steadyDays('2020-01-01', '2025-04-04', 20, 20));
    const bed = await makeBed(garden.id, 'North 1');
    const variety = await makeVariety(garden.id, { dtmDays: 50, dtmFrom: 'sowing', emergenceDaysMax: 8 });
    const lot = await makeLot(garden.id, variety.id);
    const res = await clients.grower.post(`${base}/plantings`).send(plantingBody({ bedId: bed.id, varietyId: variety.id, seedLotId: lot.id }));
    expect(res.status).toBe(201);
    expect(res.body.planting).toMatchObject({
      bed: { name: 'North 1' },
      crop: { key: 'lettuce', name: 'Lettuce' },
      sownOn: '2025-04-02',
      season: '2025',
      nextEvent: { label: 'Emergence expected', on: '2025-04-10' },
      logCount: 0,
    });
    const id = res.body.planting.id;
    const edited = await clients.grower.patch(`${base}/plantings/${id}`).send({ emergedOn: '2025-04-09' });
    // Constant weather: the degree-day projection lands on the packet's 50 days from sowing.
    expect(edited.body.planting.nextEvent).toMatchObject({ label: 'Likely ready from', on: '2025-05-22' });
    expect((await clients.viewer.get(`${base}/plantings/${id}`)).body.planting.emergedOn).toBe('2025-04-09');
    expect((await clients.grower.delete(`${base}/plantings/${id}`)).status).toBe(204);
  });

  it('when a planting names a bed, variety or seed lot of another garden, then 400 and nothing is written', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const other = await createGarden();
    const [bed, variety] = [await makeBed(garden.id), await makeVariety(garden.id)];
    const [foreignBed, foreignVariety] = [await makeBed(other.id), await makeVariety(other.id)];
    const foreignLot = await makeLot(other.id, foreignVariety.id);
    for (const ids of [
      { bedId: foreignBed.id, varietyId: variety.id, field: 'bedId' },
      { bedId: bed.id, varietyId: foreignVariety.id, field: 'varietyId' },
      { bedId: bed.id, varietyId: variety.id, seedLotId: foreignLot.id, field: 'seedLotId' },
    ]) {
      const res = await clients.grower.post(`${base}/plantings`).send(plantingBody(ids));
      expect(res.status, ids.field).toBe(400);
      expect(res.body.error.fields, ids.field).toHaveProperty(ids.field);
    }
    const mine = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id });
    const moved = await clients.grower.patch(`${base}/plantings/${mine.id}`).send({ bedId: foreignBed.id });
    expect(moved.status).toBe(400);
    expect(await Planting.count({ where: { gardenId: garden.id } })).toBe(1);
    expect((await Planting.findByPk(mine.id))!.bedId).toBe(bed.id);
  });

  it('when the seed lot is of another variety, or stage dates run backwards, then 400 names the field', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id);
    const [a, b] = [await makeVariety(garden.id), await makeVariety(garden.id)];
    const lotOfB = await makeLot(garden.id, b.id);
    const wrongLot = await clients.grower.post(`${base}/plantings`).send(plantingBody({ bedId: bed.id, varietyId: a.id, seedLotId: lotOfB.id }));
    expect(wrongLot.body.error.fields).toHaveProperty('seedLotId');
    const backwards = await clients.grower.post(`${base}/plantings`).send({ ...plantingBody({ bedId: bed.id, varietyId: a.id }), emergedOn: '2025-03-01', status: 'harvested' });
    expect(Object.keys(backwards.body.error.fields).sort()).toEqual(['emergedOn', 'firstHarvestOn']);
  });

  it('when a grower logs a harvest and bolting in two taps, then the planting’s dates and status follow; viewers cannot log', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    expect((await clients.viewer.post(`${base}/plantings/${p.id}/log`).send({ entryOn: '2025-05-20', kind: 'watered' })).status).toBe(403);
    const harvest = await clients.grower.post(`${base}/plantings/${p.id}/log`).send({ entryOn: '2025-05-20', kind: 'harvest', amount: 1.5, amountUnit: 'kg' });
    expect(harvest.status).toBe(201);
    expect(harvest.body.entry).toMatchObject({ kind: 'harvest', amount: 1.5, amountUnit: 'kg', by: 'Grower' });
    expect(harvest.body.planting).toMatchObject({ firstHarvestOn: '2025-05-20', lastHarvestOn: '2025-05-20', logCount: 1 });
    const bolted = await clients.grower.post(`${base}/plantings/${p.id}/log`).send({ entryOn: '2025-05-28', kind: 'bolted' });
    expect(bolted.body.planting).toMatchObject({ status: 'bolted', boltedOn: '2025-05-28' });
    const early = await clients.grower.post(`${base}/plantings/${p.id}/log`).send({ entryOn: '2025-01-01', kind: 'watered' });
    expect(early.status).toBe(400);
    const amountOnWater = await clients.grower.post(`${base}/plantings/${p.id}/log`).send({ entryOn: '2025-05-01', kind: 'watered', amount: 3, amountUnit: 'kg' });
    expect(amountOnWater.body.error.fields).toHaveProperty('amount');
    const log = await clients.viewer.get(`${base}/plantings/${p.id}/log`);
    expect(log.body.items.map((e: { kind: string }) => e.kind)).toEqual(['bolted', 'harvest']);
    expect((await clients.grower.delete(`${base}/plantings/${p.id}/log/${log.body.items[1].id}`)).status).toBe(204);
    expect((await clients.outsider.get(`${base}/plantings/${p.id}/log`)).status).toBe(404);
  });

  it('when the list is filtered and sorted, then it answers a page of matching plantings', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id, 'Zeta');
    const spinach = await makeVariety(garden.id, { cropKey: 'spinach', name: 'Alpha spinach' });
    await makePlanting(garden.id, { bedId: bed.id, varietyId: spinach.id, sownOn: '2025-03-01', status: 'harvested', firstHarvestOn: '2025-04-20' });
    await makePlanting(garden.id, { sownOn: '2025-04-01' });
    await makePlanting(garden.id, { sownOn: '2025-05-01', status: 'planned' });
    const all = await clients.viewer.get(`${base}/plantings?sort=sown&order=desc`);
    expect(all.body.items.map((p: { sownOn: string }) => p.sownOn)).toEqual(['2025-05-01', '2025-04-01', '2025-03-01']);
    const spinachOnly = await clients.viewer.get(`${base}/plantings?crop=spinach`);
    expect(spinachOnly.body.total).toBe(1);
    expect((await clients.viewer.get(`${base}/plantings?status=planned`)).body.total).toBe(1);
    expect((await clients.viewer.get(`${base}/plantings?q=zeta`)).body.items[0].bed.name).toBe('Zeta');
    const byBed = await clients.viewer.get(`${base}/plantings?sort=bed&order=desc&pageSize=1`);
    expect(byBed.body).toMatchObject({ total: 3, pageSize: 1 });
    expect(byBed.body.items[0].bed.name).toBe('Zeta');
    expect((await clients.viewer.get(`${base}/plantings?sort=colour`)).status).toBe(400);
  });

  it('when the same planting is added twice, then 409; viewers cannot add, outsiders cannot see', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id);
    const variety = await makeVariety(garden.id);
    const body = plantingBody({ bedId: bed.id, varietyId: variety.id });
    expect((await clients.viewer.post(`${base}/plantings`).send(body)).status).toBe(403);
    expect((await clients.grower.post(`${base}/plantings`).send(body)).status).toBe(201);
    expect((await clients.grower.post(`${base}/plantings`).send(body)).status).toBe(409);
    expect((await clients.outsider.get(`${base}/plantings`)).status).toBe(404);
  });
});

describe('log entries keep the planting whole', () => {
  it('when a harvest is logged before an indoor start was transplanted, then 400 names the date and nothing changes', async () => {
    const app = testApp();
    const { garden, clients, base } = await gardenWithClients(app);
    const planting = await makePlanting(garden.id, { method: 'indoor-start', sownOn: '2025-03-01', transplantedOn: '2025-04-20', startOn: '2025-03-01' } as never);
    const res = await clients.grower.post(`${base}/plantings/${planting.id}/log`).send({ entryOn: '2025-04-10', kind: 'harvest', amount: 1, amountUnit: 'kg' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.entryOn).toMatch(/does not fit the planting/);
    await planting.reload();
    expect(planting.firstHarvestOn).toBeNull();
  });
});
