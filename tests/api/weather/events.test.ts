import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { agent, testApp, testDb, testWeather } from '../../helpers/test-app';
import { createGarden, gardenWithMembers, signIn } from '../../helpers/factories';
import { fakeWeather } from '../../../fixtures/weather/control';

const { sequelize } = testDb();
const app = testApp();
beforeEach(() => fakeWeather.reset());

function place() {
  return { latitude: Math.round((20 + Math.random() * 40) * 10) / 10 + 0.02, longitude: Math.round((-170 + Math.random() * 340) * 10) / 10 + 0.02 };
}

/** The garden's weather events (moving a garden to its cell also owes it an alert evaluation, not counted here). */
async function events(gardenId: number) {
  return sequelize.query<{ consumer: string; from: string; to: string; version: number; status: string }>(
    "SELECT consumer, from_date AS `from`, to_date AS `to`, version, status FROM garden_events WHERE garden_id = ? AND consumer = 'planting-progress' ORDER BY consumer",
    { replacements: [gardenId], type: QueryTypes.SELECT },
  );
}

async function count(table: string, column: string, id: number) {
  const [{ n }] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table} WHERE ${column} = ?`, {
    replacements: [id],
    type: QueryTypes.SELECT,
  });
  return Number(n);
}

/** Makes the outbox refuse this garden's rows, as a failing event write inside the transaction would. */
async function refuseEventsFor(gardenId: number) {
  await sequelize.query(
    `CREATE TRIGGER refuse_events_${gardenId} BEFORE INSERT ON garden_events FOR EACH ROW
       IF NEW.garden_id = ${gardenId} THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'outbox refused'; END IF`,
  );
  triggers.push(`refuse_events_${gardenId}`);
}
const triggers: string[] = [];
afterEach(async () => {
  for (const t of triggers.splice(0)) await sequelize.query(`DROP TRIGGER IF EXISTS ${t}`);
});

function upload(c: ReturnType<typeof agent>, gardenId: number, csv: string) {
  return c
    .post(`/api/gardens/${gardenId}/weather/imports`)
    .set('X-Requested-With', 'heatclock')
    .field('unit', 'C')
    .attach('file', Buffer.from(csv), { filename: 'station.csv', contentType: 'text/csv' });
}

describe('garden weather changed events', () => {
  it('when a station file is imported, then one pending planting-progress event spans its days; re-uploading adds no change', async () => {
    const { garden, grower } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, grower.email);
    const csv = 'date,high,low\n2025-05-03,20,8\n2025-05-01,21,9\n';
    await upload(c, garden.id, csv).expect(201);
    expect(await events(garden.id)).toEqual([{ consumer: 'planting-progress', from: '2025-05-01', to: '2025-05-03', version: 1, status: 'pending' }]);
    await upload(c, garden.id, csv).expect(200);
    expect((await events(garden.id))[0].version).toBe(1);
  });

  it('when an import fails, then it leaves no event; when the event cannot be written, then no day is stored either', async () => {
    const { garden, grower } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, grower.email);
    await upload(c, garden.id, 'date,high,low\n2025-05-01,20,25\n').expect(422);
    expect(await events(garden.id)).toEqual([]);
    await refuseEventsFor(garden.id);
    const res = await upload(c, garden.id, 'date,high,low\n2025-05-01,20,8\n');
    expect(res.status).toBe(500);
    expect(await count('garden_weather_days', 'garden_id', garden.id)).toBe(0);
    expect(await count('weather_imports', 'garden_id', garden.id)).toBe(0);
  });

  it('when a refresh writes days, then each garden of the cell has one pending event over them; a refresh that changes nothing bumps nothing', async () => {
    const weather = testWeather();
    const spot = place();
    const g1 = await createGarden({ ...spot, timeZone: 'UTC' });
    const g2 = await createGarden({ latitude: spot.latitude + 0.01, longitude: spot.longitude, timeZone: 'UTC' });
    const cellId = (await weather.locateGarden(g1))!;
    await weather.locateGarden(g2);
    await weather.runRefresh({ kind: 'manual', cellId });
    const today = weather.today({ timeZone: 'UTC' });
    for (const g of [g1, g2]) {
      const [e] = await events(g.id);
      expect(e).toMatchObject({ consumer: 'planting-progress', status: 'pending', version: 1 });
      expect(e.from < today && e.to > today).toBe(true);
    }
    await sequelize.query('UPDATE weather_cells SET refreshed_at = NULL WHERE id = ?', { replacements: [cellId] });
    const again = await weather.runRefresh({ kind: 'manual', cellId });
    expect(again.daysWritten).toBe(0);
    expect((await events(g1.id))[0].version).toBe(1);
  });

  it('when the event of a refresh cannot be written, then the refresh stores no day', async () => {
    const weather = testWeather();
    const garden = await createGarden({ ...place(), timeZone: 'UTC' });
    const cellId = (await weather.locateGarden(garden))!;
    await refuseEventsFor(garden.id);
    const run = await weather.runRefresh({ kind: 'manual', cellId });
    expect(run.cellsFailed).toBe(1);
    expect(await count('weather_days', 'cell_id', cellId)).toBe(0);
  });

  it('when a whole history arrives in yearly batches, then the garden owes one evaluation over all of it', async () => {
    const weather = testWeather();
    const garden = await createGarden({ ...place(), timeZone: 'UTC' });
    const cellId = (await weather.locateGarden(garden))!;
    await weather.backfill(cellId);
    const batches = fakeWeather.requests.filter((r) => r.url.includes('archive')).length;
    expect(batches).toBeGreaterThanOrEqual(11);
    const [e] = await events(garden.id);
    expect(e.version).toBe(batches);
    expect(e.from.endsWith('-01-01')).toBe(true);
    expect(await events(garden.id)).toHaveLength(1);
  });
});
