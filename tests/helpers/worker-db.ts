/**
 * Each test worker has a database of its own (`heatclock_test_w1`, `_w2`, … after vitest's
 * VITEST_POOL_ID). Files running side by side must not share the garden event queue: a drain in
 * one file claims every due event, and would process another file's garden with its own clock
 * (files fix different "todays"), so that file read an evaluation made for the wrong day, or
 * none yet. Within a worker, files run one after another and keep to their own rows.
 * A DATABASE_URL (an outside server) keeps the one database it names.
 */
export function workerDatabase(base: string, poolId: string | number): string {
  return `${base}_w${poolId}`;
}

export const perWorkerDatabases = (env: NodeJS.ProcessEnv = process.env) => !env.DATABASE_URL && !env.HEATCLOCK_NO_DB;
