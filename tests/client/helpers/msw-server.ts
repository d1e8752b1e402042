import { afterAll, afterEach, beforeAll, vi } from 'vitest';
import { cleanup } from '@testing-library/react';
import { setupServer } from 'msw/node';

export const server = setupServer();

export interface SeenRequest {
  method: string;
  path: string;
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
  seen.push({ method: request.method, path: new URL(request.url).pathname, headers: request.headers, body });
});

/**
 * jsdom brings its own FormData and File, but the fetch under test is Node's, which cannot read
 * them. A browser has one of each; an upload test gives the page Node's pair to match.
 */
export async function useNodeFormData() {
  const nodeForm = await new Response(new URLSearchParams()).formData();
  vi.stubGlobal('FormData', nodeForm.constructor);
}

/** Call once at the top of a test file: a mock API per file, a clean page per test. */
export function setupClientTests() {
  beforeAll(() => server.listen({ onUnhandledRequest: 'error' }));
  afterEach(() => {
    // Vitest runs without globals here, so Testing Library cannot register this by itself.
    cleanup();
    server.resetHandlers();
    seen.length = 0;
    vi.unstubAllGlobals();
  });
  afterAll(() => server.close());
}
