import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { testApp } from '../helpers/test-app';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { Planting, PlantingLog } from '../../server/db/models';

const app = testApp();

const HEADER = 'bed,crop,variety,seed_lot,method,status,quantity,quantity_unit,sown,emerged,thinned,transplanted,first_harvest,last_harvest,bolted,notes,log_date,log_kind,log_amount,log_unit,log_note';

describe('plantings CSV', () => {
  it('when a planting’s text starts with = + - @, then the export prefixes a quote and quotes per RFC 4180', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id, '=HYPERLINK("http://x.example")');
    const variety = await makeVariety(garden.id, { name: '+Plus "quoted", with comma' });
    const p = await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, notes: '@SUM(A1)\nsecond line' });
    await PlantingLog.create({ gardenId: garden.id, plantingId: p.id, entryOn: '2025-04-10', kind: 'observation', amount: null, amountUnit: null, note: '-2 frost marks', photoId: null, createdBy: null });
    const res = await clients.viewer.get(`${base}/plantings/export.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="plantings-\d{4}-\d{2}-\d{2}\.csv"$/);
    const text = res.text.replace(/^\uFEFF/, '');
    expect(text.split('\r\n')[0]).toBe(HEADER);
    expect(text).toContain(`"'=HYPERLINK(""http://x.example"")"`);
    expect(text).toContain(`"'+Plus ""quoted"", with comma"`);
    const rows = parse(text, { columns: true }) as Record<string, string>[];
    expect(rows[0]).toMatchObject({ bed: `'=HYPERLINK("http://x.example")`, notes: "'@SUM(A1)\nsecond line", log_note: "'-2 frost marks" });
  });

  it('when a cell holds line breaks, tabs or apostrophes, then every line is neutralised and quoted, and the file re-imports unchanged', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const bed = await makeBed(garden.id, 'Bed one');
    const variety = await makeVariety(garden.id, { name: 'Plain' });
    // OWASP CSV injection: = + - @ tab CR start a formula; a bare LF or CR starts a new spreadsheet row.
    const tricky = ['=1+1\n=2+2', "'\r=1+1", ' =1+1', "'=x", '\t=cmd', 'ok\r\n+1', "''keep"];
    const made = [];
    for (const [i, notes] of tricky.entries()) made.push(await makePlanting(garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: `2025-04-${String(10 + i)}`, notes }));
    await PlantingLog.create({ gardenId: garden.id, plantingId: made[0].id, entryOn: '2025-04-20', kind: 'observation', amount: null, amountUnit: null, note: '@x\r-y', photoId: null, createdBy: null });
    const res = await clients.viewer.get(`${base}/plantings/export.csv`);
    const text = res.text.replace(/^\uFEFF/, '');
    // Outside quotes, the only line breaks are the CRLF record ends: one per planting row and the header.
    const unquoted = text.replace(/"(?:[^"]|"")*"/g, '');
    expect(unquoted.match(/\r\n|\r|\n/g)).toHaveLength(tricky.length + 1);
    const rows = parse(text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(tricky.length);
    for (const row of rows) for (const cell of Object.values(row)) for (const line of cell.split(/\r\n|\r|\n/)) expect(line).not.toMatch(/^[=+\-@\t\r]/);
    const again = await clients.grower.post(`${base}/plantings/import`).attach('file', Buffer.from(res.text), 'export.csv');
    expect(again.status).toBe(200);
    expect(again.body.report).toEqual({ plantingsCreated: 0, plantingsUpdated: 0, plantingsUnchanged: tricky.length, logEntriesCreated: 0, logEntriesExisting: 1 });
    for (const [i, p] of made.entries()) expect((await Planting.findByPk(p.id))!.notes).toBe(tricky[i]);
  });

  it('when an exported file is imported again, then nothing changes; a new file is imported all at once', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await makeBed(garden.id, 'North 1');
    await makeVariety(garden.id, { cropKey: 'spinach', name: 'Longwinter' });
    const csv = [
      HEADER,
      'North 1,spinach,Longwinter,,direct-sow,harvested,3,row-m,2025-03-20,2025-03-30,,,2025-05-05,2025-05-20,,=1+1,2025-05-05,harvest,1.2,kg,first cut',
      'North 1,Spinach,longwinter,,direct-sow,harvested,3,row-m,2025-03-20,2025-03-30,,,2025-05-05,2025-05-20,,=1+1,2025-05-20,harvest,0.8,kg,last cut',
      'North 1,spinach,Longwinter,,direct-sow,planned,,plants,,,,,,,,,,,,,',
    ].join('\n');
    const first = await clients.grower.post(`${base}/plantings/import`).attach('file', Buffer.from(csv), 'plantings.csv');
    expect(first.status).toBe(200);
    expect(first.body.report).toEqual({ plantingsCreated: 2, plantingsUpdated: 0, plantingsUnchanged: 0, logEntriesCreated: 2, logEntriesExisting: 0 });
    const again = await clients.grower.post(`${base}/plantings/import`).attach('file', Buffer.from(csv), 'plantings.csv');
    expect(again.body.report).toEqual({ plantingsCreated: 0, plantingsUpdated: 0, plantingsUnchanged: 2, logEntriesCreated: 0, logEntriesExisting: 2 });
    const exported = await clients.grower.get(`${base}/plantings/export.csv`);
    const roundTrip = await clients.grower.post(`${base}/plantings/import`).attach('file', Buffer.from(exported.text), 'export.csv');
    expect(roundTrip.body.report).toMatchObject({ plantingsCreated: 0, plantingsUpdated: 0, logEntriesCreated: 0 });
    expect(await Planting.count({ where: { gardenId: garden.id } })).toBe(2);
    const p = await Planting.findOne({ where: { gardenId: garden.id, status: 'harvested' } });
    expect(p!.notes).toBe('=1+1');
    // The owner's trail holds one entry for the file that changed something, none for the repeats.
    const trail = (await clients.owner.get(`${base}/audit?entity=planting`).expect(200)).body.items as { action: string; summary: string; actor: { name: string } }[];
    expect(trail.filter((e) => e.action === 'imported').map((e) => e.summary)).toEqual(['Imported a plantings file: 2 plantings added, 2 log entries added']);
    expect(trail[0].actor.name).toBe('Grower');
  });

  it('when any row is wrong, then 422 reports line and column and nothing is imported', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await makeBed(garden.id, 'North 1');
    await makeVariety(garden.id, { cropKey: 'radish', name: 'Emberglobe' });
    const csv = [
      HEADER,
      'North 1,radish,Emberglobe,,direct-sow,growing,,plants,2025-04-01,,,,,,,,,,,,',
      'Bed 99,radish,Emberglobe,,direct-sow,growing,,plants,2025-04-02,,,,,,,,,,,,',
      'North 1,radish,Nope,,scatter,growing,,plants,2025-13-40,,,,,,,,,,,,',
    ].join('\r\n');
    const res = await clients.grower.post(`${base}/plantings/import`).attach('file', Buffer.from(csv), 'plantings.csv');
    expect(res.status).toBe(422);
    const at = (res.body.error.rows as Array<{ line: number; column: string }>).map((r) => `line ${r.line}, ${r.column}`);
    expect(at).toEqual(expect.arrayContaining(['line 3, bed', 'line 4, variety', 'line 4, method', 'line 4, sown']));
    expect(await Planting.count({ where: { gardenId: garden.id } })).toBe(0);
  });

  it('when a viewer imports, or the file is missing or has unknown columns, then 403 or 400/422', async () => {
    const { clients, base } = await gardenWithClients(app);
    expect((await clients.viewer.post(`${base}/plantings/import`).attach('file', Buffer.from(HEADER), 'p.csv')).status).toBe(403);
    expect((await clients.grower.post(`${base}/plantings/import`).send({})).status).toBe(400);
    const unknown = await clients.grower.post(`${base}/plantings/import`).attach('file', Buffer.from('bed,crop,colour\nA,b,c\n'), 'p.csv');
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.rows).toContainEqual({ line: 1, column: 'colour', message: 'Unknown column "colour".' });
    expect((await clients.outsider.get(`${base}/plantings/export.csv`)).status).toBe(404);
  });
});
