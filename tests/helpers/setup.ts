import { afterEach, beforeEach, vi } from 'vitest';
import { loadConfig } from '../../server/config';
import { perWorkerDatabases, workerDatabase } from './worker-db';

process.env.NODE_ENV = 'test';

// This worker's own database (tests/helpers/worker-db.ts), prepared by the global setup; set once
// per process, before any test file reads its configuration.
if (perWorkerDatabases() && process.env.VITEST_POOL_ID && !process.env.HEATCLOCK_TEST_DB_BASE) {
  const base = loadConfig().db.database;
  process.env.HEATCLOCK_TEST_DB_BASE = base;
  process.env.DB_TEST_NAME = workerDatabase(base, process.env.VITEST_POOL_ID);
}

/** Any console.error during a test fails it: errors must be asserted, not printed. */
let errors: unknown[][] = [];
beforeEach(() => {
  errors = [];
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    errors.push(args);
  });
});
afterEach(async () => {
  // Component tests share one jsdom page per file; unmount whatever a test rendered.
  if (typeof document !== 'undefined') {
    const { cleanup } = await import('@testing-library/react');
    cleanup();
  }
  vi.mocked(console.error).mockRestore();
  if (errors.length) {
    const first = errors[0].map((a) => (a instanceof Error ? a.stack : String(a))).join(' ');
    throw new Error(`console.error was called ${errors.length} time(s) during the test: ${first}`);
  }
});
