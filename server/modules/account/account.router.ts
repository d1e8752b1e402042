import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { emailChangeSchema, nameChangeSchema, passwordChangeSchema, passwordResetRequestSchema, passwordResetSchema } from '#shared/schemas/account';
import type { AppConfig } from '../../config';
import { parseBody, parseChange } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { dbRateLimiter, emailOf, ipOf } from '../auth/auth.router';
import type { SqlSessionStore } from '../auth/session-store';
import { PASSWORD_RESET_DONE, RESET_REQUESTED, checkResetLink, requestPasswordReset, resetPassword } from './password-reset.service';
import { EMAIL_CHANGE_REQUESTED, changeName, changePassword, confirmEmailChange, requestEmailChange } from './account.service';
import { endSession, listSessions } from './sessions.service';

export function accountRouter(deps: { sequelize: Sequelize; config: AppConfig; sessions: SqlSessionStore; table: RouteTableEntry[] }) {
  const { sequelize: db, config, sessions, table } = deps;
  const router = Router();

  // Every reset request counts, per address and per e-mail (the same for e-mails without an account).
  const resetLimiters = [
    dbRateLimiter(db, { prefix: 'reset-ip:', windowMs: config.passwordResetWindowMs, limit: config.passwordResetMaxPerIp, key: ipOf, failuresOnly: false, what: 'password reset requests from your network' }),
    dbRateLimiter(db, { prefix: 'reset:', windowMs: config.passwordResetWindowMs, limit: config.passwordResetMaxPerEmail, key: emailOf, failuresOnly: false, what: 'password reset requests for this e-mail' }),
  ];
  // A stolen session must not become a way to guess the password: wrong current passwords count like failed sign-ins.
  const currentPasswordLimiter = dbRateLimiter(db, {
    prefix: 'current-password:',
    windowMs: config.loginWindowMs,
    limit: config.loginMaxFailures,
    key: (req) => String(req.user?.id ?? ''),
    failuresOnly: true,
    what: 'wrong current passwords',
  });

  // Every e-mail change request mails an address the user typed: at most 3 an hour per account and
  // per new address, so the app's mail cannot be turned on someone's inbox.
  const emailChangeLimiters = [
    dbRateLimiter(db, { prefix: 'email-change:', windowMs: 60 * 60_000, limit: 3, key: (req) => String(req.user?.id ?? ''), failuresOnly: false, what: 'e-mail change requests from your account' }),
    dbRateLimiter(db, { prefix: 'email-change-to:', windowMs: 60 * 60_000, limit: 3, key: emailOf, failuresOnly: false, what: 'e-mail change requests to this address' }),
  ];

  mountRoutes(
    router,
    '/api/auth/password-reset',
    [
      {
        method: 'post',
        path: '/',
        access: 'public',
        before: resetLimiters,
        handler: async (req, res) => {
          const { email } = parseBody(passwordResetRequestSchema, req.body);
          await requestPasswordReset(db, email);
          res.status(202).json(RESET_REQUESTED);
        },
      },
      {
        method: 'get',
        path: '/:token',
        access: 'public',
        handler: async (req, res) => {
          await checkResetLink(db, String(req.params.token));
          res.json({ status: 'usable' });
        },
      },
      {
        method: 'post',
        path: '/:token',
        access: 'public',
        handler: async (req, res) => {
          const { password } = parseBody(passwordResetSchema, req.body);
          await resetPassword(db, sessions, String(req.params.token), password);
          res.json(PASSWORD_RESET_DONE);
        },
      },
    ],
    table,
  );

  mountRoutes(
    router,
    '/api/me',
    [
      {
        method: 'patch',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          const { name } = parseChange(nameChangeSchema.partial(), req.body);
          const user = requireSignedIn(req);
          res.json({ user: name === undefined ? user : await changeName(db, user.id, name) });
        },
      },
      {
        method: 'post',
        path: '/email-change',
        access: 'signed-in',
        before: [currentPasswordLimiter, ...emailChangeLimiters],
        handler: async (req, res) => {
          const input = parseBody(emailChangeSchema, req.body);
          await requestEmailChange(db, requireSignedIn(req).id, input);
          res.status(202).json(EMAIL_CHANGE_REQUESTED);
        },
      },
      {
        method: 'post',
        path: '/email-change/:token',
        access: 'signed-in',
        handler: async (req, res) => {
          res.json({ user: await confirmEmailChange(db, requireSignedIn(req).id, String(req.params.token)) });
        },
      },
      {
        method: 'post',
        path: '/password',
        access: 'signed-in',
        before: [currentPasswordLimiter],
        handler: async (req, res) => {
          const input = parseBody(passwordChangeSchema, req.body);
          const endedSessions = await changePassword(db, sessions, requireSignedIn(req).id, req.sessionID, input);
          res.json({ status: 'password-changed', message: 'Your password is changed. Your other devices are signed out; this one stays signed in.', endedSessions });
        },
      },
      {
        method: 'get',
        path: '/sessions',
        access: 'signed-in',
        handler: async (req, res) => {
          res.json({ items: await listSessions(db, requireSignedIn(req).id, req.sessionID) });
        },
      },
      {
        method: 'post',
        path: '/sessions/sign-out-others',
        access: 'signed-in',
        handler: async (req, res) => {
          res.json({ ended: await sessions.endAllFor(requireSignedIn(req).id, req.sessionID) });
        },
      },
      {
        method: 'delete',
        path: '/sessions/:id',
        access: 'signed-in',
        handler: async (req, res) => {
          await endSession(db, sessions, requireSignedIn(req).id, String(req.params.id));
          res.status(204).end();
        },
      },
    ],
    table,
  );
  return router;
}
