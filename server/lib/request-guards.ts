import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';
import { AppError } from '../errors';

export const requestId: RequestHandler = (_req, res, next) => {
  const id = randomUUID();
  res.locals.requestId = id;
  res.set('X-Request-Id', id);
  next();
};

export const noStore: RequestHandler = (_req, res, next) => {
  res.set('Cache-Control', 'no-store');
  next();
};

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

function hasBody(req: Parameters<RequestHandler>[0]) {
  return Number(req.headers['content-length'] ?? 0) > 0 || req.headers['transfer-encoding'] !== undefined;
}

/**
 * CSRF defence without tokens: a cross-site page can neither send a JSON content type nor a custom
 * header without a CORS preflight (which we never grant), and browsers label it with Sec-Fetch-Site.
 */
export const csrfGuard: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  const site = req.headers['sec-fetch-site'];
  if (site && site !== 'same-origin' && site !== 'none') {
    throw new AppError(403, 'cross_site_rejected', 'Requests from other sites are not accepted.');
  }
  const isJson = req.is('application/json') === 'application/json';
  const custom = req.headers['x-requested-with'] !== undefined;
  if (hasBody(req) && !isJson && !(custom && req.is('multipart/form-data'))) {
    throw new AppError(415, 'unsupported_media_type', 'Send the request body as JSON (Content-Type: application/json).');
  }
  if (!isJson && !custom) {
    throw new AppError(403, 'csrf_header_missing', 'Add the header X-Requested-With to requests that change data.');
  }
  next();
};
