import { loadConfig } from './config';
import { createSequelize } from './db/sequelize';
import { initModels } from './db/models';
import { createApp } from './app';
import { createLogger } from './lib/logger';
import { scheduleWeatherJob } from './jobs/weather-job';
import type { WeatherService } from './modules/weather/weather.service';
import type { Worker } from './jobs/worker';
import type { MailSender } from './modules/notifications/mail-sender';
import { scheduleDigests } from './modules/notifications/digest-job';

const config = loadConfig();
const logger = createLogger(config.logLevel);
const sequelize = createSequelize(config.db);
initModels(sequelize);

if (config.weather.mode === 'fake') {
  const { startFakeWeather } = await import('../fixtures/weather/server');
  startFakeWeather('bypass');
  logger.info('weather service: local fake (fixtures); set WEATHER_MODE=live for Open-Meteo');
}

let mailConfig = config.mail;
// Like the fake weather: messages go to a local capture server, shown on the Mailbox page.
const fakeSmtp =
  config.mail.mode === 'fake' ? await (await import('../fixtures/mail/smtp-fake')).startFakeSmtp({ sequelize, port: config.mail.fakePort }) : null;
if (fakeSmtp) {
  mailConfig = { ...config.mail, fakePort: fakeSmtp.port };
  logger.info('mail: local fake SMTP (captured in the mailbox page)', { port: fakeSmtp.port });
}

const app = createApp({ config: { ...config, mail: mailConfig }, sequelize, logger });
const weather = app.locals.weather as WeatherService;
// Every instance runs the event worker: claims are per row, so instances share the work.
const worker = app.locals.worker as Worker;
worker.start();
// Every instance sends: each outbox row is claimed by one sender through its lease.
const mailSender = app.locals.mailSender as MailSender;
mailSender.start();
const digestTask = config.scheduler ? scheduleDigests(sequelize, logger) : null;
const task = config.scheduler
  ? scheduleWeatherJob(weather, { cron: config.weather.cron, timeZone: config.weather.cronTimeZone, logger })
  : null;
// History left incomplete by an earlier stop is resumed in the background.
void weather.backfillPending().catch((err: Error) => logger.error('backfill on start failed', { error: err.message }));
const server = app.listen(config.port, config.host, () => {
  const addr = server.address();
  const port = typeof addr === 'object' && addr ? addr.port : config.port;
  const host = config.host.includes(':') ? `[${config.host}]` : config.host;
  process.stdout.write(`\nHeatclock is running at http://${host}:${port}\n\n`);
});
server.keepAliveTimeout = 65_000;
server.headersTimeout = 66_000;

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info('shutting down', { signal });
  await task?.stop();
  await digestTask?.stop();
  // Requests in flight finish before the database closes under them (at most 10 s).
  const drained = new Promise((resolve) => server.close(resolve));
  server.closeIdleConnections();
  await Promise.race([drained, new Promise((resolve) => setTimeout(resolve, 10_000).unref())]);
  await weather.idle();
  await worker.stop();
  await mailSender.stop();
  await fakeSmtp?.close();
  await sequelize.close().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('unhandledRejection', (reason) => {
  logger.error('unhandled rejection', { error: reason instanceof Error ? reason.stack : String(reason) });
});
process.on('uncaughtException', (err) => {
  logger.error('uncaught exception', { error: err.stack });
  void shutdown('uncaughtException');
});
