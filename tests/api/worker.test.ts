import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { testDb } from '../helpers/test-app';
import { createGarden } from '../helpers/factories';
import { createLogger } from '../../server/lib/logger';
import { createWorker } from '../../server/jobs/worker';
import type { GardenEvent, Processor } from '../../server/jobs/worker';
import { recordWeatherChanged } from '../../server/modules/weather/weather-events';

const { sequelize } = testDb();
const logger = createLogger('silent');

/** A consumer name of this test alone, so parallel test files never see each other's rows. */
const consumerName = () => `test-${randomUUID().slice(0, 8)}`;

function changed(consumer: string, gardenId: number, from: string, to: string) {
  return sequelize.transaction((t) => recordWeatherChanged(t, { gardenId }, from, to, [consumer]));
}

async function rowsOf(consumer: string) {
  return sequelize.query<{ gardenId: number; from: string; to: string; version: number; attempts: number; status: string; lastError: string | null; delayMs: number }>(
    `SELECT garden_id AS gardenId, from_date AS \`from\`, to_date AS \`to\`, version, attempts, status, last_error AS lastError,
            TIMESTAMPDIFF(MICROSECOND, updated_at, run_after) / 1000 AS delayMs
       FROM garden_events WHERE consumer = ? ORDER BY garden_id`,
    { replacements: [consumer], type: QueryTypes.SELECT },
  );
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('garden event worker', () => {
  it('when a garden changes several times before a run, then one pending row covers the widest range', async () => {
    const consumer = consumerName();
    const garden = await createGarden();
    await changed(consumer, garden.id, '2025-05-10', '2025-05-12');
    await changed(consumer, garden.id, '2025-05-01', '2025-05-03');
    await changed(consumer, garden.id, '2025-05-20', '2025-05-21');
    expect(await rowsOf(consumer)).toMatchObject([{ gardenId: garden.id, from: '2025-05-01', to: '2025-05-21', version: 3, status: 'pending' }]);
  });

  it('when rows are pending, then the processor runs once per row and the rows are gone', async () => {
    const consumer = consumerName();
    const [a, b] = [await createGarden(), await createGarden()];
    await changed(consumer, a.id, '2025-05-01', '2025-05-02');
    await changed(consumer, a.id, '2025-05-05', '2025-05-06');
    await changed(consumer, b.id, '2025-06-01', '2025-06-01');
    const seen: GardenEvent[] = [];
    const worker = createWorker({ sequelize, logger });
    worker.register({ name: consumer, handle: async (e) => void seen.push(e) });
    await worker.drain();
    expect(seen.sort((x, y) => x.gardenId - y.gardenId)).toEqual([
      { gardenId: a.id, from: '2025-05-01', to: '2025-05-06', version: 2 },
      { gardenId: b.id, from: '2025-06-01', to: '2025-06-01', version: 1 },
    ]);
    expect(await rowsOf(consumer)).toEqual([]);
    await worker.drain();
    expect(seen).toHaveLength(2);
  });

  it('when a change arrives while its garden is being handled, then the row stays and is handled again', async () => {
    const consumer = consumerName();
    const garden = await createGarden();
    await changed(consumer, garden.id, '2025-05-10', '2025-05-10');
    const seen: GardenEvent[] = [];
    const worker = createWorker({
      sequelize,
      logger,
      processors: [
        {
          name: consumer,
          handle: async (e) => {
            seen.push(e);
            if (seen.length === 1) await changed(consumer, garden.id, '2025-05-01', '2025-05-01');
          },
        },
      ],
    });
    await worker.drain();
    expect(seen).toEqual([
      { gardenId: garden.id, from: '2025-05-10', to: '2025-05-10', version: 1 },
      { gardenId: garden.id, from: '2025-05-01', to: '2025-05-10', version: 2 },
    ]);
    expect(await rowsOf(consumer)).toEqual([]);
  });

  it('when a processor keeps failing, then it is retried with growing backoff and finally marked failed with onFailed called', async () => {
    const consumer = consumerName();
    const garden = await createGarden();
    await changed(consumer, garden.id, '2025-05-01', '2025-05-02');
    let calls = 0;
    const failures: Array<[GardenEvent, string]> = [];
    const processor: Processor = {
      name: consumer,
      maxAttempts: 3,
      handle: async () => {
        calls++;
        throw new Error(`boom ${calls}`);
      },
      onFailed: async (e, err) => void failures.push([e, err.message]),
    };
    const worker = createWorker({ sequelize, logger, processors: [processor], backoffMs: 100 });
    await worker.drain();
    expect(calls).toBe(1);
    let [row] = await rowsOf(consumer);
    expect(row).toMatchObject({ attempts: 1, status: 'pending', lastError: 'boom 1' });
    expect(Number(row.delayMs)).toBeCloseTo(100, -1);
    await worker.drain();
    expect(calls).toBe(1);
    await sleep(120);
    await worker.drain();
    [row] = await rowsOf(consumer);
    expect(row).toMatchObject({ attempts: 2, status: 'pending', lastError: 'boom 2' });
    expect(Number(row.delayMs)).toBeCloseTo(200, -1);
    await sleep(220);
    await worker.drain();
    [row] = await rowsOf(consumer);
    expect(row).toMatchObject({ attempts: 3, status: 'failed', lastError: 'boom 3' });
    expect(failures).toEqual([[{ gardenId: garden.id, from: '2025-05-01', to: '2025-05-02', version: 1 }, 'boom 3']]);
    await sleep(50);
    await worker.drain();
    expect(calls).toBe(3);
  });

  it('when two workers drain the same rows at once, then no row is handled by both or twice', async () => {
    const consumer = consumerName();
    const gardens = await Promise.all(Array.from({ length: 8 }, () => createGarden()));
    for (const g of gardens) await changed(consumer, g.id, '2025-05-01', '2025-05-01');
    const inFlight = new Set<number>();
    const handled: Array<{ gardenId: number; by: string }> = [];
    let overlaps = 0;
    const processor = (by: string): Processor => ({
      name: consumer,
      handle: async (e) => {
        if (inFlight.has(e.gardenId)) overlaps++;
        inFlight.add(e.gardenId);
        await sleep(25);
        inFlight.delete(e.gardenId);
        handled.push({ gardenId: e.gardenId, by });
      },
    });
    const one = createWorker({ sequelize, logger, processors: [processor('one')] });
    const two = createWorker({ sequelize, logger, processors: [processor('two')] });
    await Promise.all([one.drain(), two.drain()]);
    expect(overlaps).toBe(0);
    expect(handled.map((h) => h.gardenId).sort((x, y) => x - y)).toEqual(gardens.map((g) => g.id).sort((x, y) => x - y));
    expect(new Set(handled.map((h) => h.by)).size).toBe(2);
    expect(await rowsOf(consumer)).toEqual([]);
  });

  it('when a started worker is kicked after a commit, then it handles the row without waiting for its poll', async () => {
    const consumer = consumerName();
    const garden = await createGarden();
    let handled: (e: GardenEvent) => void = () => undefined;
    const done = new Promise<GardenEvent>((resolve) => (handled = resolve));
    const worker = createWorker({ sequelize, logger, pollMs: 60_000, processors: [{ name: consumer, handle: async (e) => handled(e) }] });
    worker.start();
    await changed(consumer, garden.id, '2025-05-01', '2025-05-01');
    worker.kick();
    expect((await done).gardenId).toBe(garden.id);
    await worker.stop();
  });
});
