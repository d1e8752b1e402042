import os from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Umzug, SequelizeStorage } from 'umzug';
import { QueryTypes } from 'sequelize';
import type { QueryInterface, Sequelize } from 'sequelize';

const here = path.dirname(fileURLToPath(import.meta.url));

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}

export function createMigrator(sequelize: Sequelize) {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: ['migrations/*.ts', { cwd: here }],
      resolve: ({ name, path: file, context }) => {
        const load = () => import(pathToFileURL(file!).href) as Promise<{ up: (c: MigrationContext) => Promise<void>; down: (c: MigrationContext) => Promise<void> }>;
        return {
          name: name.replace(/\.ts$/, ''),
          up: async () => (await load()).up(context),
          down: async () => (await load()).down(context),
        };
      },
    },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

// ---------------------------------------------------------------------------------------------
// Cluster-wide coordination. GET_LOCK() is local to one server, so on a Galera cluster two
// instances on different nodes would both hold "the" lock. A row in `schema_lock`, taken by a
// conditional UPDATE, is replicated like any other write: only one holder's UPDATE survives
// certification. A holder renews its lease while it works; a holder that dies loses it when the
// lease runs out. The same code serves a single server unchanged.
// ---------------------------------------------------------------------------------------------

export const LOCK_TABLE = 'schema_lock';

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

function errno(err: unknown): number | undefined {
  const e = err as { parent?: { errno?: number }; original?: { errno?: number }; errno?: number } | null;
  return e?.parent?.errno ?? e?.original?.errno ?? e?.errno;
}

/** 1213: a deadlock on one server, or (Galera) a certification failure at commit against another node's write. */
export function isConflict(err: unknown): boolean {
  return errno(err) === 1213;
}

/**
 * Runs `fn`, again after a conflict (1213) with exponential backoff and jitter. `fn` must be
 * safe to repeat: one transaction (rolled back by the failure) or idempotent statements.
 */
export async function retryOnConflict<T>(fn: () => Promise<T>, opts: { attempts?: number; baseMs?: number; onRetry?: (attempt: number, err: unknown) => void } = {}): Promise<T> {
  const attempts = opts.attempts ?? 8;
  const base = opts.baseMs ?? 50;
  for (let attempt = 1; ; attempt++) {
    try {
      return await fn();
    } catch (err) {
      if (!isConflict(err) || attempt >= attempts) throw err;
      opts.onRetry?.(attempt, err);
      await sleep(Math.min(5000, base * 2 ** (attempt - 1)) * (0.5 + Math.random()));
    }
  }
}

/** Creates the lock table and the named row when missing; safe to run from many instances at once. */
export async function ensureLockRow(sequelize: Sequelize, name: string): Promise<void> {
  const addRow = () => retryOnConflict(() => sequelize.query(`INSERT IGNORE INTO ${LOCK_TABLE} (name) VALUES (?)`, { replacements: [name] }));
  try {
    await addRow();
    return;
  } catch (err) {
    if (errno(err) !== 1146) throw err; // 1146: no such table yet
  }
  // Only when missing: Galera replicates even a no-op CREATE … IF NOT EXISTS in total order, a
  // short pause for the whole cluster. Every table needs a primary key there.
  await retryOnConflict(() =>
    sequelize.query(
      `CREATE TABLE IF NOT EXISTS ${LOCK_TABLE} (
        name VARCHAR(64) NOT NULL PRIMARY KEY,
        holder VARCHAR(160) NULL,
        expires_at DATETIME(3) NULL,
        taken_at DATETIME(3) NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_bin`,
    ),
  );
  await addRow();
}

export interface ClusterLockOptions {
  /** The lease: another instance may take the lock this long after the last renewal (default 60 s). */
  ttlMs?: number;
  /** How often the holder renews (default a sixth of the lease). */
  renewMs?: number;
  /** How often a waiting instance tries again (default 400 ms, with jitter). */
  pollMs?: number;
  /** Give up waiting after this long (default 10 min). */
  waitMs?: number;
  /** Where waiting and a lost lease are told (default console.warn). */
  log?: (message: string) => void;
}

