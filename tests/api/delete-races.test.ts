import { describe, expect, it } from 'vitest';
import { readdir } from 'node:fs/promises';
import sharp from 'sharp';
import { testApp, testDb } from '../helpers/test-app';
import { gardenWithClients, makeLot, makePlanting, makeVariety } from '../helpers/garden-records';
import { GerminationTest, PlantingLog, PlantingPhoto, SeedLot } from '../../server/db/models';
import { photoDir } from '../../server/modules/photos/photos.service';

const app = testApp();
const uploads = testDb().config.uploads;

const files = async () => new Set(await readdir(photoDir(uploads)).catch(() => [] as string[]));

describe('a delete racing inserts', () => {
  it('when a seed lot is deleted while germination tests are being posted, then each insert is 201 or 404, never 500, and no test outlives its lot', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const v = await makeVariety(garden.id, { cropKey: 'spinach' });
    const lot = await makeLot(garden.id, v.id);
    const post = () => clients.grower.post(`${base}/seed-lots/${lot.id}/germination-tests`).send({ testedOn: '2025-02-01', seedsTested: 20, germinated: 15 });
    // The delete goes out among the inserts, so some land before it and some after.
    const inserts = Array.from({ length: 35 }, (_, i) => new Promise((r) => setTimeout(r, i)).then(post));
    const del = new Promise((r) => setTimeout(r, 12)).then(() => clients.grower.delete(`${base}/seed-lots/${lot.id}`));
    const results = await Promise.all([...inserts, del]);
    const statuses = results.slice(0, -1).map((r) => r.status);
    expect(statuses.filter((s) => s !== 201 && s !== 404), JSON.stringify(statuses)).toEqual([]);
    expect(results.at(-1)!.status).toBe(204);
    expect(await SeedLot.count({ where: { id: lot.id } })).toBe(0);
    expect(await GerminationTest.count({ where: { seedLotId: lot.id } })).toBe(0);
  });

  it('when a planting is deleted while photos are being uploaded, then each upload is 201 or 404, never 500, and no photo row or file is left behind', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    const jpeg = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 90, g: 130, b: 70 } } }).jpeg().toBuffer();
    const before = await files();
    const upload = () => clients.grower.post(`${base}/plantings/${p.id}/photos`).field('caption', 'race').field('takenOn', '2025-05-02').attach('photo', jpeg, 'bed.jpg');
    const uploadsInFlight = Array.from({ length: 20 }, upload);
    const del = new Promise((r) => setTimeout(r, 40)).then(() => clients.grower.delete(`${base}/plantings/${p.id}`));
    const results = await Promise.all([...uploadsInFlight, del]);
    const statuses = results.slice(0, -1).map((r) => r.status);
    expect(statuses.filter((s) => s !== 201 && s !== 404), JSON.stringify(statuses)).toEqual([]);
    expect(results.at(-1)!.status).toBe(204);
    expect(await PlantingPhoto.count({ where: { plantingId: p.id } })).toBe(0);
    expect(await PlantingLog.count({ where: { plantingId: p.id } })).toBe(0);
    // Every file that appeared meanwhile belongs to a photo still on record (other tests may upload too).
    const added = [...(await files())].filter((f) => !before.has(f));
    const kept = added.length ? await PlantingPhoto.count({ where: { storageName: added } }) : 0;
    expect(kept).toBe(added.length);
  });
});
