import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

/**
 * The cluster proofs (`npm run test:cluster`): they start a three-node Galera cluster
 * (scripts/cluster.sh) and app instances of their own, so they stay out of the normal suite
 * (whose include is tests/**\/*.test.{ts,tsx}) and run one file at a time.
 */
export default defineConfig({
  root: fileURLToPath(new URL('../..', import.meta.url)),
  test: {
    environment: 'node',
    include: ['tests/cluster/**/*.cluster.ts'],
    testTimeout: 60_000,
    hookTimeout: 180_000,
    fileParallelism: false,
    pool: 'forks',
    maxWorkers: 1,
  },
});
