import path from 'node:path';
import { existsSync } from 'node:fs';
import express from 'express';
import helmet from 'helmet';
import compression from 'compression';
import expressStaticGzip from 'express-static-gzip';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config';
import { projectRoot } from './config';
import { AppError, errorHandler } from './errors';
import { createLogger } from './lib/logger';
import type { Logger } from './lib/logger';
import { csrfGuard, noStore, requestId } from './lib/request-guards';
import { overloadShed } from './lib/overload';
import { ReadCache } from './lib/read-cache';
import { accessContext, gardenIdOfPath } from './lib/garden-access';
import { localeContext, resolveDateTokens } from './lib/locale';
import type { RouteTableEntry } from './lib/routes';
import { absoluteTimeout, createSessionStore, sessionMiddleware } from './modules/auth/session';
import { configurePassport } from './modules/auth/passport';
import { authRouter } from './modules/auth/auth.router';
import { accountRouter } from './modules/account/account.router';
import { gardensRouter } from './modules/gardens/gardens.router';
import { healthRouter } from './modules/health/health.router';
import { bedsRouter } from './modules/beds/beds.router';
import { cropsRouter } from './modules/crops/crops.router';
import { varietiesRouter } from './modules/varieties/varieties.router';
import { seedLotsRouter } from './modules/seed-lots/seed-lots.router';
import { plantingsRouter } from './modules/plantings/plantings.router';
import { photosRouter } from './modules/photos/photos.router';
import { weatherRouter } from './modules/weather/weather.router';
import { climateRouter } from './modules/climate/climate.router';
import { chillRouter } from './modules/chill/chill.router';
import { placesRouter } from './modules/places/places.router';
import { soilRouter } from './modules/soil/soil.router';
import { WeatherService } from './modules/weather/weather.service';
import { createWeatherClient } from './integrations/weather/open-meteo';
import { ProgressService } from './modules/progress/progress.service';
import { progressRouter } from './modules/progress/progress.router';
import { planRouter } from './modules/plan/plan.router';
import { compareRouter } from './modules/compare/compare.router';
import { registerProgressInvalidation } from './modules/progress/progress-invalidation';
import { plantingProgressProcessor } from './jobs/processors/planting-progress';
import { AlertService } from './modules/alerts/alerts.service';
import { alertsRouter } from './modules/alerts/alerts.router';
import { alertsProcessor } from './jobs/processors/alerts';
import { createWorker } from './jobs/worker';
import type { Worker } from './jobs/worker';
import { createMailTransport } from './integrations/mail/transport';
import type { MailTransport } from './integrations/mail/transport';
import { configureMail } from './modules/notifications/mail-settings';
import { createMailSender, mailQueued } from './modules/notifications/mail-sender';
import { enqueueAlertMail } from './modules/notifications/alert-mail';
import { notificationsRouter } from './modules/notifications/notifications.router';
import { auditRouter } from './modules/audit/audit.router';
import { unsubscribeRouter } from './modules/notifications/unsubscribe.router';
import { CalendarService } from './modules/calendar/calendar.service';
import { calendarRouter } from './modules/calendar/calendar.router';
import { membersRouter } from './modules/members/members.router';
import { invitationsRouter } from './modules/invitations/invitations.router';
import { degreeDaysCsvRouter } from './modules/progress/degree-days-csv';

const IMMUTABLE = 'public, max-age=31536000, immutable';

export interface AppDeps {
  config: AppConfig;
  sequelize: Sequelize;
  logger?: Logger;
  /** Folder with the built client; served with a single-page fallback when present. */
  clientDir?: string | null;
  /** Injected in tests and benchmarks; built from config otherwise. */
  weather?: WeatherService;
  /** Runs the garden event processors; one is made (not started) when none is given. */
  worker?: Worker;
  /** Where the mail outbox sends; built from config (the local fake or SMTP_URL) otherwise. */
  mailTransport?: MailTransport;
}

export function createWeatherService(config: AppConfig, sequelize: Sequelize, logger: Logger, now?: () => Date) {
  const client = createWeatherClient({
    timeoutMs: config.weather.timeoutMs,
    retries: config.weather.retries,
    backoffMs: config.weather.backoffMs,
    logger,
  });
  return new WeatherService({
    sequelize,
    client,
    logger,
    settings: { historyYears: config.weather.historyYears, concurrency: config.weather.concurrency },
    now,
  });
}

