import { Router } from 'express';
import type { Request, RequestHandler, Response, NextFunction } from 'express';
import type { configurePassport } from './passport';
import type { Sequelize } from 'sequelize';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { loginSchema, registerSchema } from '#shared/schemas/auth';
import type { UserDto } from '#shared/schemas/auth';
import type { AppConfig } from '../../config';
import { AppError } from '../../errors';
import { parseBody } from '../../lib/validate';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { presentGarden } from '../gardens/gardens.presenter';
import { MariaDbRateLimitStore } from './rate-limit-store';
import { INVALID_CREDENTIALS } from './auth.service';
import { CHECK_EMAIL, confirmRegistration, requestRegistration } from './registration.service';
import { presentUser } from './auth.presenter';
import { assertStrongPassword } from './password-strength';

/**
 * Passport ≥ 0.6 regenerates the session at login (new id); save it before answering. Every way
 * in (sign-in, a confirmed sign-up, an accepted invitation) signs in through this one function.
 */
export function signIn(req: Request, user: UserDto): Promise<void> {
  return new Promise((resolve, reject) =>
    req.login(user, (err) => {
      if (err) return reject(err instanceof Error ? err : new Error('Signing in failed.'));
      req.session.signedInAt = Date.now();
      req.session.userAgent = (req.get('user-agent') ?? '').slice(0, 255) || undefined;
      req.session.save((e: unknown) => (e ? reject(e instanceof Error ? e : new Error('The session could not be saved.')) : resolve()));
    }),
  );
}

export const emailOf = (req: Request) => {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
};
export const ipOf = (req: Request) => ipKeyGenerator(req.ip ?? '');

export interface LimiterOptions {
  prefix: string;
  windowMs: number;
  limit: number;
  key: (req: Request) => string;
  failuresOnly: boolean;
  what: string;
}

/** One limiter, counted in MariaDB so every instance sees the same attempts. */
export const dbRateLimiter = (sequelize: Sequelize, o: LimiterOptions) =>
  rateLimit({
    windowMs: o.windowMs,
    limit: o.limit,
    skipSuccessfulRequests: o.failuresOnly,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new MariaDbRateLimitStore(sequelize, o.prefix),
    keyGenerator: o.key,
    handler: (_req, res, _next, options) => {
      const retry = String(res.getHeader('Retry-After') ?? Math.ceil(options.windowMs / 1000));
      res.status(options.statusCode).json({
        error: {
          code: 'rate_limited',
          message: `Too many ${o.what}. Try again in ${retry} seconds.`,
          requestId: res.locals.requestId as string | undefined,
        },
      });
    },
  });

export function authRouter(deps: { sequelize: Sequelize; config: AppConfig; passport: ReturnType<typeof configurePassport>; table: RouteTableEntry[] }) {
  const { sequelize, config, passport, table } = deps;
  const router = Router();

  const limiter = (o: LimiterOptions) => dbRateLimiter(sequelize, o);
  // Sign-in failures per e-mail and address (a guessed password), and per address alone (made-up e-mails).
  const loginLimiters = [
    limiter({ prefix: 'login:', windowMs: config.loginWindowMs, limit: config.loginMaxFailures, key: (req) => `${emailOf(req)}|${ipOf(req)}`, failuresOnly: true, what: 'sign-in attempts' }),
    limiter({ prefix: 'login-ip:', windowMs: config.loginWindowMs, limit: config.loginMaxFailuresPerIp, key: ipOf, failuresOnly: true, what: 'sign-in attempts from your network' }),
  ];
  // Every registration counts, per address and per e-mail.
  const registerLimiters = [
    limiter({ prefix: 'register-ip:', windowMs: config.registerWindowMs, limit: config.registerMaxPerIp, key: ipOf, failuresOnly: false, what: 'new accounts from your network' }),
    limiter({ prefix: 'register:', windowMs: config.registerWindowMs, limit: config.registerMaxPerEmail, key: emailOf, failuresOnly: false, what: 'sign-ups with this e-mail' }),
  ];

  mountRoutes(
    router,
    '/api/auth',
    [
      {
        method: 'post',
        path: '/register',
        access: 'public',
        before: registerLimiters,
        handler: async (req, res) => {
          const input = parseBody(registerSchema, req.body);
          assertStrongPassword(input.password, input);
          // The same answer whether or not the address has an account; the e-mail tells the difference.
          await requestRegistration(sequelize, input);
          res.status(202).json(CHECK_EMAIL);
        },
      },
      {
        // Opened from the e-mail's link: creates the account and its first garden, then signs in.
        method: 'post',
        path: '/register/confirm/:token',
        access: 'public',
        handler: async (req, res) => {
          const { user, garden } = await confirmRegistration(sequelize, String(req.params.token));
          await signIn(req, presentUser(user));
          res.status(201).json({ user: presentUser(user), garden: presentGarden(garden, 'owner') });
        },
      },
      {
        method: 'post',
        path: '/login',
        access: 'public',
        before: [
          (req, _res, next) => {
            req.body = parseBody(loginSchema, req.body);
            next();
          },
          ...loginLimiters,
        ],
        handler: (req: Request, res: Response, next: NextFunction) => {
          (passport.authenticate as (strategy: string, done: (err: unknown, user: UserDto | false) => void) => RequestHandler)('local', (err: unknown, user: UserDto | false) => {
            if (err) return next(err);
            if (!user) return next(new AppError(401, 'invalid_credentials', INVALID_CREDENTIALS));
            signIn(req, user).then(() => res.json({ user }), next);
          })(req, res, next);
        },
      },
      {
        method: 'post',
        path: '/logout',
        access: 'public',
        handler: (req, res, next) => {
          if (!req.user) {
            res.status(204).end();
            return;
          }
          req.logout((err) => {
            if (err) return next(err);
            req.session.destroy((e) => {
              if (e) return next(e);
              res.clearCookie('heatclock.sid', { path: '/' });
              res.status(204).end();
            });
          });
        },
      },
      {
        method: 'get',
        path: '/me',
        access: 'signed-in',
        handler: (req, res) => {
          res.json({ user: req.user });
        },
      },
    ],
    table,
  );
  return router;
}
