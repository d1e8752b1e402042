import { describe, expect, it } from 'vitest';
import { testApp, testDb } from '../helpers/test-app';
import { gardenWithClients, makeBed, makePlanting, makeVariety } from '../helpers/garden-records';
import { Garden, Planting } from '../../server/db/models';

const app = testApp();

function sowing(ids: { bedId: number; varietyId: number }, sownOn: string) {
  return {
    bedId: ids.bedId,
    varietyId: ids.varietyId,
    seedLotId: null,
    method: 'direct-sow',
    status: 'growing',
    quantity: 3,
    quantityUnit: 'row-m',
    sownOn,
    emergedOn: null,
    thinnedOn: null,
    transplantedOn: null,
    firstHarvestOn: null,
    lastHarvestOn: null,
    boltedOn: null,
    notes: '',
  };
}

async function stored(id: number) {
  return (await Planting.findByPk(id))!.seasonYear;
}

async function southern(garden: Garden) {
  await garden.update({ latitude: -37.8, longitude: 145, timeZone: 'Australia/Melbourne' });
}

describe('a planting’s season, stored from its start event (hemisphere-aware)', () => {
  it('when a northern garden sows in March 2026, then the stored season is 2026 and reads "2026"', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const ids = { bedId: (await makeBed(garden.id)).id, varietyId: (await makeVariety(garden.id)).id };
    const res = await clients.grower.post(`${base}/plantings`).send(sowing(ids, '2026-03-10'));
    expect(res.status).toBe(201);
    expect(res.body.planting.season).toBe('2026');
    expect(await stored(res.body.planting.id)).toBe(2026);
  });

  it('when a southern garden sows in August 2025 and in March 2026, then both belong to the 2025–26 season', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await southern(garden);
    const ids = { bedId: (await makeBed(garden.id)).id, varietyId: (await makeVariety(garden.id)).id };
    const august = await clients.grower.post(`${base}/plantings`).send(sowing(ids, '2025-08-20'));
    const march = await clients.grower.post(`${base}/plantings`).send(sowing(ids, '2026-03-10'));
    expect([august.status, march.status]).toEqual([201, 201]);
    expect([august.body.planting.season, march.body.planting.season]).toEqual(['2025–26', '2025–26']);
    expect([await stored(august.body.planting.id), await stored(march.body.planting.id)]).toEqual([2025, 2025]);
    // 30 June is still the old season's last day, 1 July the new one's first.
    const june = await makePlanting(garden.id, { ...ids, sownOn: '2026-06-30' });
    const july = await makePlanting(garden.id, { ...ids, sownOn: '2026-07-01' });
    expect([await stored(june.id), await stored(july.id)]).toEqual([2025, 2026]);
  });

  it('when the sowing date is moved across a season boundary, then the stored season follows', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const p = await makePlanting(garden.id, { sownOn: '2025-12-20' });
    expect(await stored(p.id)).toBe(2025);
    const res = await clients.grower.patch(`${base}/plantings/${p.id}`).send({ sownOn: '2026-01-05' });
    expect(res.status).toBe(200);
    expect(res.body.planting.season).toBe('2026');
    expect(await stored(p.id)).toBe(2026);
  });

  it('when an indoor start is set out, then its season comes from the transplant date, and none before', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await southern(garden);
    const p = await makePlanting(garden.id, { method: 'indoor-start', status: 'planned', sownOn: '2025-06-01', transplantedOn: null });
    expect(await stored(p.id)).toBeNull();
    const res = await clients.grower.patch(`${base}/plantings/${p.id}`).send({ status: 'growing', transplantedOn: '2025-09-01' });
    expect(res.status).toBe(200);
    expect(res.body.planting.season).toBe('2025–26');
    expect(await stored(p.id)).toBe(2025);
  });

  it('when the planting changes variety or its variety counts its days another way, then the season stays (it rests on the start day only)', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const first = await makeVariety(garden.id);
    const p = await makePlanting(garden.id, { varietyId: first.id, sownOn: '2025-05-01' });
    const other = await makeVariety(garden.id, { dtmFrom: 'transplant' });
    const res = await clients.grower.patch(`${base}/plantings/${p.id}`).send({ varietyId: other.id });
    expect(res.status).toBe(200);
    expect(await stored(p.id)).toBe(2025);
    await other.update({ dtmFrom: 'emergence' });
    expect(await stored(p.id)).toBe(2025);
  });

  it('when the garden’s latitude flips hemisphere, then all its plantings are re-seasoned in that change', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    const march = await makePlanting(garden.id, { sownOn: '2026-03-10' });
    const august = await makePlanting(garden.id, { sownOn: '2025-08-20' });
    expect([await stored(march.id), await stored(august.id)]).toEqual([2026, 2025]);
    const south = await clients.owner.patch(base).send({ latitude: -41.3, longitude: 174.8, timeZone: 'Pacific/Auckland' });
    expect(south.status).toBe(200);
    expect([await stored(march.id), await stored(august.id)]).toEqual([2025, 2025]);
    const list = await clients.viewer.get(`${base}/plantings`);
    expect(list.body.items.map((p: { season: string }) => p.season)).toEqual(['2025–26', '2025–26']);
    await clients.owner.patch(base).send({ latitude: 45, longitude: -93, timeZone: 'America/Chicago' });
    expect([await stored(march.id), await stored(august.id)]).toEqual([2026, 2025]);
  });

  it('when a log entry moves a planting’s stages, then the same rule rewrites its season', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await southern(garden);
    const p = await makePlanting(garden.id, { status: 'planned', sownOn: '2026-02-01' });
    await testDb().sequelize.query('UPDATE plantings SET season_year = NULL WHERE id = ?', { replacements: [p.id] });
    const log = await clients.grower.post(`${base}/plantings/${p.id}/log`).send({ entryOn: '2026-04-01', kind: 'harvest', amount: 1, amountUnit: 'kg' });
    expect(log.status).toBe(201);
    expect(await stored(p.id)).toBe(2025);
  });

  it('when the list is asked for one season, then only that season’s plantings come, through the (garden, season) index', async () => {
    const { clients, base, garden } = await gardenWithClients(app);
    await southern(garden);
    const ids = { bedId: (await makeBed(garden.id)).id, varietyId: (await makeVariety(garden.id)).id };
    const a = await makePlanting(garden.id, { ...ids, sownOn: '2025-08-20' });
    const b = await makePlanting(garden.id, { ...ids, sownOn: '2026-03-10' });
    await makePlanting(garden.id, { ...ids, sownOn: '2026-08-01' });
    await makePlanting(garden.id, { ...ids, status: 'planned', sownOn: null });
    const res = await clients.viewer.get(`${base}/plantings?season=2025`);
    expect(res.status).toBe(200);
    expect(res.body.items.map((p: { id: number }) => p.id).sort((x: number, y: number) => x - y)).toEqual([a.id, b.id]);
    expect(res.body.total).toBe(2);
    const bad = await clients.viewer.get(`${base}/plantings?season=soon`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['season']);
    const [plan] = (await testDb().sequelize.query('EXPLAIN SELECT id FROM plantings WHERE garden_id = ? AND season_year = ?', { replacements: [garden.id, 2025] })) as [Array<{ possible_keys: string | null }>, unknown];
    expect(plan[0].possible_keys).toContain('plantings_garden_season');
  });
});
