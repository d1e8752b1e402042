import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { parse } from 'csv-parse/sync';
import { agent, testApp, testDb } from '../../helpers/test-app';
import type { TestAgent } from '../../helpers/test-app';
import { gardenWithMembers, signIn } from '../../helpers/factories';
import { projectRoot } from '../../../server/config';

const { sequelize } = testDb();
const app = testApp();

async function growerOfNewGarden() {
  const ctx = await gardenWithMembers();
  const c = agent(app);
  await signIn(c, ctx.grower.email);
  return { ...ctx, c };
}

function upload(c: TestAgent, gardenId: number, body: string | Buffer, unit = 'C', name = 'station.csv') {
  return c
    .post(`/api/gardens/${gardenId}/weather/imports`)
    .set('X-Requested-With', 'heatclock')
    .field('unit', unit)
    .attach('file', Buffer.isBuffer(body) ? body : Buffer.from(body), { filename: name, contentType: 'text/csv' });
}

async function storedCount(gardenId: number) {
  const [{ n }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM garden_weather_days WHERE garden_id = ?', {
    replacements: [gardenId],
    type: QueryTypes.SELECT,
  });
  return Number(n);
}

describe('station CSV upload', () => {
  it('when the header lacks a column, then 422 on line 1 naming it, and nothing is stored', async () => {
    const { c, garden } = await growerOfNewGarden();
    const res = await upload(c, garden.id, 'date,high\n2025-05-01,20\n');
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('csv_invalid');
    expect(res.body.error.rows).toEqual([{ line: 1, column: 'low', message: 'No "low" column; the header needs date, high and low.' }]);
    expect(await storedCount(garden.id)).toBe(0);
  });

  it('when rows have bad dates, −200 °C, duplicates and a low above the high, then every problem is reported by line and column and zero rows are written', async () => {
    const { c, garden } = await growerOfNewGarden();
    const csv = [
      '\uFEFFdate,high,low',
      '2025-05-01,20.5,8',
      '2025-13-01,20,8',
      '05/03/2025,21,9',
      '2025-05-04,-200,8',
      '2025-05-01,19,7',
      '2025-05-06,10,12',
      '2025-05-07,warm,5',
    ].join('\r\n');
    const res = await upload(c, garden.id, csv);
    expect(res.status).toBe(422);
    expect(res.body.error.rows).toEqual([
      { line: 3, column: 'date', message: '"2025-13-01" is not a date like 2026-05-31.' },
      { line: 4, column: 'date', message: '"05/03/2025" is not a date like 2026-05-31.' },
      { line: 5, column: 'high', message: '-200 °C is outside the plausible range for air temperature.' },
      { line: 6, column: 'date', message: '2025-05-01 already appears on line 2.' },
      { line: 7, column: 'low', message: 'The low is above the high.' },
      { line: 8, column: 'high', message: '"warm" is not a number.' },
    ]);
    expect(await storedCount(garden.id)).toBe(0);
  });

  it('when a good file with BOM and CRLF is uploaded twice, then its days are stored once and win over the service', async () => {
    const { c, garden } = await growerOfNewGarden();
    const csv = '\uFEFFDate,High (°F),Low (°F)\r\n2025-07-01,95,68\r\n2025-07-02,88.5,61\r\n';
    const first = await upload(c, garden.id, csv, 'F');
    expect(first.status).toBe(201);
    expect(first.body.import).toMatchObject({ rowsInFile: 2, rowsAdded: 2, rowsChanged: 0, alreadyImported: false, from: '2025-07-01', to: '2025-07-02' });
    const second = await upload(c, garden.id, csv, 'F');
    expect(second.status).toBe(200);
    expect(second.body.import).toMatchObject({ rowsAdded: 0, alreadyImported: true });
    expect(await storedCount(garden.id)).toBe(2);
    const week = await c.get(`/api/gardens/${garden.id}/weather?from=2025-07-01&to=2025-07-02`).expect(200);
    // Garden shows °F; 95 °F is stored as 35.0 °C and shown back as 95 °F.
    expect(week.body.days).toEqual([
      { date: '2025-07-01', tmax: 95, tmin: 68, source: 'imported' },
      { date: '2025-07-02', tmax: 88.5, tmin: 61, source: 'imported' },
    ]);
  });

  it('when the same file is uploaded twice at the same moment, then it lands once', async () => {
    const { c, garden } = await growerOfNewGarden();
    const csv = 'date,high,low\n2025-08-01,30,18\n2025-08-02,31,19\n2025-08-03,29,17\n';
    const results = await Promise.all([upload(c, garden.id, csv), upload(c, garden.id, csv)]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 201]);
    const [{ n }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM weather_imports WHERE garden_id = ?', {
      replacements: [garden.id],
      type: QueryTypes.SELECT,
    });
    expect(Number(n)).toBe(1);
    expect(await storedCount(garden.id)).toBe(3);
  });

  it('when the upload is not CSV, too large, or from a viewer, then it is refused with a clear error', async () => {
    const { c, garden, viewer } = await growerOfNewGarden();
    const png = await upload(c, garden.id, Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 0]), 'C', 'photo.png');
    expect(png.status).toBe(415);
    const binary = await upload(c, garden.id, Buffer.from([0x64, 0x61, 0x74, 0x65, 0x00, 0x01]), 'C', 'x.csv');
    expect(binary.status).toBe(422);
    const big = await upload(c, garden.id, 'date,high,low\n' + '2025-01-01,1,0\n'.repeat(160_000));
    expect(big.status).toBe(413);
    const noUnit = await c
      .post(`/api/gardens/${garden.id}/weather/imports`)
      .set('X-Requested-With', 'heatclock')
      .attach('file', Buffer.from('date,high,low\n2025-01-01,1,0\n'), { filename: 'a.csv', contentType: 'text/csv' });
    expect(noUnit.status).toBe(400);
    expect(noUnit.body.error.fields.unit).toMatch(/F or C/);
    const v = agent(app);
    await signIn(v, viewer.email);
    expect((await upload(v, garden.id, 'date,high,low\n2025-01-01,1,0\n')).status).toBe(403);
    expect(await storedCount(garden.id)).toBe(0);
  });

  it('when NOAA daily data from the vega-datasets package is imported, then every day is stored exactly', async () => {
    // Source: NOAA daily max/min for Seattle 2012–2015 in °C, shipped by the npm package vega-datasets (SCIENCE.md §9).
    const text = readFileSync(path.join(projectRoot, 'node_modules/vega-datasets/data/seattle-weather.csv'));
    const { c, garden } = await growerOfNewGarden();
    const res = await upload(c, garden.id, text, 'C', 'seattle-weather.csv');
    expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(201);
    const records = parse(text, { columns: true }) as Array<{ date: string; temp_max: string; temp_min: string }>;
    expect(res.body.import.rowsAdded).toBe(records.length);
    const stored = await sequelize.query<{ date: string; tmax: number; tmin: number }>(
      'SELECT date, tmax_c AS tmax, tmin_c AS tmin FROM garden_weather_days WHERE garden_id = ? ORDER BY date',
      { replacements: [garden.id], type: QueryTypes.SELECT },
    );
    expect(stored.length).toBe(records.length);
    const byDate = new Map(stored.map((s) => [s.date, s]));
    for (const r of records) {
      const s = byDate.get(r.date)!;
      expect(Number(s.tmax), r.date).toBe(Number(r.temp_max));
      expect(Number(s.tmin), r.date).toBe(Number(r.temp_min));
    }
  });
});