async function tryTake(sequelize: Sequelize, name: string, holder: string, ttlMs: number): Promise<boolean> {
  // Autocommit: the affected-row count is known only after certification, so it decides.
  const [, affected] = await retryOnConflict(() =>
    sequelize.query(
      `UPDATE ${LOCK_TABLE} SET holder = ?, taken_at = NOW(3), expires_at = NOW(3) + INTERVAL ? MICROSECOND
       WHERE name = ? AND (holder IS NULL OR expires_at IS NULL OR expires_at < NOW(3))`,
      { replacements: [holder, ttlMs * 1000, name], type: QueryTypes.UPDATE },
    ),
  );
  return Number(affected) === 1;
}

/**
 * Runs `fn` while holding the cluster-wide lock `name` (a row of `schema_lock`). Waiting
 * instances poll; once they hold the lock they run `fn` too, which must then find its work done.
 */
export async function withClusterLock<T>(sequelize: Sequelize, name: string, fn: () => Promise<T>, opts: ClusterLockOptions = {}): Promise<T> {
  const ttlMs = opts.ttlMs ?? 60_000;
  const renewMs = opts.renewMs ?? Math.max(200, Math.floor(ttlMs / 6));
  const pollMs = opts.pollMs ?? 400;
  const deadline = Date.now() + (opts.waitMs ?? 10 * 60_000);
  const log = opts.log ?? ((message: string) => console.warn(`[db] ${message}`));
  const holder = `${os.hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`.slice(0, 160);
  await ensureLockRow(sequelize, name);
  let waited = false;
  while (!(await tryTake(sequelize, name, holder, ttlMs))) {
    if (!waited) log(`waiting for the ${name} lock (${LOCK_TABLE}): another instance holds it`);
    waited = true;
    if (Date.now() > deadline) throw new Error(`Could not take the ${name} lock (${LOCK_TABLE}) within ${Math.round((opts.waitMs ?? 600_000) / 1000)} s`);
    await sleep(pollMs * (0.75 + Math.random() / 2));
  }
  let lost = false;
  let renewing: Promise<unknown> = Promise.resolve();
  const timer = setInterval(() => {
    renewing = sequelize
      .query(`UPDATE ${LOCK_TABLE} SET expires_at = NOW(3) + INTERVAL ? MICROSECOND WHERE name = ? AND holder = ?`, {
        replacements: [ttlMs * 1000, name, holder],
        type: QueryTypes.UPDATE,
      })
      .then(([, affected]) => {
        if (Number(affected) !== 1 && !lost) {
          lost = true;
          log(`lost the ${name} lock (lease ran out before renewal)`);
        }
      })
      // A failed renewal (a conflict, a busy node) is tried again at the next tick.
      .catch(() => undefined);
  }, renewMs);
  timer.unref();
  try {
    return await fn();
  } finally {
    clearInterval(timer);
    await renewing;
    await retryOnConflict(() =>
      sequelize.query(`UPDATE ${LOCK_TABLE} SET holder = NULL, expires_at = NULL WHERE name = ? AND holder = ?`, {
        replacements: [name, holder],
        type: QueryTypes.UPDATE,
      }),
    ).catch((err: Error) => log(`could not release the ${name} lock (it lapses with its lease): ${err.message}`));
  }
}

/**
 * Applies pending migrations. Several processes starting at once, on one server or on different
 * nodes of a Galera cluster, serialise on the `migrate` row of `schema_lock`; the ones that wait
 * find nothing pending once they hold it.
 */
export async function migrate(sequelize: Sequelize, opts: ClusterLockOptions = {}): Promise<string[]> {
  return withClusterLock(
    sequelize,
    'migrate',
    async () => {
      const applied: string[] = [];
      const migrator = createMigrator(sequelize);
      migrator.on('migrated', ({ name }) => void applied.push(name));
      // A migration that failed on a conflict left nothing recorded: the next attempt runs it again.
      await retryOnConflict(() => migrator.up());
      return applied;
    },
    opts,
  );
}
