import { describe, expect, it } from 'vitest';
import { testApp } from '../helpers/test-app';
import { gardenWithClients, makeLot, makeVariety } from '../helpers/garden-records';
import { createGarden } from '../helpers/factories';

const app = testApp();

describe('seed lots and germination tests', () => {
  it('when a grower records a lot and a 15-of-20 test, then 75 % and the seeds to sow follow (Iowa State / Nebraska Ext., SCIENCE §7)', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id, { cropKey: 'spinach' });
    const lot = await clients.grower.post(`${base}/seed-lots`).send({ varietyId: v.id, supplier: 'Co-op', lotNumber: 'A1', packedForYear: 2020, quantity: 300, quantityUnit: 'seeds', storageNotes: '' });
    expect(lot.status).toBe(201);
    const id = lot.body.seedLot.id;
    const noTest = await clients.viewer.get(`${base}/seed-lots/${id}/seeds-to-sow?plants=100`);
    expect(noTest.status).toBe(422);
    const test = await clients.grower.post(`${base}/seed-lots/${id}/germination-tests`).send({ testedOn: '2025-02-01', seedsTested: 20, germinated: 15 });
    expect(test.status).toBe(201);
    expect(test.body.test.percent).toBe(75);
    expect(test.body.seedLot.latestTest.percent).toBe(75);
    // 100 plants at 75 % → 134 seeds; with a 0.8 field-emergence factor → 167.
    const plain = await clients.viewer.get(`${base}/seed-lots/${id}/seeds-to-sow?plants=100`);
    expect(plain.body.seedsToSow).toMatchObject({ seeds: 134, germinationPercent: 75 });
    const field = await clients.viewer.get(`${base}/seed-lots/${id}/seeds-to-sow?plants=100&emergenceFactor=0.8`);
    expect(field.body.seedsToSow.seeds).toBe(167);
  });

  it('when a lot is older than its crop’s seed life, then the viability estimate says to test it', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id, { cropKey: 'onion' });
    const lot = await makeLot(garden.id, v.id, { packedForYear: 2015 });
    const res = await clients.viewer.get(`${base}/seed-lots/${lot.id}`);
    // Iowa State Ext. 1999 (Knott's): onion seed keeps 1 year.
    expect(res.body.seedLot.viability).toMatchObject({ status: 'past-seed-life', seedLifeYears: 1 });
    expect(res.body.seedLot.viability.message).toMatch(/germination test/);
  });

  it('when a test has more germinated than tested, or a lot names another garden’s variety, then 400 and nothing is written', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id);
    const lot = await makeLot(garden.id, v.id);
    const bad = await clients.grower.post(`${base}/seed-lots/${lot.id}/germination-tests`).send({ testedOn: '2025-02-01', seedsTested: 10, germinated: 12 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('germinated');
    const foreign = await makeVariety((await createGarden()).id);
    const cross = await clients.grower.post(`${base}/seed-lots`).send({ varietyId: foreign.id, supplier: '', lotNumber: '', packedForYear: null, quantity: null, quantityUnit: 'seeds', storageNotes: '' });
    expect(cross.status).toBe(400);
    expect(cross.body.error.fields).toHaveProperty('varietyId');
    expect((await clients.viewer.get(`${base}/seed-lots`)).body.total).toBe(1);
  });

  it('when roles differ, then viewers read, growers edit and delete, outsiders get 404', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id);
    const lot = await makeLot(garden.id, v.id);
    expect((await clients.viewer.patch(`${base}/seed-lots/${lot.id}`).send({ supplier: 'x' })).status).toBe(403);
    expect((await clients.viewer.post(`${base}/seed-lots/${lot.id}/germination-tests`).send({ testedOn: '2025-01-01', seedsTested: 10, germinated: 5 })).status).toBe(403);
    expect((await clients.outsider.get(`${base}/seed-lots/${lot.id}`)).status).toBe(404);
    const edited = await clients.grower.patch(`${base}/seed-lots/${lot.id}`).send({ supplier: 'Seed swap', quantity: 12.5, quantityUnit: 'grams' });
    expect(edited.body.seedLot).toMatchObject({ supplier: 'Seed swap', quantity: 12.5, quantityUnit: 'grams' });
    const t = await clients.grower.post(`${base}/seed-lots/${lot.id}/germination-tests`).send({ testedOn: '2025-01-01', seedsTested: 10, germinated: 5 });
    expect((await clients.grower.delete(`${base}/seed-lots/${lot.id}/germination-tests/${t.body.test.id}`)).status).toBe(204);
    expect((await clients.grower.delete(`${base}/seed-lots/${lot.id}`)).status).toBe(204);
    expect((await clients.grower.get(`${base}/seed-lots/${lot.id}`)).status).toBe(404);
  });
});
