import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { testApp } from '../helpers/test-app';
import { gardenWithClients, makeBed, makeLot, makePlanting, makeVariety } from '../helpers/garden-records';
import { Bed, Garden, Planting, PlantingLog, SeedLot, Variety } from '../../server/db/models';

const app = testApp();

/** Bytes of a small PNG-like binary: a signature, NULs, control bytes and invalid UTF-8. */
const BINARY = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0x00, 0x00, 0x00, 0x0d, 0x49, 0x48, 0x44, 0x52, 0xff, 0xfe, 0x01, 0x02, 0x2c, 0x22, 0x0a, 0x9c, 0x03]);
/** Binary without a single NUL byte: control bytes between letters and commas. */
const NO_NUL_BINARY = Buffer.from('date,high,low\n\x01\x02\x03\x7f\x1b[31m,\x04\x05,\x06\x07\n\x0e\x0f,\x10\x11,\x12\x13\n', 'latin1');

function rawBytesIn(text: string) {
  // Control characters as JSON escapes, or the replacement character of undecodable bytes.
  return /\\u00(0[0-8bcef]|1[0-9a-f]|7f)|\uFFFD|\\ufffd|PNG|IHDR/i.test(text);
}

describe('odd bodies', () => {
  it('when an address has a broken %-escape in a path parameter, then 400 in words, not 500', async () => {
    const { clients, base } = await gardenWithClients(app);
    for (const path of [`${base}/plantings/%E0%A4%A`, `${base}/varieties/%zz`, '/api/calendar/%E0%A4%A.ics']) {
      const res = await clients.grower.get(path);
      expect(res.status, path).toBe(400);
      expect(res.body.error).toMatchObject({ code: 'malformed_address' });
    }
  });

  it('when a body has a __proto__ key, then 400 names __proto__ as an unknown field, at the top and nested', async () => {
    const { clients, base } = await gardenWithClients(app);
    const top = await clients.grower.post(`${base}/beds`).set('Content-Type', 'application/json').send('{"name":"North bed","kind":"bed","__proto__":{"gardenId":1}}');
    expect(top.status).toBe(400);
    expect(top.body.error.message).toBe('Please check the fields: __proto__.');
    expect(Object.keys(top.body.error.fields)).toEqual(['__proto__']);
    expect(top.body.error.fields.__proto__).toBe('Unknown field "__proto__" is not accepted.');
    const login = await clients.outsider.post('/api/auth/login').set('Content-Type', 'application/json').send('{"email":"a@b.co","password":"whatever-pass","__proto__":null}');
    expect(login.status).toBe(400);
    expect(Object.keys(login.body.error.fields)).toEqual(['__proto__']);
    const crop = await clients.owner.patch(`${base}/crops/lettuce`).set('Content-Type', 'application/json').send('{"params":{"__proto__":{"value":1}}}');
    expect(crop.status).toBe(400);
    expect(crop.body.error.fields).toHaveProperty(['params.__proto__']);
  });

  it('when a photo log entry is written by hand, then 400 naming kind, and nothing is stored: photos come through the upload', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    const res = await clients.grower.post(`${base}/plantings/${p.id}/log`).send({ entryOn: '2025-04-20', kind: 'photo', note: 'no photo here' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['kind']);
    expect(res.body.error.fields.kind).toMatch(/upload/i);
    expect(await PlantingLog.count({ where: { plantingId: p.id } })).toBe(0);
    // The same entry by another kind is fine.
    expect((await clients.grower.post(`${base}/plantings/${p.id}/log`).send({ entryOn: '2025-04-20', kind: 'observation', note: 'fine' })).status).toBe(201);
  });

  it('when a planting import has a photo log entry, then the line is refused under log_kind and nothing is imported', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id, 'Import bed');
    const variety = await makeVariety(garden.id, { name: 'Import lettuce' });
    const header = 'bed,crop,variety,seed_lot,method,status,quantity,quantity_unit,sown,emerged,thinned,transplanted,first_harvest,last_harvest,bolted,notes,log_date,log_kind,log_amount,log_unit,log_note';
    const csv = `${header}\n${bed.name},lettuce,${variety.name},,direct-sow,growing,10,plants,2025-04-01,,,,,,,,2025-04-20,photo,,,\n`;
    const res = await clients.grower.post(`${base}/plantings/import`).attach('file', Buffer.from(csv), { filename: 'p.csv', contentType: 'text/csv' });
    expect(res.status).toBe(422);
    expect(res.body.error.rows).toEqual([expect.objectContaining({ line: 2, column: 'log_kind', message: expect.stringMatching(/upload/i) })]);
    expect(await Planting.count({ where: { gardenId: garden.id } })).toBe(0);
  });

  it('when plantings with photo entries are exported, then the photo entries stay out and the file imports back unchanged', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id);
    const entry = { gardenId: garden.id, plantingId: p.id, amount: null, amountUnit: null, createdBy: null };
    await PlantingLog.create({ ...entry, entryOn: '2025-04-10', kind: 'observation', note: 'true leaves', photoId: null });
    await PlantingLog.create({ ...entry, entryOn: '2025-04-12', kind: 'photo', note: 'a photo entry', photoId: null });
    const csv = await clients.viewer.get(`${base}/plantings/export.csv`);
    expect(csv.status).toBe(200);
    const rows = parse<Record<string, string>>(csv.text.replace(/^\uFEFF/, ''), { columns: true });
    expect(rows.map((r) => r.log_kind)).toEqual(['observation']);
    const again = await clients.grower.post(`${base}/plantings/import`).attach('file', Buffer.from(csv.text), { filename: 'p.csv', contentType: 'text/csv' });
    expect(again.status).toBe(200);
    expect(await PlantingLog.count({ where: { plantingId: p.id } })).toBe(2);
  });

  it('when a PATCH body is empty, then every PATCH route answers 400 nothing_to_change and changes nothing', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id);
    const variety = await makeVariety(garden.id);
    const lot = await makeLot(garden.id, variety.id);
    const planting = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id });
    const rows = async () => ({
      bed: (await Bed.findByPk(bed.id, { raw: true }))!,
      variety: (await Variety.findByPk(variety.id, { raw: true }))!,
      lot: (await SeedLot.findByPk(lot.id, { raw: true }))!,
      planting: (await Planting.findByPk(planting.id, { raw: true }))!,
      garden: (await Garden.findByPk(garden.id, { raw: true }))!,
    });
    const before = await rows();
    const routes = [
      `${base}`,
      `${base}/beds/${bed.id}`,
      `${base}/varieties/${variety.id}`,
      `${base}/seed-lots/${lot.id}`,
      `${base}/plantings/${planting.id}`,
    ];
    for (const url of routes) {
      const res = await clients.owner.patch(url).send({});
      expect(res.status, url).toBe(400);
      expect(res.body.error.code, url).toBe('nothing_to_change');
      expect(res.body.error.message, url).toMatch(/nothing to change/i);
    }
    for (const body of [{}, { params: {} }]) {
      const res = await clients.owner.patch(`${base}/crops/lettuce`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      if (Object.keys(body).length) expect(res.body.error.code).toBe('nothing_to_change');
    }
    expect(await rows()).toEqual(before);
    // A real change still goes through.
    expect((await clients.owner.patch(`${base}/beds/${bed.id}`).send({ notes: 'mulched' })).status).toBe(200);
  });

  it('when a planting import or a station file is binary, then 422 says it is not a text CSV file and quotes none of its bytes', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    for (const bytes of [BINARY, NO_NUL_BINARY]) {
      const plantings = await clients.grower.post(`${base}/plantings/import`).attach('file', bytes, { filename: 'plantings.csv', contentType: 'text/csv' });
      expect(plantings.status).toBe(422);
      expect(plantings.body.error.message).toBe('This file is not a text CSV file.');
      expect(rawBytesIn(JSON.stringify(plantings.body))).toBe(false);
      const station = await clients.grower.post(`${base}/weather/imports`).field('unit', 'C').attach('file', bytes, { filename: 'station.csv', contentType: 'text/csv' });
      expect(station.status).toBe(422);
      expect(station.body.error.message).toBe('This file is not a text CSV file.');
      expect(rawBytesIn(JSON.stringify(station.body))).toBe(false);
    }
    expect(await Planting.count({ where: { gardenId: garden.id } })).toBe(0);
    // A station file in Latin-1 (° as one byte, as older exports write it) is still text.
    const latin1 = Buffer.from('date,High (\xb0C),Low (\xb0C)\n2025-05-01,20,8\n', 'latin1');
    expect((await clients.grower.post(`${base}/weather/imports`).field('unit', 'C').attach('file', latin1, { filename: 'station.csv', contentType: 'text/csv' })).status).toBe(201);
  });
});
