import { createHash } from 'node:crypto';
import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import type { Logger } from './lib/logger';

export class AppError extends Error {
  /** Further machine-readable detail for the client, e.g. the line/column report of a CSV upload. */
  extra?: Record<string, unknown>;

  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }

  static notFound(what = 'That record') {
    return new AppError(404, 'not_found', `${what} was not found.`);
  }
  static forbidden(message = 'Your role in this garden does not allow this.') {
    return new AppError(403, 'forbidden', message);
  }
  static unauthenticated() {
    return new AppError(401, 'unauthenticated', 'Please sign in.');
  }
}

function label(path: PropertyKey[]): string {
  return path.length ? path.map(String).join('.') : '_';
}

/** Turns a zod failure into one message per field, naming unknown fields too. */
export function validationError(err: ZodError, where: 'body' | 'query' | 'params' = 'body'): AppError {
  // A Map, not `fields[key] = …`: assigning to a key named __proto__ would set the prototype, not a field.
  const found = new Map<string, string>();
  for (const issue of err.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) found.set(label([...issue.path, key]), `Unknown field "${key}" is not accepted.`);
    } else {
      const key = label(issue.path);
      if (!found.has(key)) found.set(key, issue.message);
    }
  }
  const fields: Record<string, string> = Object.fromEntries(found);
  const names = [...found.keys()].join(', ');
  return new AppError(400, 'validation_failed', `Please check the ${where === 'body' ? 'fields' : where}: ${names}.`, fields);
}

const dbDownNames = new Set([
  'SequelizeConnectionError',
  'SequelizeConnectionRefusedError',
  'SequelizeConnectionAcquireTimeoutError',
  'SequelizeConnectionTimedOutError',
  'SequelizeHostNotReachableError',
  'SequelizeAccessDeniedError',
]);

/**
 * Driver errnos that mean "this database node cannot serve us right now", not a bad request:
 * 1047 a Galera node not yet prepared for use (joining, donor, or cut off from the primary
 * component), 1969 a statement that ran past max_statement_time (DB_QUERY_TIMEOUT_MS), 1213 a
 * deadlock or certification conflict still there after the retries, 1205 a lock wait that ran
 * out, 2006/2013 and the connector's 45009/45012/45013/45026 a connection lost or gone silent.
 */
const dbUnavailableErrnos = new Set([1047, 1969, 1213, 1205, 2006, 2013, 45009, 45012, 45013, 45026]);

export function isDatabaseDown(err: unknown): boolean {
  if (!(err instanceof Error)) return false;
  if (dbDownNames.has(err.name)) return true;
  const original = (err as { original?: { errno?: unknown; fatal?: unknown } }).original;
  if (!original) return false;
  // `fatal`: the connector closed the connection under the query (reset, socket timeout, server gone).
  return (typeof original.errno === 'number' && dbUnavailableErrnos.has(original.errno)) || original.fatal === true;
}

interface BodyParserError extends Error {
  type?: string;
  status?: number;
  /** zlib's code when a body said it was compressed and was not (Z_DATA_ERROR; brotli's ERR__ERROR_FORMAT_…). */
  code?: string;
}

/** A body that could not be read as its headers described it: the client's fault, worth one log line. */
function unreadableBody(err: BodyParserError): boolean {
  return (typeof err.code === 'string' && /^(Z_|ERR__ERROR_|ERR_BROTLI)/.test(err.code)) || err.type === 'request.aborted' || err.type === 'stream.encoding.set';
}

/**
 * What the database said, without the statement: Sequelize's stack holds no message, and the
 * driver's message carries the SQL with its values inlined (a session id, a password hash).
 */
function databaseCause(err: unknown): string | undefined {
  const original = (err as { original?: { text?: unknown; code?: unknown } } | null)?.original;
  if (!original || typeof original.text !== 'string') return undefined;
  const code = typeof original.code === 'string' ? ` ${original.code}` : '';
  return `${(err as Error).name}${code}: ${original.text}`;
}