export function createApp({ config, sequelize, logger = createLogger(config.logLevel), clientDir, weather, worker, mailTransport }: AppDeps) {
  const app = express();
  // Dates in stored text are worded for the reader on the way out (lib/locale.ts).
  app.set('json replacer', resolveDateTokens);
  const weatherService = weather ?? createWeatherService(config, sequelize, logger);
  const eventWorker = worker ?? createWorker({ sequelize, logger });
  weatherService.onEventsCommitted(() => eventWorker.kick());
  app.locals.sequelize = sequelize;
  app.locals.weather = weatherService;
  const progress = new ProgressService(sequelize, weatherService);
  app.locals.progress = progress;
  registerProgressInvalidation();
  const alerts = new AlertService(sequelize, weatherService, progress);
  app.locals.alerts = alerts;
  eventWorker.register(plantingProgressProcessor(progress, alerts));
  eventWorker.register(alertsProcessor(alerts));
  app.locals.worker = eventWorker;
  configureMail(config);
  // Not started here: server/index.ts starts it on every instance, tests call drain().
  app.locals.mailSender = createMailSender({ sequelize, transport: mailTransport ?? createMailTransport(config.mail), logger });
  // New and worsened alerts are written to the mail outbox in the evaluation's own transaction.
  alerts.mail = { enqueue: enqueueAlertMail, afterCommit: mailQueued };
  // Garden reads keyed by the garden's change counters (read-cache.ts).
  const readCache = new ReadCache(() => weatherService.now());
  app.locals.readCache = readCache;
  const routes: RouteTableEntry[] = [];
  app.locals.routes = routes;
  app.disable('x-powered-by');
  if (config.trustProxy) app.set('trust proxy', config.trustProxy);

  app.use(requestId);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'"],
          'connect-src': ["'self'"],
          'object-src': ["'none'"],
          'base-uri': ["'none'"],
          'frame-ancestors': ["'none'"],
          'form-action': ["'self'"],
          'upgrade-insecure-requests': config.cookieSecure ? [] : null,
        },
      },
      strictTransportSecurity: config.cookieSecure,
    }),
  );

  // API answers and the page shell are compressed as they are sent (brotli quality 4 or gzip);
  // built assets come pre-compressed from the static handler below, so they are skipped here.
  app.use(compression({ threshold: 1024, filter: (req, res) => !req.path.startsWith('/assets/') && compression.filter(req, res) }));

  const api = express.Router();
  // Only /api requests go through sessions, body parsing and CSRF checks: the page shell and its
  // assets load without touching the database, so an outage can still be shown to the grower.
  api.use((req, _res, next) => next(req.path === '/api' || req.path.startsWith('/api/') ? undefined : 'router'));
  api.use(noStore);
  // Health and readiness must answer even when sessions (in MariaDB) cannot load.
  api.use(healthRouter(sequelize, routes));
  // Past capacity, refuse quickly (503 + Retry-After) rather than let every answer slow down.
  const shed = overloadShed(config.overload);
  app.locals.overload = shed;
  api.use(shed);
  api.use(express.json({ limit: '100kb', strict: true, type: 'application/json' }));
  api.use(unsubscribeRouter({ sequelize, table: routes }));
  api.use(csrfGuard);
  const sessions = createSessionStore(sequelize, config);
  app.locals.sessions = sessions;
  api.use(localeContext);
  // The garden a path names, so the session read can bring the member's access to it (garden-access.ts).
  api.use((req, _res, next) => accessContext.run({ gardenId: gardenIdOfPath(req.path) }, next));
  api.use(sessionMiddleware(sessions, config));
  api.use(absoluteTimeout(config));
  const passport = configurePassport(sessions);
  api.use(passport.initialize());
  api.use(passport.session());
  api.use(authRouter({ sequelize, config, passport, table: routes }));
  api.use(accountRouter({ sequelize, config, sessions, table: routes }));
  api.use(gardensRouter({ table: routes, weather: weatherService }));
  api.use(climateRouter({ sequelize, weather: weatherService, table: routes, cache: readCache }));
  api.use(chillRouter({ sequelize, table: routes, cache: readCache }));
  api.use(placesRouter(routes));
  api.use(soilRouter({ sequelize, table: routes, cache: readCache, now: () => weatherService.now() }));
  api.use(weatherRouter({ sequelize, weather: weatherService, table: routes, cache: readCache, evaluate: (gardenId) => alerts.evaluate(gardenId) }));
  api.use(bedsRouter(routes));
  api.use(cropsRouter(routes));
  api.use(varietiesRouter(routes, weatherService, readCache, progress));
  api.use(seedLotsRouter(routes, readCache));
  api.use(progressRouter(progress, alerts, routes, readCache));
  api.use(planRouter(routes, weatherService, readCache));
  api.use(compareRouter(routes, progress, readCache));
  api.use(alertsRouter(alerts, routes, readCache));
  api.use(plantingsRouter(config, routes, progress, readCache));
  api.use(photosRouter(config, routes));
  api.use(calendarRouter(new CalendarService({ sequelize, progress, alerts, appUrl: config.mail.appUrl, secret: config.sessionSecret }), routes));
  api.use(membersRouter({ sequelize, table: routes }));
  api.use(invitationsRouter({ sequelize, table: routes, mailIsLocalFake: config.mail.mode === 'fake' }));
  api.use(degreeDaysCsvRouter(progress, routes));
  api.use(notificationsRouter({ sequelize, table: routes, mailIsLocalFake: config.mail.mode === 'fake' }));
  api.use(auditRouter(sequelize, routes));
  api.use('/api', () => {
    throw new AppError(404, 'not_found', 'No such API route.');
  });
  app.use(api);

  const dir = clientDir === undefined ? path.join(projectRoot, 'dist', 'client') : clientDir;
  if (dir && existsSync(path.join(dir, 'index.html'))) {
    const assets = path.join(dir, 'assets') + path.sep;
    // The build writes .br and .gz beside each script and stylesheet; they are sent as they are.
    app.use(
      expressStaticGzip(dir, {
        enableBrotli: true,
        orderPreference: ['br', 'gzip'],
        index: false,
        serveStatic: {
          index: false,
          // Files under assets/ carry a content hash in their name: they never change. Anything
          // else (the page shell, icons) is checked again each time.
          setHeaders: (res, file) => res.setHeader('Cache-Control', file.startsWith(assets) ? IMMUTABLE : 'no-cache'),
        },
      }),
    );
    app.get('/{*splat}', (_req, res) => {
      res.set('Cache-Control', 'no-cache');
      res.sendFile(path.join(dir, 'index.html'));
    });
  }

  app.use(errorHandler(logger));
  return app;
}
