import { Router } from 'express';
import type { Request } from 'express';
import type { Sequelize } from 'sequelize';
import { rateLimit } from 'express-rate-limit';
import { invitationCreateSchema, newAccountAcceptSchema } from '#shared/schemas/invitations';
import { parseBody } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { recordId } from '../records/params';
import { MariaDbRateLimitStore } from '../auth/rate-limit-store';
import { signIn } from '../auth/auth.router';
import { presentGarden } from '../gardens/gardens.presenter';
import { acceptInvitation, capturedInvitationMail, createInvitation, listInvitations, previewInvitation, revokeInvitation } from './invitations.service';
import { AppError } from '../../errors';

/** Invitations one owner may send per hour, counted in MariaDB so every instance sees the same. */
export const INVITES_PER_HOUR = 30;

export function invitationsRouter(deps: { sequelize: Sequelize; table: RouteTableEntry[]; mailIsLocalFake: boolean; invitesPerHour?: number }) {
  const { sequelize, table } = deps;
  const router = Router();
  const actorOf = (req: Request) => {
    const user = requireSignedIn(req);
    return { id: user.id, name: user.name };
  };
  // Each invitation mails someone who did not ask for it: an owner's account cannot be used to send a flood.
  const inviteLimiter = rateLimit({
    windowMs: 60 * 60_000,
    limit: deps.invitesPerHour ?? INVITES_PER_HOUR,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new MariaDbRateLimitStore(sequelize, 'invite:'),
    keyGenerator: (req) => String(req.user?.id ?? 0),
    handler: (_req, res, _next, options) => {
      const retry = String(res.getHeader('Retry-After') ?? Math.ceil(options.windowMs / 1000));
      res.status(options.statusCode).json({
        error: { code: 'rate_limited', message: `Too many invitations sent in the last hour. Try again in ${retry} seconds.`, requestId: res.locals.requestId as string | undefined },
      });
    },
  });

  mountRoutes(
    router,
    '/api/gardens/:gardenId/invitations',
    [
      {
        method: 'get',
        path: '/',
        access: 'owner',
        handler: async (req, res) => {
          res.json({ items: await listInvitations(sequelize, req.membership!.gardenId) });
        },
      },
      {
        method: 'post',
        path: '/',
        access: 'owner',
        before: [inviteLimiter],
        handler: async (req, res) => {
          const input = parseBody(invitationCreateSchema, req.body);
          res.status(201).json({ invitation: await createInvitation(sequelize, req.membership!.gardenId, actorOf(req), input) });
        },
      },
      {
        method: 'delete',
        path: '/:invitationId',
        access: 'owner',
        handler: async (req, res) => {
          await revokeInvitation(sequelize, req.membership!.gardenId, actorOf(req), recordId(req.params, 'invitationId'));
          res.status(204).end();
        },
      },
      {
        method: 'get',
        path: '/:invitationId/test-mail',
        access: 'owner',
        handler: async (req, res) => {
          if (!deps.mailIsLocalFake) throw new AppError(404, 'not_found', 'No such API route.');
          res.json({ message: await capturedInvitationMail(sequelize, req.membership!.gardenId, recordId(req.params, 'invitationId')) });
        },
      },
    ],
    table,
  );

  mountRoutes(
    router,
    '/api/invitations/:token',
    [
      {
        method: 'get',
        path: '/',
        access: 'public',
        handler: async (req, res) => {
          res.json(await previewInvitation(sequelize, String(req.params.token), req.user));
        },
      },
      {
        // With { name, password }: a new account joins and is signed in. Empty: the signed-in user joins.
        method: 'post',
        path: '/accept',
        access: 'public',
        handler: async (req, res) => {
          if (req.body !== undefined && (typeof req.body !== 'object' || req.body === null || Array.isArray(req.body))) {
            throw new AppError(400, 'malformed_body', 'Send a JSON object: { name, password } for a new account, or {} to join as yourself.');
          }
          const body = (req.body ?? {}) as Record<string, unknown>;
          const account = Object.keys(body).length ? parseBody(newAccountAcceptSchema, body) : null;
          const done = await acceptInvitation(sequelize, String(req.params.token), req.user, account);
          if (done.created) await signIn(req, done.user);
          res.status(201).json({ user: done.user, garden: presentGarden(done.garden, done.role) });
        },
      },
    ],
    table,
  );
  return router;
}
