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
  /** How long the failed attempt took, so a retry policy can tell a quick refusal from a long wait. */
  readonly elapsedMs: number;

  constructor(init: {
    status: number;
    code: string;
    message: string;
    fields?: Record<string, string>;
    requestId?: string;
    retryAfterSeconds?: number;
    details?: Record<string, unknown>;
    elapsedMs?: number;
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
    this.elapsedMs = init.elapsedMs ?? 0;
  }
}

/** Status 0: no answer came back at all (`offline`: the request failed; `timeout`: no answer in time). */
export const NETWORK_CODES = ['offline', 'timeout'] as const;
export type NetworkCode = (typeof NETWORK_CODES)[number];

export const OFFLINE_MESSAGE = 'Can’t reach Heatclock. Check your connection and try again.';

/** True when the request never got an answer: no connection, the server down, or no reply in time. */
export function isNetworkError(error: unknown): error is ApiError {
  return error instanceof ApiError && error.status === 0;
}

/**
 * The longest any one request waits for its answer (headers and body); a file upload, which may
 * crawl over a field's mobile signal, waits longer. Tests shorten them; the query client's
 * retries are sized around them (src/lib/query-client.ts).
 */
export const requestSettings = { timeoutMs: 15_000, uploadTimeoutMs: 120_000 };

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
  const error = (body).error;
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

function encodeBody(body: unknown, headers: Record<string, string>): BodyInit | undefined {
  if (body === undefined) return undefined;
  // The browser writes a multipart Content-Type with its boundary; setting one here would break it.
  if (body instanceof FormData) return body;
  headers['Content-Type'] = 'application/json';
  return JSON.stringify(body);
}

interface RequestOptions {
  /** Sent as JSON, or as multipart when it is a FormData (files). */
  body?: unknown;
  signal?: AbortSignal;
  headers?: Record<string, string>;
}

function timeoutMessage(ms: number): string {
  const seconds = Math.max(1, Math.round(ms / 1000));
  return `Can’t reach Heatclock: no answer within ${seconds} ${seconds === 1 ? 'second' : 'seconds'}. Check your connection and try again.`;
}

async function request<T>(method: Method, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers };
  // The server's CSRF rule: every mutating request carries this header.
  if (method !== 'GET') headers['X-Requested-With'] = 'heatclock';
  const body = encodeBody(options.body, headers);

  // A bounded wait: our own controller aborts after the timeout or when the caller's signal does
  // (TanStack Query cancels a query nobody watches any more), whichever comes first.
  const started = Date.now();
  const timeoutMs = body instanceof FormData ? requestSettings.uploadTimeoutMs : requestSettings.timeoutMs;
  const controller = new AbortController();
  let timedOut = false;
  const timer = setTimeout(() => {
    timedOut = true;
    controller.abort();
  }, timeoutMs);
  const callerSignal = options.signal;
  const passAbort = () => controller.abort();
  if (callerSignal?.aborted) controller.abort();
  else callerSignal?.addEventListener('abort', passAbort, { once: true });

  const networkError = (cause: unknown): unknown => {
    // The caller gave up: hand its abort back untouched, so the query is cancelled, not failed.
    if (!timedOut && callerSignal?.aborted) return cause;
    const elapsedMs = Date.now() - started;
    return timedOut
      ? new ApiError({ status: 0, code: 'timeout', message: timeoutMessage(timeoutMs), elapsedMs })
      : new ApiError({ status: 0, code: 'offline', message: OFFLINE_MESSAGE, elapsedMs });
  };

  let response: Response;
  let answer: unknown;
  try {
    try {
      response = await fetch(toUrl(path), {
        method,
        headers,
        credentials: 'same-origin',
        body,
        signal: controller.signal,
      });
      answer = await readJson(response);
    } catch (cause) {
      throw networkError(cause);
    }
  } finally {
    clearTimeout(timer);
    callerSignal?.removeEventListener('abort', passAbort);
  }
  if (response.ok) return answer as T;

  const elapsedMs = Date.now() - started;
  const retryAfterSeconds = parseRetryAfter(response.headers.get('Retry-After'));
  if (isErrorBody(answer)) {
    const { code, message, fields, requestId, ...details } = answer.error as ApiErrorBody['error'] & Record<string, unknown>;
    throw new ApiError({ status: response.status, code, message, fields, requestId, retryAfterSeconds, details, elapsedMs });
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
    elapsedMs,
  });
}

export const api = {
  get: <T>(path: string, signal?: AbortSignal) => request<T>('GET', path, { signal }),
  /** `headers` for the few extras a call needs, e.g. an Idempotency-Key on a create. */
  post: <T>(path: string, body?: unknown, headers?: Record<string, string>) => request<T>('POST', path, { body, headers }),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, { body }),
  put: <T>(path: string, body: unknown) => request<T>('PUT', path, { body }),
  delete: (path: string) => request<void>('DELETE', path),
};
