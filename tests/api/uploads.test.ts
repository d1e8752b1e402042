import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { QueryTypes } from 'sequelize';
import { testApp, testDb } from '../helpers/test-app';
import type { TestAgent } from '../helpers/test-app';
import { gardenWithClients, makePlanting } from '../helpers/garden-records';
import { Planting, PlantingPhoto } from '../../server/db/models';

const app = testApp();
const { sequelize } = testDb();

const CSV = Buffer.from('date,high,low\n2025-05-01,20,8\n');

/** The three upload routes: where each takes its file, and the text fields it allows. */
function routes(base: string, plantingId: number) {
  return [
    { name: 'photo', url: `${base}/plantings/${plantingId}/photos`, field: 'photo', fields: { caption: 'Leaves', takenOn: '2025-05-02' } },
    { name: 'planting import', url: `${base}/plantings/import`, field: 'file', fields: {} as Record<string, string> },
    { name: 'station file', url: `${base}/weather/imports`, field: 'file', fields: { unit: 'C' } },
  ];
}

async function stored(gardenId: number, plantingId: number) {
  const [{ n }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM weather_imports WHERE garden_id = ?', { replacements: [gardenId], type: QueryTypes.SELECT });
  return { photos: await PlantingPhoto.count({ where: { plantingId } }), plantings: await Planting.count({ where: { gardenId } }), imports: Number(n) };
}

function raw(c: TestAgent, url: string, contentType: string, body: string) {
  return c.post(url).set('Content-Type', contentType).send(body);
}

describe('multipart uploads that break the rules', () => {
  it('when a multipart body is malformed (no boundary, cut short, broken part headers), then 400 upload_malformed on every upload route', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    const before = await stored(garden.id, p.id);
    for (const r of routes(base, p.id)) {
      const bodies: [string, string][] = [
        ['multipart/form-data', '--x\r\nContent-Disposition: form-data; name="a"\r\n\r\nb\r\n--x--\r\n'],
        ['multipart/form-data; boundary=XYZ', `--XYZ\r\nContent-Disposition: form-data; name="${r.field}"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\ndate,high,low\n2025-05-01,2`],
        ['multipart/form-data; boundary=XYZ', '--XYZ\r\nthis is not a header line at all\r\n\r\nvalue\r\n--XYZ--\r\n'],
      ];
      for (const [type, body] of bodies) {
        const res = await raw(clients.grower, r.url, type, body);
        expect(res.status, `${r.name}: ${body.slice(0, 40)}`).toBe(400);
        expect(res.body.error.code, `${r.name}: ${body.slice(0, 40)}`).toBe('upload_malformed');
        expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js)|node_modules|busboy/i);
      }
    }
    expect(await stored(garden.id, p.id)).toEqual(before);
    expect((await clients.viewer.get('/api/health')).status).toBe(200);
  });

  it('when a form carries two files, more text fields than the route takes, or more parts, then 400 upload_rejected naming no field', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    const photo = await sharp({ create: { width: 32, height: 32, channels: 3, background: { r: 10, g: 120, b: 40 } } }).png().toBuffer();
    const before = await stored(garden.id, p.id);
    for (const r of routes(base, p.id)) {
      const file = r.name === 'photo' ? photo : CSV;
      const name = r.name === 'photo' ? 'leaf.png' : 'station.csv';
      const withFields = (req: ReturnType<TestAgent['post']>, fields: Record<string, string>) => Object.entries(fields).reduce((q, [k, v]) => q.field(k, v), req);

      const twoFiles = await withFields(clients.grower.post(r.url), r.fields).attach(r.field, file, name).attach(r.field, file, name);
      expect(twoFiles.status, `${r.name}: two files`).toBe(400);
      expect(twoFiles.body.error).toMatchObject({ code: 'upload_rejected', message: 'The upload was refused: send one file only.' });
      expect(twoFiles.body.error.fields, r.name).toBeUndefined();

      // One text field too many, sent before the file.
      const extra = await withFields(clients.grower.post(r.url), { ...r.fields, extra: 'x' }).attach(r.field, file, name);
      expect(extra.status, `${r.name}: too many fields`).toBe(400);
      expect(extra.body.error.code).toBe('upload_rejected');
      expect(extra.body.error.message, r.name).toMatch(/^The upload was refused: the form (has more than \d text fields?|takes the file alone, no other fields)\.$/);
      expect(extra.body.error.fields, r.name).toBeUndefined();

      // The fields it takes, and two files after them: one part more than the form can have.
      const parts = await withFields(clients.grower.post(r.url), r.fields).attach(r.field, file, name).attach('other', file, name).attach('third', file, name);
      expect(parts.status, `${r.name}: too many parts`).toBe(400);
      expect(parts.body.error.code).toBe('upload_rejected');
      expect(parts.body.error.fields ?? {}, r.name).not.toHaveProperty(r.field);

      // A file under another name is reported against that name, and what to send instead.
      const misnamed = await withFields(clients.grower.post(r.url), r.fields).attach('attachment', file, name);
      expect(misnamed.status, `${r.name}: misnamed`).toBe(400);
      expect(misnamed.body.error.fields).toEqual({ attachment: `a file was sent as "attachment"; send it as "${r.field}".` });
    }
    expect(await stored(garden.id, p.id)).toEqual(before);
    // The server is still up and a proper upload still works.
    const ok = await clients.grower.post(`${base}/plantings/${p.id}/photos`).field('caption', 'Leaves').attach('photo', photo, 'leaf.png');
    expect(ok.status).toBe(201);
    const station = await clients.grower.post(`${base}/weather/imports`).field('unit', 'C').attach('file', CSV, 'station.csv');
    expect(station.status).toBe(201);
  });
});
