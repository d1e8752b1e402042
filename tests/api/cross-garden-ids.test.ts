import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { QueryTypes } from 'sequelize';
import { testApp, testDb, testWeather } from '../helpers/test-app';
import type { TestAgent } from '../helpers/test-app';
import { addMember } from '../helpers/factories';
import { gardenWithClients, makeBed, makeLot, makePlanting, makeVariety } from '../helpers/garden-records';
import { giveGardenWeather, steadyDays } from '../helpers/garden-weather';
import { addDays } from '#shared/thermal/dates';
import type { RouteTableEntry } from '../../server/lib/routes';

const TODAY = '2026-06-10';
const app = testApp({}, testWeather({}, () => new Date(`${TODAY}T17:00:00Z`)));
const { sequelize } = testDb();

/** Every table of a garden's records, row by row, so "unchanged" means every column of every row. */
const TABLES = ['beds', 'varieties', 'seed_lots', 'germination_tests', 'plantings', 'planting_logs', 'planting_photos', 'alerts', 'memberships', 'garden_invitations', 'soil_readings'];
async function snapshot(gardenId: number) {
  const out: Record<string, unknown[]> = {};
  for (const t of TABLES) out[t] = await sequelize.query(`SELECT * FROM ${t} WHERE garden_id = ? ORDER BY id`, { replacements: [gardenId], type: QueryTypes.SELECT });
  return out;
}

async function png() {
  return sharp({ create: { width: 24, height: 24, channels: 3, background: { r: 30, g: 140, b: 50 } } }).png().toBuffer();
}

/** Garden B with one record of every kind, made through its own members and the API where the API makes them. */
async function gardenWithEverything() {
  const b = await gardenWithClients(app);
  // Warm forecast days over a bolt-prone lettuce: the evaluation raises a bolt-risk alert.
  await giveGardenWeather(sequelize, b.garden, [...steadyDays('2021-01-01', addDays(TODAY, -1), 18, 9), ...steadyDays(TODAY, addDays(TODAY, 6), 31, 18, 'forecast')]);
  const bed = await makeBed(b.garden.id, `B bed ${b.garden.id}`);
  const variety = await makeVariety(b.garden.id, { name: `B lettuce ${b.garden.id}`, dtmDays: 55, boltTolerance: 1 });
  const lot = await makeLot(b.garden.id, variety.id, { lotNumber: `B-LOT-${b.garden.id}` });
  const planting = await makePlanting(b.garden.id, { bedId: bed.id, varietyId: variety.id, sownOn: '2026-05-01' });
  const test = await b.clients.grower.post(`${b.base}/seed-lots/${lot.id}/germination-tests`).send({ testedOn: '2026-04-01', seedsTested: 20, germinated: 17 }).expect(201);
  const entry = await b.clients.grower.post(`${b.base}/plantings/${planting.id}/log`).send({ entryOn: '2026-05-10', kind: 'watered' }).expect(201);
  const photo = await b.clients.grower.post(`${b.base}/plantings/${planting.id}/photos`).attach('photo', await png(), 'leaf.png').expect(201);
  const reading = await b.clients.grower.post(`${b.base}/soil/readings`).send({ readOn: addDays(TODAY, -1), temperature: 12 }).expect(201);
  const alerts = (await b.clients.viewer.get(`${b.base}/alerts?type=bolt-risk`).expect(200)).body.items as { id: number }[];
  expect(alerts.length).toBeGreaterThan(0);
  return {
    ...b,
    ids: {
      bedId: bed.id,
      varietyId: variety.id,
      seedLotId: lot.id,
      testId: test.body.test.id as number,
      plantingId: planting.id,
      entryId: entry.body.entry.id as number,
      photoId: photo.body.photo.id as number,
      alertId: alerts[0].id,
      readingId: reading.body.reading.id as number,
    },
    names: { bed: bed.name, variety: variety.name, lot: lot.lotNumber },
  };
}

type Call = { route: string; url: string; send?: object; attach?: Buffer };