/** A stable pseudonym for the e-mail a sign-in named (the same address, any case, gives the same one). */
function accountFingerprint(email: unknown): string {
  return createHash('sha256').update(typeof email === 'string' ? email.trim().toLowerCase() : '').digest('hex').slice(0, 16);
}

/**
 * The path as logs may keep it: link tokens (reset, invitation, e-mail change, calendar feed,
 * unsubscribe) travel in the path, and a log must never hold a working link. Any segment of 20 or
 * more token characters is written as `:token`.
 */
export function loggablePath(path: string): string {
  return path.replace(/(?<=\/)[A-Za-z0-9_~.%-]{20,}(?=\/|$)/g, ':token');
}

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, next) => {
    const requestId = res.locals.requestId as string | undefined;
    // An error after the answer went out: the session's rolling touch runs at res.end and fails when
    // the database is down. The answer already said so; log it and keep the connection for the next
    // request. Only an answer cut off part-way is handed to Express, which closes the connection.
    if (res.headersSent) {
      logger.warn('error after the response was sent', { requestId, method: req.method, path: loggablePath(req.path), error: err instanceof Error ? err.message : String(err) });
      if (!res.writableEnded) next(err);
      return;
    }
    let appErr: AppError;
    const bp = err as BodyParserError;
    if (err instanceof AppError) appErr = err;
    else if (err instanceof ZodError) appErr = validationError(err);
    else if (bp.type === 'entity.too.large') appErr = new AppError(413, 'payload_too_large', 'The request body is too large.');
    else if (bp.type === 'entity.parse.failed') appErr = new AppError(400, 'malformed_json', 'The request body is not valid JSON.');
    else if (bp.type === 'encoding.unsupported' || bp.type === 'charset.unsupported')
      appErr = new AppError(415, 'unsupported_media_type', 'The request body encoding is not supported.');
    else if (unreadableBody(bp)) {
      appErr = new AppError(400, 'malformed_body', 'The request body could not be read: it does not match its Content-Encoding.');
      logger.warn('unreadable request body', { requestId, method: req.method, path: loggablePath(req.path), encoding: req.headers['content-encoding'], cause: bp.code ?? bp.type });
    } else if (typeof bp.status === 'number' && bp.status >= 400 && bp.status < 500 && bp.type)
      appErr = new AppError(bp.status, 'bad_request', 'The request could not be read.');
    // The router could not decode a path parameter (a stray % in the address).
    else if (err instanceof URIError && (err as URIError & { status?: number }).status === 400)
      appErr = new AppError(400, 'malformed_address', 'The address could not be read: it has a broken %-escape.');
    else if (isDatabaseDown(err))
      appErr = new AppError(503, 'database_unavailable', 'The database is not reachable right now. Please try again shortly.', undefined, {
        'Retry-After': '5',
      });
    else appErr = new AppError(500, 'internal_error', 'Something went wrong on our side. The error has been logged.');

    if (appErr.status >= 500) {
      logger.error('request failed', {
        requestId,
        method: req.method,
        path: loggablePath(req.path),
        userId: (req.user as { id?: number } | undefined)?.id,
        error: err instanceof Error ? err.stack : String(err),
        cause: databaseCause(err),
      });
    } else if (appErr.code === 'invalid_credentials') {
      // Enough to follow repeated guesses at one account; the password and the address stay out.
      logger.warn('sign-in refused', { requestId, method: req.method, path: loggablePath(req.path), account: accountFingerprint((req.body as { email?: unknown } | undefined)?.email) });
    }
    if (appErr.headers) res.set(appErr.headers);
    res.status(appErr.status).json({
      error: {
        code: appErr.code,
        message: appErr.message,
        ...(appErr.fields ? { fields: appErr.fields } : {}),
        ...appErr.extra,
        requestId,
      },
    });
  };
}
