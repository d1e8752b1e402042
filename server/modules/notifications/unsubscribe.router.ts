import express, { Router } from 'express';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { AppError } from '../../errors';
import { csrfGuard } from '../../lib/request-guards';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { unsubscribe, unsubscribeInfo } from './unsubscribe.service';

/**
 * RFC 8058: mail providers unsubscribe with a form-encoded `List-Unsubscribe=One-Click` POST and
 * no custom header. That exact body is accepted here and nowhere else; anything else follows the
 * app's CSRF rule. This router is mounted before the app-wide guard for that reason.
 */
const oneClickOrCsrf: RequestHandler = (req, res, next) => {
  if (req.is('application/x-www-form-urlencoded') !== 'application/x-www-form-urlencoded') return csrfGuard(req, res, next);
  const site = req.headers['sec-fetch-site'];
  if (site && site !== 'same-origin' && site !== 'none') {
    throw new AppError(403, 'cross_site_rejected', 'Requests from other sites are not accepted.');
  }
  const body = (req.body ?? {}) as Record<string, unknown>;
  if (Object.keys(body).length !== 1 || body['List-Unsubscribe'] !== 'One-Click') {
    throw new AppError(400, 'validation_failed', 'A one-click unsubscribe sends exactly List-Unsubscribe=One-Click.', {
      'List-Unsubscribe': 'Must be One-Click.',
    });
  }
  next();
};

export function unsubscribeRouter(deps: { sequelize: Sequelize; table: RouteTableEntry[] }) {
  const { sequelize, table } = deps;
  const router = Router();
  mountRoutes(
    router,
    '/api/unsubscribe',
    [
      {
        method: 'get',
        path: '/:token',
        access: 'public',
        handler: async (req, res) => {
          res.json(await unsubscribeInfo(sequelize, String(req.params.token)));
        },
      },
      {
        method: 'post',
        path: '/:token',
        access: 'public',
        before: [express.urlencoded({ extended: false, limit: '1kb', parameterLimit: 4 }), oneClickOrCsrf],
        handler: async (req, res) => {
          res.json(await unsubscribe(sequelize, String(req.params.token)));
        },
      },
    ],
    table,
  );
  return router;
}
