import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Transaction } from 'sequelize';
import { testDb } from '../helpers/test-app';
import { createGarden } from '../helpers/factories';
import { makeBed } from '../helpers/garden-records';
import { inTransaction, isRetryable } from '../../server/lib/transaction';
import { createSequelize } from '../../server/db/sequelize';
import { Bed } from '../../server/db/models';

// Two transactions at once need two connections, whatever DB_POOL_MAX the suite runs with.
const { config } = testDb();
const sequelize = createSequelize({ ...config.db, poolMax: Math.max(2, config.db.poolMax) });
afterAll(() => sequelize.close());

/** A promise with its resolve, to line two transactions up. */
function signal() {
  let open!: () => void;
  const opened = new Promise<void>((r) => (open = r));
  return { open, opened };
}

const grow = (id: number, t: Transaction) => sequelize.query('UPDATE beds SET length_m = length_m + 1 WHERE id = ?', { replacements: [id], type: QueryTypes.UPDATE, transaction: t });

describe('a transaction that deadlocks is run again', () => {
  it('when two transactions lock two rows in opposite orders, then InnoDB kills one (1213), it is retried, and both changes land exactly once', async () => {
    const garden = await createGarden();
    const a = await makeBed(garden.id);
    const b = await makeBed(garden.id);
    const before = { a: a.lengthM!, b: b.lengthM! };
    const firstHeld = signal();
    const secondHeld = signal();
    const attempts = { one: 0, two: 0 };
    const errors: unknown[] = [];
    // Each side holds its first row, waits until the other holds its own, then asks for the other's:
    // a lock cycle, which InnoDB breaks at once by rolling one of them back with error 1213.
    const one = inTransaction(sequelize, async (t) => {
      attempts.one++;
      await grow(a.id, t);
      if (attempts.one === 1) {
        firstHeld.open();
        await secondHeld.opened;
      }
      await grow(b.id, t);
    }).catch((err) => errors.push(err));
    const two = inTransaction(sequelize, async (t) => {
      attempts.two++;
      if (attempts.two === 1) await firstHeld.opened;
      await grow(b.id, t);
      if (attempts.two === 1) {
        secondHeld.open();
        // Give the other side time to block on b before asking for a.
        await new Promise((r) => setTimeout(r, 150));
      }
      await grow(a.id, t);
    }).catch((err) => errors.push(err));
    await Promise.all([one, two]);

    expect(errors).toEqual([]);
    // One of them ran twice: its first attempt was the deadlock's victim and was rolled back.
    expect(attempts.one + attempts.two).toBe(3);
    await a.reload();
    await b.reload();
    expect(a.lengthM! - before.a).toBeCloseTo(2, 6);
    expect(b.lengthM! - before.b).toBeCloseTo(2, 6);
  });

  it('when the error is not a deadlock or lock wait, then it is not retried', async () => {
    let attempts = 0;
    await expect(
      inTransaction(sequelize, async (t) => {
        attempts++;
        await sequelize.query('SELECT no_such_column FROM beds', { transaction: t });
      }),
    ).rejects.toThrow(/no_such_column/);
    expect(attempts).toBe(1);
    expect(isRetryable(new Error('plain'))).toBe(false);
    expect(isRetryable({ parent: { errno: 1213 } })).toBe(true);
    expect(isRetryable({ original: { errno: 1205 } })).toBe(true);
    expect(await Bed.count({ where: { name: 'never' } })).toBe(0);
  });
});
