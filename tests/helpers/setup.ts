import { afterEach, beforeEach, vi } from 'vitest';

process.env.NODE_ENV = 'test';

/** Any console.error during a test fails it: errors must be asserted, not printed. */
let errors: unknown[][] = [];
beforeEach(() => {
  errors = [];
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    errors.push(args);
  });
});
afterEach(() => {
  vi.mocked(console.error).mockRestore();
  if (errors.length) {
    const first = errors[0].map((a) => (a instanceof Error ? a.stack : String(a))).join(' ');
    throw new Error(`console.error was called ${errors.length} time(s) during the test: ${first}`);
  }
});
