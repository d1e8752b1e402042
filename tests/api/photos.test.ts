import { describe, expect, it } from 'vitest';
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { agent, testApp, testDb } from '../helpers/test-app';
import { signIn } from '../helpers/factories';
import { gardenWithClients, makePlanting } from '../helpers/garden-records';
import { PlantingLog, PlantingPhoto } from '../../server/db/models';

const app = testApp();
const uploads = testDb().config.uploads;
const small = testApp({ uploads: { ...uploads, maxBytes: 20_000 } });

/** A real JPEG carrying EXIF with a GPS position, as a phone would write it. */
async function phoneJpeg(width = 640, height = 480) {
  return sharp({ create: { width, height, channels: 3, background: { r: 80, g: 140, b: 60 } } })
    .jpeg()
    .withExif({ IFD0: { Make: 'TestCam', Model: 'Garden phone' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '42/1 16/1 48/1', GPSLongitudeRef: 'W', GPSLongitude: '83/1 44/1 24/1' } })
    .toBuffer();
}

describe('planting photos', () => {
  it('when a grower uploads a phone JPEG, then it is stored re-encoded without metadata and served to members with nosniff', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    const original = await phoneJpeg();
    expect((await sharp(original).metadata()).exif).toBeDefined();
    const res = await clients.grower.post(`${base}/plantings/${p.id}/photos`).field('caption', 'Bolting centre').field('takenOn', '2025-05-02').attach('photo', original, 'IMG_0001.jpg');
    expect(res.status).toBe(201);
    expect(res.body.photo).toMatchObject({ caption: 'Bolting centre', takenOn: '2025-05-02', width: 640, height: 480 });
    const stored = await PlantingPhoto.findByPk(res.body.photo.id);
    expect(stored!.storageName).not.toContain('IMG_0001');
    expect(await PlantingLog.count({ where: { photoId: stored!.id, kind: 'photo' } })).toBe(1);

    const served = await clients.viewer.get(res.body.photo.url).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/jpeg');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
    const meta = await sharp(served.body as Buffer).metadata();
    expect(meta.format).toBe('jpeg');
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect((await clients.outsider.get(res.body.photo.url)).status).toBe(404);
    expect((await clients.viewer.delete(res.body.photo.url)).status).toBe(403);
    expect((await clients.grower.delete(res.body.photo.url)).status).toBe(204);
    expect((await clients.viewer.get(res.body.photo.url)).status).toBe(404);
  });

  it('when an HTML file is named .jpg, then it is refused by its content', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    const html = Buffer.from('<!doctype html><html><body><script>alert(1)</script></body></html>');
    const res = await clients.grower.post(`${base}/plantings/${p.id}/photos`).attach('photo', html, { filename: 'photo.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(415);
    expect(await PlantingPhoto.count({ where: { plantingId: p.id } })).toBe(0);
  });

  it('when an image is larger than the limit in bytes or in pixels, then 413', async () => {
    const { clients, base, garden } = await gardenWithClients(small);
    const p = await makePlanting(garden.id);
    const big = await sharp({ create: { width: 1600, height: 1600, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 60 } } }).jpeg({ quality: 95 }).toBuffer();
    expect(big.length).toBeGreaterThan(20_000);
    const res = await clients.grower.post(`${base}/plantings/${p.id}/photos`).attach('photo', big, 'big.jpg');
    expect(res.status).toBe(413);
    const pixelApp = testApp({ uploads: { ...uploads, maxPixels: 100_000 } });
    const g = await gardenWithClients(pixelApp);
    const q = await makePlanting(g.garden.id);
    const wide = await sharp({ create: { width: 1000, height: 200, channels: 3, background: '#888' } }).png().toBuffer();
    const tooMany = await g.clients.grower.post(`${g.base}/plantings/${q.id}/photos`).attach('photo', wide, 'wide.png');
    expect(tooMany.status).toBe(413);
  });

  it('when no file is attached or a viewer uploads, then 400 or 403', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    expect((await clients.grower.post(`${base}/plantings/${p.id}/photos`).field('caption', 'x')).status).toBe(400);
    expect((await clients.viewer.post(`${base}/plantings/${p.id}/photos`).attach('photo', await phoneJpeg(), 'a.jpg')).status).toBe(403);
    expect((await clients.viewer.get(`${base}/plantings/${p.id}/photos`)).body.photos).toEqual([]);
  });

  it('when a photo is uploaded through one app instance, then another instance with its own disk serves the same bytes, and a delete there removes it for both', async () => {
    // Two instances on the one database, each with an uploads folder of its own (as two machines would have).
    const first = testApp({ uploads: { ...uploads, dir: mkdtempSync(path.join(tmpdir(), 'heatclock-a-')) } });
    const secondDir = mkdtempSync(path.join(tmpdir(), 'heatclock-b-'));
    const second = testApp({ uploads: { ...uploads, dir: secondDir } });
    const { clients, base, garden, viewer, grower } = await gardenWithClients(first);
    const p = await makePlanting(garden.id);
    const res = await clients.grower.post(`${base}/plantings/${p.id}/photos`).field('caption', 'Across').field('takenOn', '2025-05-03').attach('photo', await phoneJpeg(800, 600), 'bed.jpg');
    expect(res.status).toBe(201);
    type Parser = Parameters<ReturnType<typeof clients.viewer.get>['parse']>[0];
    const binary: Parser = (r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    };
    const onFirst = await clients.viewer.get(res.body.photo.url).buffer(true).parse(binary);
    const viewerThere = agent(second).set('X-Requested-With', 'heatclock-test');
    await signIn(viewerThere, viewer.email);
    const onSecond = await viewerThere.get(res.body.photo.url).buffer(true).parse(binary);
    expect(onSecond.status).toBe(200);
    expect(onSecond.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(onSecond.body as Buffer, onFirst.body as Buffer)).toBe(0);
    expect(Number(onSecond.headers['content-length'])).toBe(res.body.photo.bytes);
    expect(readdirSync(secondDir)).toEqual([]);

    const growerThere = agent(second).set('X-Requested-With', 'heatclock-test');
    await signIn(growerThere, grower.email);
    expect((await growerThere.delete(res.body.photo.url)).status).toBe(204);
    expect((await clients.viewer.get(res.body.photo.url)).status).toBe(404);
    const [rows] = await testDb().sequelize.query('SELECT photo_id FROM planting_photo_contents WHERE photo_id = ?', { replacements: [res.body.photo.id] });
    expect(rows).toEqual([]);
  });
});
