/**
 * Idempotency-Key on creates (IETF draft-ietf-httpapi-idempotency-key-header): a double tap or a
 * retry after no answer creates one record. The first request with a key stores it (hashed with
 * the user, method and path) as pending; its successful answer is stored before it is sent, for
 * 24 hours. The same key again gets that answer replayed (Idempotent-Replayed: true); while the
 * first is still running, 409 and Retry-After; with a different body, 422. A failed first attempt
 * leaves nothing behind, so the retry runs afresh.
 */
import { createHash } from 'node:crypto';
import type { RequestHandler, Response } from 'express';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { AppError } from '../errors';

export const IDEMPOTENCY_TTL_MS = 24 * 60 * 60_000;
/**
 * A key still pending after this long belongs to a request that died with its process: a retry
 * may take it over. Longer than any request runs (the API sheds after 3 s of queueing, uploads
 * finish well within it).
 */
export const PENDING_LEASE_MS = 60_000;
const KEY = /^[\x21-\x7e]{8,200}$/;

const sha256 = (x: string | Buffer) => createHash('sha256').update(x).digest('hex');

/** What the request asks for: its JSON body, or a multipart body's fields and file contents. */
function fingerprint(req: Parameters<RequestHandler>[0]): string {
  const file = (req as { file?: { buffer?: Buffer } }).file;
  const body: unknown = req.body ?? null;
  return sha256(JSON.stringify({ body, file: file?.buffer ? sha256(file.buffer) : null }));
}

interface Row {
  fingerprint: string;
  state: 'pending' | 'done';
  status: number | null;
  body: string | null;
  expired: number;
}

let sweeps = 0;

export function idempotency(db: (req: Parameters<RequestHandler>[0]) => Sequelize): RequestHandler {
  return async (req, res, next) => {
    const key = req.get('Idempotency-Key');
    if (key === undefined) return next();
    try {
      if (!KEY.test(key)) {
        throw new AppError(400, 'validation_failed', 'Please check the fields: Idempotency-Key.', {
          'Idempotency-Key': 'The Idempotency-Key header must be 8 to 200 visible characters.',
        });
      }
      const sequelize = db(req);
      const userId = (req.user as { id?: number } | undefined)?.id ?? 0;
      const scope = sha256(`${userId}|${req.method}|${req.baseUrl}${req.path}|${key}`);
      const print = fingerprint(req);
      const leaseEnds = new Date(Date.now() + PENDING_LEASE_MS);
      if (++sweeps % 200 === 0) await sequelize.query('DELETE FROM idempotency_keys WHERE expires_at < UTC_TIMESTAMP(3) LIMIT 1000');
      for (let attempt = 0; ; attempt++) {
        try {
          await sequelize.query('INSERT INTO idempotency_keys (scope_hash, fingerprint, state, expires_at) VALUES (?, ?, ?, ?)', {
            replacements: [scope, print, 'pending', leaseEnds],
          });
          break;
        } catch (err) {
          if (!(err instanceof UniqueConstraintError) || attempt > 0) throw err;
          const [row] = await sequelize.query<Row>(
            'SELECT fingerprint, state, status, body, expires_at < UTC_TIMESTAMP(3) AS expired FROM idempotency_keys WHERE scope_hash = ?',
            { replacements: [scope], type: QueryTypes.SELECT },
          );
          if (!row) continue; // the first attempt failed and let go of the key: run afresh
          if (row.expired) {
            await sequelize.query('DELETE FROM idempotency_keys WHERE scope_hash = ? AND expires_at < UTC_TIMESTAMP(3)', { replacements: [scope] });
            continue;
          }
          if (row.fingerprint !== print) {
            throw new AppError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for a different request.', {
              'Idempotency-Key': 'Use a new key for a new entry.',
            });
          }
          if (row.state === 'pending') {
            throw new AppError(409, 'request_in_progress', 'The same entry is still being saved. Wait a moment; it will not be saved twice.', undefined, { 'Retry-After': '1' });
          }
          res.set('Idempotent-Replayed', 'true');
          res.status(row.status ?? 200).json(row.body === null ? null : JSON.parse(row.body));
          return;
        }
      }
      remember(res, sequelize, scope);
      next();
    } catch (err) {
      next(err);
    }
  };
}

/**
 * Keeps a successful answer before sending it (for 24 h); lets go of the key when the request
 * fails. A client that gave up waiting does not release it: the handler still runs to its end,
 * and the client's retry must meet that answer, never make a second record.
 */
function remember(res: Response, sequelize: Sequelize, scope: string) {
  const send = res.json.bind(res);
  const release = () => sequelize.query('DELETE FROM idempotency_keys WHERE scope_hash = ?', { replacements: [scope] });
  const keep = (status: number, body: string | null) =>
    sequelize.query('UPDATE idempotency_keys SET state = ?, status = ?, body = ?, expires_at = ? WHERE scope_hash = ?', {
      replacements: ['done', status, body, new Date(Date.now() + IDEMPOTENCY_TTL_MS), scope],
    });
  let settled = false;
  res.json = (body: unknown) => {
    settled = true;
    if (res.statusCode >= 200 && res.statusCode < 300) {
      keep(res.statusCode, JSON.stringify(body ?? null)).then(
        () => send(body),
        // The record exists; only its replay is lost. Let the key go so a retry is not stuck on 409.
        () => release().finally(() => send(body)),
      );
    } else {
      void release().finally(() => send(body));
    }
    return res;
  };
  // An answer sent without res.json (none of the creates do so today): keep its status, or let go.
  res.on('finish', () => {
    if (settled) return;
    const done = res.statusCode >= 200 && res.statusCode < 300 ? keep(res.statusCode, null) : release();
    void done.catch(() => undefined);
  });
}
