import { afterAll, afterEach, beforeAll, beforeEach, vi } from 'vitest';
import { cleanup } from '@testing-library/react';
import { setupServer } from 'msw/node';
import { useClientWaits } from './waits';

export const server = setupServer();

export interface SeenRequest {
  method: string;
  path: string;
  /** The query string's parameters, e.g. `query.get('sort')`. */
  query: URLSearchParams;
  headers: Headers;
  /** Parsed JSON, the FormData of a multipart upload, or the raw text of anything else. */
  body: unknown;
}

/** Every request the app made in the current test, in order, with its parsed body. */
export const seen: SeenRequest[] = [];

async function readBody(request: Request): Promise<unknown> {
  const type = request.headers.get('content-type') ?? '';
  if (type.startsWith('multipart/form-data')) return request.clone().formData();
  const text = await request.clone().text();
  if (!text) return undefined;
  return type.includes('json') ? JSON.parse(text) : text;
}

server.events.on('request:start', async ({ request }) => {
  const body = await readBody(request);
  const url = new URL(request.url);
  seen.push({ method: request.method, path: url.pathname, query: url.searchParams, headers: request.headers, body });
});

/**
 * jsdom brings its own FormData and File, but the fetch under test is Node's, which cannot read
 * them. A browser has one of each; an upload test gives the page Node's pair to match.
 */
export async function useNodeFormData() {
  const nodeForm = await new Response(new URLSearchParams()).formData();
  vi.stubGlobal('FormData', nodeForm.constructor);
}

/**
 * Dates are written in the browser's language; a test that reads them picks one, e.g. ['en-GB']
 * for "14–22 Jun". Without this, jsdom's en-US gives "Jun 14–22".
 */
export function useBrowserLanguages(languages: string[]) {
  let spy: { mockRestore: () => void } | undefined;
  beforeEach(() => {
    spy = vi.spyOn(Navigator.prototype, 'languages', 'get').mockReturnValue(languages);
  });
  afterEach(() => spy?.mockRestore());
}

/** Call once at the top of a test file: a mock API per file, a clean page per test. */
export function setupClientTests() {
  useClientWaits();
  beforeAll(() => {
    server.listen({ onUnhandledRequest: 'error' });
    // Recharts sizes its charts with ResizeObserver, which jsdom lacks.
    globalThis.ResizeObserver ??= class {
      observe() {}
      unobserve() {}
      disconnect() {}
    };
  });
  afterEach(() => {
    // Vitest runs without globals here, so Testing Library cannot register this by itself.
    cleanup();
    server.resetHandlers();
    seen.length = 0;
    vi.unstubAllGlobals();
    // The last-opened garden is remembered in localStorage; each test starts without one.
    if (typeof localStorage !== 'undefined') localStorage.clear();
  });
  afterAll(() => server.close());
}
