import type { ApiErrorBody } from '#shared/schemas/errors';

/** One bad row of an uploaded file, as the server reports it. */
export interface ApiRowProblem {
  line: number;
  column: string | null;
  message: string;
}

function isRowProblem(value: unknown): value is ApiRowProblem {
  if (typeof value !== 'object' || value === null) return false;
  const row = value as Record<string, unknown>;
  return typeof row.line === 'number' && typeof row.message === 'string' && (row.column === null || typeof row.column === 'string');
}

/** Any failed call to the Heatclock API, with the server's stable code and per-field messages. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;
  readonly requestId?: string;
  /** From Retry-After on 429/503, in whole seconds, when the server sent one. */
  readonly retryAfterSeconds?: number;
  /** Whatever else the server put in its error object, kept for the caller that knows it. */
  readonly details: Record<string, unknown>;
  /** The line/column report of a rejected upload (`details.rows`); empty for other errors. */
  readonly rows: ApiRowProblem[];

  constructor(init: {
    status: number;
    code: string;
    message: string;
    fields?: Record<string, string>;
    requestId?: string;
    retryAfterSeconds?: number;
    details?: Record<string, unknown>;
  }) {
    super(init.message);
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.fields = init.fields ?? {};
    this.requestId = init.requestId;
    this.retryAfterSeconds = init.retryAfterSeconds;
    this.details = init.details ?? {};
    const rows = this.details.rows;
    this.rows = Array.isArray(rows) ? rows.filter(isRowProblem) : [];
  }
}

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

/** Retry-After is either delta-seconds or an HTTP date (RFC 9110 §10.2.3). */
export function parseRetryAfter(value: string | null, now = Date.now()): number | undefined {
  if (!value) return undefined;
  const trimmed = value.trim();
  if (/^\d+$/.test(trimmed)) return Number(trimmed);
  const at = Date.parse(trimmed);
  if (Number.isNaN(at)) return undefined;
  return Math.max(0, Math.ceil((at - now) / 1000));
}

function isErrorBody(body: unknown): body is ApiErrorBody {
  if (typeof body !== 'object' || body === null || !('error' in body)) return false;
  const error = (body as { error: unknown }).error;
  return typeof error === 'object' && error !== null && 'code' in error && 'message' in error;
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

// Resolving against the document keeps paths relative to wherever the app is served, and gives
// fetch an absolute URL in environments (jsdom under Node) that cannot resolve a bare path.
function toUrl(path: string): string {
  return new URL(path, document.baseURI).toString();
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

interface RequestOptions {
  /** Sent as JSON, or as multipart when it is a FormData (files). */
  body?: unknown;
  signal?: AbortSignal;
}

function encodeBody(body: unknown, headers: Record<string, string>): BodyInit | undefined {
  if (body === undefined) return undefined;
  // The browser writes a multipart Content-Type with its boundary; setting one here would break it.
  if (body instanceof FormData) return body;
  headers['Content-Type'] = 'application/json';
  return JSON.stringify(body);
}

async function request<T>(method: Method, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  // The server's CSRF rule: every mutating request carries this header.
  if (method !== 'GET') headers['X-Requested-With'] = 'heatclock';
  const body = encodeBody(options.body, headers);

  let response: Response;
  try {
    response = await fetch(toUrl(path), {
      method,
      headers,
      credentials: 'same-origin',
      body,
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError({
      status: 0,
      code: 'network_error',
      message: 'Heatclock could not be reached. Check your connection and try again.',
    });
  }

  const answer = await readJson(response);
  if (response.ok) return answer as T;

  const retryAfterSeconds = parseRetryAfter(response.headers.get('Retry-After'));
  if (isErrorBody(answer)) {
    const { code, message, fields, requestId, ...details } = answer.error as ApiErrorBody['error'] & Record<string, unknown>;
    throw new ApiError({ status: response.status, code, message, fields, requestId, retryAfterSeconds, details });
  }
  throw new ApiError({
    status: response.status,
    code: 'http_error',
    // A proxy in front of the app may refuse a large upload before the server can explain.
    message:
      response.status === 413
        ? 'The file is too large to upload.'
        : `The server answered with an unexpected error (HTTP ${response.status}). Please try again.`,
    retryAfterSeconds,
  });
}

export const api = {
  get: <T>(path: string, signal?: AbortSignal) => request<T>('GET', path, { signal }),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, { body }),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, { body }),
  delete: (path: string) => request<void>('DELETE', path),
};
