import type { Sequelize, Transaction } from 'sequelize';

/** InnoDB deadlock (1213) and lock-wait timeout (1205): the whole transaction is safe to run again. */
const RETRYABLE = new Set([1213, 1205]);
const ATTEMPTS = 3;

function errno(err: unknown): number | undefined {
  const e = err as { parent?: { errno?: number }; original?: { errno?: number } };
  return e?.parent?.errno ?? e?.original?.errno;
}

/** A deadlock or lock-wait timeout: the whole transaction is safe to run again. */
export function isRetryable(err: unknown): boolean {
  const code = errno(err);
  return code !== undefined && RETRYABLE.has(code);
}

/** Runs `work` in one transaction, retrying a bounded number of times on deadlocks and lock waits. */
export async function inTransaction<T>(sequelize: Sequelize, work: (transaction: Transaction) => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await sequelize.transaction(work);
    } catch (err) {
      const code = errno(err);
      if (attempt >= ATTEMPTS || code === undefined || !RETRYABLE.has(code)) throw err;
      await new Promise((r) => setTimeout(r, 20 * attempt + Math.random() * 30));
    }
  }
}
