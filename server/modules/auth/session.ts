import session from 'express-session';
import ConnectSessionSequelize from 'connect-session-sequelize';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../../config';

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number;
    passport?: { user?: number };
  }
}

export const SESSION_COOKIE = 'heatclock.sid';

/** Sessions live in MariaDB (never in memory) so any app instance can serve any request. */
export function sessionMiddleware(sequelize: Sequelize, config: AppConfig): RequestHandler {
  const SequelizeStore = ConnectSessionSequelize(session.Store);
  const store = new SequelizeStore({
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: config.env === 'test' ? 0 : 15 * 60_000,
    expiration: config.sessionIdleMs,
    extendDefaultFields: (defaults: { data: string; expires: Date }, s: { passport?: { user?: number } }) => ({
      data: defaults.data,
      expires: defaults.expires,
      userId: s.passport?.user ?? null,
    }),
  });
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
