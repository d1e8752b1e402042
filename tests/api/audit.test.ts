import { afterEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { testApp, testDb } from '../helpers/test-app';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { createGarden } from '../helpers/factories';
import { User } from '../../server/db/models';
import { recordAudit } from '../../server/modules/audit/audit';
import { inTransaction } from '../../server/lib/transaction';
import { localDate } from '../../server/lib/local-date';

const app = testApp();
const { sequelize } = testDb();

interface Entry {
  id: number;
  at: string;
  actor: { id: number | null; name: string };
  entity: string;
  entityId: string | null;
  action: string;
  summary: string;
  changes: { field: string; label: string; from?: unknown; to?: unknown }[];
}

type Clients = Awaited<ReturnType<typeof gardenWithClients>>;

/** The garden's trail as its owner reads it (newest first). */
async function trail(a: Clients, query = ''): Promise<Entry[]> {
  const res = await a.clients.owner.get(`${a.base}/audit?pageSize=200${query}`);
  expect(res.status).toBe(200);
  return res.body.items as Entry[];
}

const changeOf = (e: Entry, field: string) => e.changes.find((c) => c.field === field);

const plantingBody = (bedId: number, varietyId: number) => ({
  bedId,
  varietyId,
  seedLotId: null,
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
  notes: '',
});

const packet = {
  cropKey: 'spinach',
  name: 'Trail Savoy',
  dtmDays: 42,
  dtmFrom: 'emergence',
  emergenceDaysMin: 6,
  emergenceDaysMax: 10,
  boltTolerance: 4,
  heatTolerance: 2,
  traits: ['f1-hybrid'],
  containerFriendly: true,
  sunHours: 6,
  waterCmPerWeek: 2.5,
  sowDepthCm: 1.5,
  spacingCm: 8,
  thinSpacingCm: 10,
  gddTargetOverrideC: null,
  notes: '',
};

const triggers: string[] = [];
/** Makes a table refuse this garden's rows, as a failing write inside the transaction would. */
async function refuseInserts(table: string, gardenId: number) {
  const name = `refuse_${table}_${gardenId}`;
  await sequelize.query(
    `CREATE TRIGGER ${name} BEFORE INSERT ON ${table} FOR EACH ROW
       IF NEW.garden_id = ${gardenId} THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'refused by test'; END IF`,
  );
  triggers.push(name);
}
afterEach(async () => {
  for (const t of triggers.splice(0)) await sequelize.query(`DROP TRIGGER IF EXISTS ${t}`);
});

async function storedJson(gardenId: number): Promise<string> {
  const rows = await sequelize.query<Record<string, unknown>>('SELECT * FROM audit_entries WHERE garden_id = ?', { replacements: [gardenId], type: QueryTypes.SELECT });
  return JSON.stringify(rows);
}

function uploadStation(a: Clients, csv: string) {
  return a.clients.grower
    .post(`${a.base}/weather/imports`)
    .field('unit', 'C')
    .attach('file', Buffer.from(csv), { filename: 'station.csv', contentType: 'text/csv' });
}

describe('audit trail', () => {
  it('when a grower adds, changes and deletes a planting, then each step is an entry by that grower with its fields', async () => {
    const a = await gardenWithClients(app);
    const bed = await makeBed(a.garden.id, 'North 2');
    const variety = await makeVariety(a.garden.id, { name: 'Copperleaf Butterhead' });
    const created = await a.clients.grower.post(`${a.base}/plantings`).send(plantingBody(bed.id, variety.id));
    expect(created.status).toBe(201);
    const id = created.body.planting.id as number;
    expect((await a.clients.grower.patch(`${a.base}/plantings/${id}`).send({ sownOn: '2025-04-05' })).status).toBe(200);
    expect((await a.clients.grower.delete(`${a.base}/plantings/${id}`)).status).toBe(204);

    const [deleted, changed, added] = await trail(a, '&entity=planting');
    for (const e of [deleted, changed, added]) {
      expect(e).toMatchObject({ actor: { id: a.grower.id, name: 'Grower' }, entity: 'planting', entityId: String(id) });
      expect(Date.parse(e.at)).not.toBeNaN();
    }
    expect(added).toMatchObject({ action: 'created', summary: 'Added a planting of Copperleaf Butterhead in North 2' });
    expect(changeOf(added, 'bed')).toEqual({ field: 'bed', label: 'bed', to: 'North 2' });
    expect(changed).toMatchObject({ action: 'changed', summary: 'Changed the sowing date of Copperleaf Butterhead in North 2' });
    expect(changed.changes).toEqual([{ field: 'sownOn', label: 'sowing date', from: '2025-04-02', to: '2025-04-05' }]);
    expect(deleted).toMatchObject({ action: 'deleted', summary: 'Deleted the planting of Copperleaf Butterhead in North 2' });
    expect(changeOf(deleted, 'sownOn')).toMatchObject({ from: '2025-04-05' });
  });

  it('when a planting moves to another bed, then the change names both beds, not their ids', async () => {
    const a = await gardenWithClients(app);
    const p = await makePlanting(a.garden.id);
    const other = await makeBed(a.garden.id, 'South 1');
    await a.clients.grower.patch(`${a.base}/plantings/${p.id}`).send({ bedId: other.id, notes: 'Moved' }).expect(200);
    const [e] = await trail(a);
    expect(e.summary).toMatch(/^Changed the bed and notes of Test lettuce .* in South 1$/);
    expect(changeOf(e, 'bed')).toMatchObject({ to: 'South 1' });
    expect(changeOf(e, 'notes')).toMatchObject({ from: '', to: 'Moved' });
  });

  it('when a log entry moves a planting on (a harvest), then the planting change is in the trail; a plain note is not', async () => {
    const a = await gardenWithClients(app);
    const p = await makePlanting(a.garden.id);
    await a.clients.grower.post(`${a.base}/plantings/${p.id}/log`).send({ entryOn: '2025-05-20', kind: 'watered' }).expect(201);
    await a.clients.grower.post(`${a.base}/plantings/${p.id}/log`).send({ entryOn: '2025-05-21', kind: 'harvest', amount: 1.5, amountUnit: 'kg' }).expect(201);
    const entries = await trail(a);
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({ actor: { id: a.grower.id }, entity: 'planting', entityId: String(p.id), action: 'changed' });
    expect(entries[0].summary).toMatch(/^Changed the first harvest date and last harvest date of Test lettuce .* \(log entry: Harvest\)$/);
    expect(changeOf(entries[0], 'firstHarvestOn')).toMatchObject({ from: null, to: '2025-05-21' });
  });

  it('when a variety, a seed lot, a germination test and a bed are added, changed and deleted, then each is in the trail', async () => {
    const a = await gardenWithClients(app);
    const v = (await a.clients.grower.post(`${a.base}/varieties`).send(packet).expect(201)).body.variety;
    await a.clients.grower.patch(`${a.base}/varieties/${v.id}`).send({ dtmDays: 45 }).expect(200);
    const lotBody = { varietyId: v.id, supplier: 'Co-op', lotNumber: 'A1', packedForYear: 2024, quantity: 300, quantityUnit: 'seeds', storageNotes: '' };
    const lot = (await a.clients.grower.post(`${a.base}/seed-lots`).send(lotBody).expect(201)).body.seedLot;
    await a.clients.grower.patch(`${a.base}/seed-lots/${lot.id}`).send({ quantity: 250 }).expect(200);
    const test = (await a.clients.grower.post(`${a.base}/seed-lots/${lot.id}/germination-tests`).send({ testedOn: '2025-02-01', seedsTested: 20, germinated: 15 }).expect(201)).body.test;
    await a.clients.grower.delete(`${a.base}/seed-lots/${lot.id}/germination-tests/${test.id}`).expect(204);
    await a.clients.grower.delete(`${a.base}/seed-lots/${lot.id}`).expect(204);
    await a.clients.grower.delete(`${a.base}/varieties/${v.id}`).expect(204);
    const bed = (await a.clients.grower.post(`${a.base}/beds`).send({ name: 'Herb spiral', kind: 'bed', lengthM: 2 }).expect(201)).body.bed;
    await a.clients.grower.patch(`${a.base}/beds/${bed.id}`).send({ name: 'Spiral' }).expect(200);
    await a.clients.grower.delete(`${a.base}/beds/${bed.id}`).expect(204);

    const entries = (await trail(a)).reverse();
    expect(entries.map((e) => [e.entity, e.action, e.summary])).toEqual([
      ['variety', 'created', 'Added the variety Trail Savoy'],
      ['variety', 'changed', 'Changed the days to maturity of Trail Savoy'],
      ['seed-lot', 'created', 'Added the seed lot of Trail Savoy (Co-op, lot A1, packed for 2024)'],
      ['seed-lot', 'changed', 'Changed the quantity of the seed lot of Trail Savoy (Co-op, lot A1, packed for 2024)'],
      ['germination-test', 'created', 'Recorded a germination test of the seed lot of Trail Savoy (Co-op, lot A1, packed for 2024): 15 of 20 seeds came up'],
      ['germination-test', 'deleted', expect.stringMatching(/^Deleted the germination test of the seed lot of Trail Savoy .* from 1 Feb 2025$/)],
      ['seed-lot', 'deleted', 'Deleted the seed lot of Trail Savoy (Co-op, lot A1, packed for 2024)'],
      ['variety', 'deleted', 'Deleted the variety Trail Savoy'],
      ['bed', 'created', 'Added the bed Herb spiral'],
      ['bed', 'changed', 'Changed the name of the bed Spiral'],
      ['bed', 'deleted', 'Deleted the bed Spiral'],
    ]);
    for (const e of entries) expect(e.actor).toEqual({ id: a.grower.id, name: 'Grower' });
    expect(entries[1].changes).toEqual([{ field: 'dtmDays', label: 'days to maturity', from: 42, to: 45 }]);
    expect(entries[3].changes).toEqual([{ field: 'quantity', label: 'quantity', from: 300, to: 250 }]);
    expect(changeOf(entries[4], 'germinated')).toMatchObject({ to: 15 });
    expect(entries[9].changes).toEqual([{ field: 'name', label: 'name', from: 'Herb spiral', to: 'Spiral' }]);
  });

  it('when a grower records and deletes a soil reading, then both are entries with the value stored in °C and worded in the garden’s °F', async () => {
    const a = await gardenWithClients(app);
    const today = localDate(a.garden.timeZone);
    const reading = (await a.clients.grower.post(`${a.base}/soil/readings`).send({ readOn: today, temperature: 54.5, depthCm: 5, note: 'by the beans' }).expect(201)).body.reading;
    await a.clients.grower.delete(`${a.base}/soil/readings/${reading.id}`).expect(204);
    const [deleted, created] = await trail(a, '&entity=soil-reading');
    for (const e of [deleted, created]) expect(e).toMatchObject({ entity: 'soil-reading', entityId: String(reading.id), actor: { id: a.grower.id, name: 'Grower' } });
    expect(created.action).toBe('created');
    expect(created.summary).toMatch(/^Recorded a soil reading of 54\.5 °F on /);
    expect(created.changes).toEqual([
      { field: 'readOn', label: 'reading date', to: today },
      { field: 'soilC', label: 'soil temperature', to: 12.5 },
      { field: 'depthCm', label: 'depth', to: 5 },
      { field: 'note', label: 'note', to: 'by the beans' },
    ]);
    expect(deleted.action).toBe('deleted');
    expect(deleted.summary).toMatch(/^Deleted a soil reading of 54\.5 °F on /);
    expect(changeOf(deleted, 'soilC')).toEqual({ field: 'soilC', label: 'soil temperature', from: 12.5 });
  });

  it('when an owner changes the garden, a crop and the climate facts, then each is an entry by the owner', async () => {
    const a = await gardenWithClients(app);
    await a.clients.owner.patch(a.base).send({ name: 'Hill plot', elevationM: 210 }).expect(200);
    await a.clients.owner.patch(`${a.base}/crops/lettuce`).send({ params: { baseC: { value: 3, note: 'cold valley' } } }).expect(200);
    await a.clients.owner.patch(`${a.base}/crops/lettuce`).send({ params: { baseC: null } }).expect(200);
    await a.clients.owner.put(`${a.base}/climate`).send({ lastSpringFrost50: '05-01' }).expect(200);
    const [climate, cropCleared, crop, garden] = await trail(a);
    for (const e of [climate, cropCleared, crop, garden]) expect(e.actor).toEqual({ id: a.owner.id, name: 'Owner' });
    expect(garden).toMatchObject({ entity: 'garden-settings', action: 'changed', summary: 'Changed the name and elevation of the garden' });
    expect(changeOf(garden, 'elevationM')).toMatchObject({ from: null, to: 210 });
    expect(crop).toMatchObject({ entity: 'crop-settings', entityId: 'lettuce', summary: 'Changed the base temperature of Lettuce in this garden' });
    expect(crop.changes).toEqual([{ field: 'baseC', label: 'base temperature', from: null, to: 3 }]);
    expect(cropCleared.changes).toEqual([{ field: 'baseC', label: 'base temperature', from: 3, to: null }]);
    expect(climate).toMatchObject({ entity: 'climate', summary: "Changed the last spring frost of the garden's climate" });
    expect(climate.changes).toEqual([{ field: 'lastSpringFrost50', label: 'last spring frost', from: null, to: '05-01' }]);
  });

  it('when a station file is imported, then one entry counts its days; the same file again adds none', async () => {
    const a = await gardenWithClients(app);
    const csv = 'date,high,low\n2025-05-01,20,8\n2025-05-02,21,9\n2025-05-03,19,7\n';
    await uploadStation(a, csv).expect(201);
    await uploadStation(a, csv).expect(200);
    const entries = await trail(a, '&entity=weather-import');
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({ actor: { id: a.grower.id, name: 'Grower' }, action: 'imported', summary: 'Imported 3 days of station weather, 1–3 May 2025' });
    expect(changeOf(entries[0], 'file')).toMatchObject({ to: 'station.csv' });
    expect(changeOf(entries[0], 'daysAdded')).toMatchObject({ to: 3 });
  });

  it('when the entry cannot be written, then the change is not kept either (one transaction)', async () => {
    const a = await gardenWithClients(app);
    const p = await makePlanting(a.garden.id);
    await refuseInserts('audit_entries', a.garden.id);
    expect((await a.clients.grower.patch(`${a.base}/plantings/${p.id}`).send({ notes: 'Never kept' })).status).toBe(500);
    expect((await a.clients.grower.post(`${a.base}/beds`).send({ name: 'Never kept', kind: 'bed' })).status).toBe(500);
    await p.reload();
    expect(p.notes).toBe('');
    expect((await a.clients.grower.get(`${a.base}/beds?q=Never`)).body.total).toBe(0);
  });

  it('when the change fails after its entry was written, then the entry goes with it', async () => {
    const a = await gardenWithClients(app);
    // The import's event is written after its audit entry, in the same transaction.
    await refuseInserts('garden_events', a.garden.id);
    expect((await uploadStation(a, 'date,high,low\n2025-05-01,20,8\n')).status).toBe(500);
    await expect(
      inTransaction(sequelize, async (transaction) => {
        await recordAudit(transaction, { gardenId: a.garden.id, actor: null, entity: 'bed', entityId: 1, action: 'created', summary: 'Rolled back' });
        throw new Error('after the entry');
      }),
    ).rejects.toThrow('after the entry');
    expect(await trail(a)).toEqual([]);
  });

  it('when the trail is stored, then it holds no password hash and no token', async () => {
    const a = await gardenWithClients(app);
    const p = await makePlanting(a.garden.id);
    await a.clients.grower.patch(`${a.base}/plantings/${p.id}`).send({ notes: 'Checked' }).expect(200);
    await a.clients.owner.patch(a.base).send({ name: 'Renamed' }).expect(200);
    await inTransaction(sequelize, (transaction) =>
      recordAudit(transaction, {
        gardenId: a.garden.id,
        actor: { id: a.owner.id, name: 'Owner' },
        entity: 'member',
        entityId: a.grower.id,
        action: 'changed',
        summary: 'Changed a member',
        changes: { role: { from: 'viewer', to: 'grower' }, passwordHash: { to: 'x' }, tokenHash: { to: 'y' }, invite: { to: { email: 'a@b.c', token: 'secret-token' } } },
      }),
    );
    const stored = await storedJson(a.garden.id);
    for (const u of [a.owner, a.grower]) {
      const { passwordHash } = (await User.findByPk(u.id))!;
      expect(stored).not.toContain(passwordHash);
    }
    expect(stored.toLowerCase()).not.toContain('token');
    expect(stored.toLowerCase()).not.toContain('password');
    expect(stored).toContain('grower');
  });

  it('when growers, viewers or outsiders ask for the trail, then 403, 403 and 404; the owner reads it', async () => {
    const a = await gardenWithClients(app);
    expect((await a.clients.owner.get(`${a.base}/audit`)).body).toEqual({ items: [], page: 1, pageSize: 50, total: 0, actors: [] });
    expect((await a.clients.grower.get(`${a.base}/audit`)).status).toBe(403);
    expect((await a.clients.viewer.get(`${a.base}/audit`)).status).toBe(403);
    expect((await a.clients.outsider.get(`${a.base}/audit`)).status).toBe(404);
    const other = await createGarden();
    expect((await a.clients.owner.get(`/api/gardens/${other.id}/audit`)).status).toBe(404);
  });

  it('when the trail is filtered and paged, then the matching entries come newest first with the total', async () => {
    const a = await gardenWithClients(app);
    const bed = await makeBed(a.garden.id, 'Filter bed');
    await a.clients.grower.patch(`${a.base}/beds/${bed.id}`).send({ notes: 'one' }).expect(200);
    await a.clients.owner.patch(`${a.base}/beds/${bed.id}`).send({ notes: 'two' }).expect(200);
    await a.clients.grower.patch(`${a.base}/beds/${bed.id}`).send({ notes: 'three' }).expect(200);
    await a.clients.owner.patch(a.base).send({ name: 'Filtered garden' }).expect(200);

    const all = await a.clients.owner.get(`${a.base}/audit`);
    expect(all.body.total).toBe(4);
    expect(all.body.items.map((e: Entry) => e.id)).toEqual([...all.body.items.map((e: Entry) => e.id)].sort((x, y) => y - x));
    expect(all.body.actors).toEqual([
      { id: a.grower.id, name: 'Grower' },
      { id: a.owner.id, name: 'Owner' },
    ]);

    const page2 = await a.clients.owner.get(`${a.base}/audit?entity=bed&pageSize=2&page=2`);
    expect(page2.body).toMatchObject({ page: 2, pageSize: 2, total: 3 });
    expect(page2.body.items.map((e: Entry) => changeOf(e, 'notes')?.to)).toEqual(['one']);

    const byGrower = await a.clients.owner.get(`${a.base}/audit?actor=${a.grower.id}`);
    expect(byGrower.body.items.map((e: Entry) => changeOf(e, 'notes')?.to)).toEqual(['three', 'one']);

    // From and To are the garden's own days (America/Chicago here), both included.
    const today = localDate(a.garden.timeZone);
    expect((await a.clients.owner.get(`${a.base}/audit?from=${today}&to=${today}`)).body.total).toBe(4);
    expect((await a.clients.owner.get(`${a.base}/audit?to=2000-12-31`)).body.total).toBe(0);
    expect((await a.clients.owner.get(`${a.base}/audit?from=2199-12-31`)).body.total).toBe(0);
  });

  it('when query parameters are wrong, then 400 names each field', async () => {
    const a = await gardenWithClients(app);
    const cases: [string, string][] = [
      ['entity=roses', 'entity'],
      ['actor=abc', 'actor'],
      ['from=yesterday', 'from'],
      ['to=2025-13-01', 'to'],
      ['from=2025-05-02&to=2025-05-01', 'to'],
      ['page=0', 'page'],
      ['pageSize=500', 'pageSize'],
      ['colour=red', 'colour'],
    ];
    for (const [query, field] of cases) {
      const res = await a.clients.owner.get(`${a.base}/audit?${query}`);
      expect(res.status, query).toBe(400);
      expect(res.body.error.fields, query).toHaveProperty(field);
    }
  });
});
