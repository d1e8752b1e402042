import { afterAll, afterEach, beforeAll } from 'vitest';
import { cleanup } from '@testing-library/react';
import { setupServer } from 'msw/node';

export const server = setupServer();

export interface SeenRequest {
  method: string;
  path: string;
  headers: Headers;
  body: unknown;
}

/** Every request the app made in the current test, in order, with its parsed JSON body. */
export const seen: SeenRequest[] = [];

server.events.on('request:start', async ({ request }) => {
  const text = await request.clone().text();
  seen.push({
    method: request.method,
    path: new URL(request.url).pathname,
    headers: request.headers,
    body: text ? JSON.parse(text) : undefined,
  });
});

/** Call once at the top of a test file: a mock API per file, a clean page per test. */
export function setupClientTests() {
  beforeAll(() => server.listen({ onUnhandledRequest: 'error' }));
  afterEach(() => {
    // Vitest runs without globals here, so Testing Library cannot register this by itself.
    cleanup();
    server.resetHandlers();
    seen.length = 0;
  });
  afterAll(() => server.close());
}