describe('another garden’s record ids', () => {
  it('when a member of both gardens uses garden B’s ids under garden A, then every record route answers 404 and B is unchanged', async () => {
    const a = await gardenWithClients(app);
    const b = await gardenWithEverything();
    // A's owner is a grower in B too: only the garden in the path can keep B's records out.
    await addMember(a.owner.id, b.garden.id, 'grower');
    const own = { planting: await makePlanting(a.garden.id), lot: await makeLot(a.garden.id, (await makeVariety(a.garden.id)).id) };
    const B = b.ids;
    const invitation = (await b.clients.owner.post(`${b.base}/invitations`).send({ email: 'invited-b@test.example', role: 'viewer' }).expect(201)).body.invitation as { id: number };
    const A = a.base;
    const g = '/api/gardens/:gardenId';
    // Another user's session, as its owner sees it in the account page's list.
    const theirSession = ((await b.clients.owner.get('/api/me/sessions').expect(200)).body.items as { id: string }[])[0].id;
    const calls: Call[] = [
      { route: `get ${g}/beds/:bedId`, url: `${A}/beds/${B.bedId}` },
      { route: `patch ${g}/beds/:bedId`, url: `${A}/beds/${B.bedId}`, send: { notes: 'moved' } },
      { route: `delete ${g}/beds/:bedId`, url: `${A}/beds/${B.bedId}` },
      { route: `get ${g}/varieties/:varietyId`, url: `${A}/varieties/${B.varietyId}` },
      { route: `patch ${g}/varieties/:varietyId`, url: `${A}/varieties/${B.varietyId}`, send: { notes: 'changed' } },
      { route: `delete ${g}/varieties/:varietyId`, url: `${A}/varieties/${B.varietyId}` },
      { route: `get ${g}/seed-lots/:seedLotId`, url: `${A}/seed-lots/${B.seedLotId}` },
      { route: `patch ${g}/seed-lots/:seedLotId`, url: `${A}/seed-lots/${B.seedLotId}`, send: { storageNotes: 'fridge' } },
      { route: `delete ${g}/seed-lots/:seedLotId`, url: `${A}/seed-lots/${B.seedLotId}` },
      { route: `post ${g}/seed-lots/:seedLotId/germination-tests`, url: `${A}/seed-lots/${B.seedLotId}/germination-tests`, send: { testedOn: '2026-04-02', seedsTested: 10, germinated: 9 } },
      { route: `delete ${g}/seed-lots/:seedLotId/germination-tests/:testId`, url: `${A}/seed-lots/${B.seedLotId}/germination-tests/${B.testId}` },
      { route: `delete ${g}/seed-lots/:seedLotId/germination-tests/:testId`, url: `${A}/seed-lots/${own.lot.id}/germination-tests/${B.testId}` },
      { route: `get ${g}/seed-lots/:seedLotId/seeds-to-sow`, url: `${A}/seed-lots/${B.seedLotId}/seeds-to-sow?plants=10` },
      { route: `get ${g}/plantings/:plantingId`, url: `${A}/plantings/${B.plantingId}` },
      { route: `patch ${g}/plantings/:plantingId`, url: `${A}/plantings/${B.plantingId}`, send: { notes: 'changed' } },
      { route: `delete ${g}/plantings/:plantingId`, url: `${A}/plantings/${B.plantingId}` },
      { route: `get ${g}/plantings/:plantingId/log`, url: `${A}/plantings/${B.plantingId}/log` },
      { route: `post ${g}/plantings/:plantingId/log`, url: `${A}/plantings/${B.plantingId}/log`, send: { entryOn: '2026-05-11', kind: 'fed' } },
      { route: `delete ${g}/plantings/:plantingId/log/:entryId`, url: `${A}/plantings/${B.plantingId}/log/${B.entryId}` },
      { route: `delete ${g}/plantings/:plantingId/log/:entryId`, url: `${A}/plantings/${own.planting.id}/log/${B.entryId}` },
      { route: `get ${g}/plantings/:plantingId/progress`, url: `${A}/plantings/${B.plantingId}/progress` },
      { route: `get ${g}/plantings/:plantingId/degree-days.csv`, url: `${A}/plantings/${B.plantingId}/degree-days.csv` },
      { route: `get ${g}/varieties/:varietyId/calibration`, url: `${A}/varieties/${B.varietyId}/calibration` },
      { route: `post ${g}/alerts/:alertId/acknowledge`, url: `${A}/alerts/${B.alertId}/acknowledge` },
      { route: `get ${g}/plantings/:plantingId/photos`, url: `${A}/plantings/${B.plantingId}/photos` },
      { route: `post ${g}/plantings/:plantingId/photos`, url: `${A}/plantings/${B.plantingId}/photos`, attach: await png() },
      { route: `get ${g}/plantings/:plantingId/photos/:photoId`, url: `${A}/plantings/${B.plantingId}/photos/${B.photoId}` },
      { route: `get ${g}/plantings/:plantingId/photos/:photoId`, url: `${A}/plantings/${own.planting.id}/photos/${B.photoId}` },
      { route: `delete ${g}/plantings/:plantingId/photos/:photoId`, url: `${A}/plantings/${B.plantingId}/photos/${B.photoId}` },
      { route: `delete ${g}/plantings/:plantingId/photos/:photoId`, url: `${A}/plantings/${own.planting.id}/photos/${B.photoId}` },
      { route: `delete ${g}/soil/readings/:readingId`, url: `${A}/soil/readings/${B.readingId}` },
      { route: `patch ${g}/members/:userId`, url: `${A}/members/${b.owner.id}`, send: { role: 'viewer' } },
      { route: `delete ${g}/members/:userId`, url: `${A}/members/${b.owner.id}` },
      { route: `get ${g}/invitations/:invitationId/test-mail`, url: `${A}/invitations/${invitation.id}/test-mail` },
      { route: `delete ${g}/invitations/:invitationId`, url: `${A}/invitations/${invitation.id}` },
      { route: 'delete /api/me/sessions/:id', url: `/api/me/sessions/${theirSession}` },
    ];

    // Every mounted route that takes a record id is tried; a new one without a line here fails.
    const table = app.locals.routes as RouteTableEntry[];
    const recordRoutes = table.filter((r) => /:(?!gardenId\b|cropKey\b|token\b)\w+/.test(r.path)).map((r) => `${r.method} ${r.path}`);
    expect([...new Set(calls.map((c) => c.route))].sort()).toEqual(recordRoutes.sort());

    const before = await snapshot(b.garden.id);
    const client: TestAgent = a.clients.owner;
    for (const c of calls) {
      const method = c.route.split(' ')[0] as 'get' | 'patch' | 'delete' | 'post';
      let req = client[method](c.url);
      req = c.attach ? req.attach('photo', c.attach, 'leaf.png') : c.send ? req.send(c.send) : req;
      const res = await req;
      expect(res.status, `${c.route} → ${c.url}`).toBe(404);
      expect(res.body.error?.code, c.url).toBe('not_found');
    }
    expect(await snapshot(b.garden.id)).toEqual(before);
    // B's owner is still signed in there; B's own members still see their records, photo file included.
    expect((await b.clients.owner.get('/api/auth/me')).status).toBe(200);
    expect((await b.clients.viewer.get(`${b.base}/plantings/${B.plantingId}/photos/${B.photoId}`)).status).toBe(200);
  });

  it('when garden A imports a CSV naming garden B’s bed, variety and seed lot, then every line is refused as unknown and B is unchanged', async () => {
    const a = await gardenWithClients(app);
    const b = await gardenWithEverything();
    await addMember(a.owner.id, b.garden.id, 'grower');
    const before = await snapshot(b.garden.id);
    const header = 'bed,crop,variety,seed_lot,method,status,quantity,quantity_unit,sown,emerged,thinned,transplanted,first_harvest,last_harvest,bolted,notes,log_date,log_kind,log_amount,log_unit,log_note';
    const csv = `${header}\n${b.names.bed},lettuce,${b.names.variety},${b.names.lot},direct-sow,growing,10,plants,2026-05-02,,,,,,,,2026-05-12,watered,,,\n`;
    const res = await a.clients.owner.post(`${a.base}/plantings/import`).attach('file', Buffer.from(csv), { filename: 'p.csv', contentType: 'text/csv' });
    expect(res.status).toBe(422);
    const columns = (res.body.error.rows as { line: number; column: string }[]).filter((r) => r.line === 2).map((r) => r.column);
    expect(columns).toEqual(expect.arrayContaining(['bed', 'variety']));
    expect(await snapshot(b.garden.id)).toEqual(before);
    expect((await snapshot(a.garden.id)).plantings).toEqual([]);
  });
});
