import session from 'express-session';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../../config';
import { SqlSessionStore } from './session-store';

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number;
    /** The browser's User-Agent at sign-in (cut to 255 characters), for the account's list of sessions. */
    userAgent?: string;
    passport?: { user?: number };
  }
}

export const SESSION_COOKIE = 'heatclock.sid';

export function createSessionStore(sequelize: Sequelize, config: AppConfig) {
  return new SqlSessionStore(sequelize, { sweepEveryMs: config.env === 'test' ? 0 : 15 * 60_000 });
}

/** Sessions live in MariaDB (never in memory) so any app instance can serve any request. */
export function sessionMiddleware(store: SqlSessionStore, config: AppConfig): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.trustProxy ? true : undefined,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.cookieSecure,
      maxAge: config.sessionIdleMs,
      path: '/',
    },
  });
}

/** Ends sessions older than the absolute lifetime, whatever their recent activity. */
export function absoluteTimeout(config: AppConfig): RequestHandler {
  return (req, _res, next) => {
    const started = req.session?.signedInAt;
    if (started && Date.now() - started > config.sessionAbsoluteMs) {
      // regenerate (not destroy) leaves an empty session, which passport expects to find.
      req.session.regenerate((err) => next(err));
      return;
    }
    next();
  };
}
