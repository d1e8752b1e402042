/**
 * One app instance's nightly weather run, as a separate process on one Galera node, for
 * scale-out.cluster.ts (the models are process-wide, so each instance needs a process of its own).
 * Settings come from the environment like the server's (DB_PORT picks the node).
 *   setup <count>  gardens at <count> new places, each in its own cell; prints {"cellIds":[…]}
 *   nightly        waits until START_AT (epoch ms), runs the nightly refresh against the fake
 *                  weather service; prints {"run":{…},"fetched":[[lat,lon],…]} (one per forecast request)
 *   alerts-setup   demo gardens' alerts, evaluations and mail forgotten, every member on immediate mail;
 *                  prints {"gardenIds":[…]}
 *   alerts <ids>   waits until START_AT, evaluates those gardens' alerts (mail queued in the same
 *                  transaction, as the app does), then drains the outbox through its own sender to
 *                  its own fake SMTP; prints {"evaluated":n,"opened":n,"retried":n,"ms":…,"endedAt":…}
 * The last line of stdout is the JSON answer.
 */
import { randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db/sequelize';
import { Garden, initModels } from '../../server/db/models';
import { createWeatherService } from '../../server/app';
import { createLogger } from '../../server/lib/logger';
import { startFakeWeather } from '../../fixtures/weather/server';
import { fakeWeather } from '../../fixtures/weather/control';
import { startFakeSmtp } from '../../fixtures/mail/smtp-fake';
import { ALERT_TYPES } from '#shared/schemas/alerts';
import { retryOnConflict } from '../../server/db/migrate';
import { ProgressService } from '../../server/modules/progress/progress.service';
import { AlertService } from '../../server/modules/alerts/alerts.service';
import { enqueueAlertMail } from '../../server/modules/notifications/alert-mail';
import { createMailTransport } from '../../server/integrations/mail/transport';
import { createMailSender } from '../../server/modules/notifications/mail-sender';

const config = loadConfig();
const sequelize = createSequelize(config.db);
initModels(sequelize);
const logger = createLogger('warn');
const weather = createWeatherService(config, sequelize, logger);

async function setup(count: number) {
  const cellIds: number[] = [];
  for (let i = 0; i < count; i++) {
    // Places on a grid no demo garden uses: each its own 0.1° cell.
    const garden = await Garden.create({ name: `Cluster plot ${Date.now()}-${i}`, latitude: 10.02 + i * 0.3, longitude: 20.02 + i * 0.3, timeZone: 'Europe/Berlin', units: 'C' });
    const cellId = await weather.locateGarden(garden);
    if (cellId) cellIds.push(cellId);
  }
  await weather.idle();
  // Every cell is due, as at the start of a night.
  await sequelize.query('UPDATE weather_cells SET refreshed_at = NULL, lease_owner = NULL, lease_until = NULL');
  return { cellIds };
}

async function nightly() {
  const fake = startFakeWeather('bypass');
  fakeWeather.latencyMs = 40;
  const startAt = Number(process.env.START_AT ?? 0);
  if (startAt > Date.now()) await new Promise((r) => setTimeout(r, startAt - Date.now()));
  const begun = Date.now();
  const run = await weather.runRefresh({ kind: 'nightly' });
  await weather.idle();
  const endedAt = Date.now();
  fake.close();
  const fetched = fakeWeather.requests
    .map((r) => new URL(r.url))
    .filter((u) => u.pathname.endsWith('/forecast'))
    .map((u) => [Number(u.searchParams.get('latitude')), Number(u.searchParams.get('longitude'))]);
  const [row] = await sequelize.query('SELECT status, cells_ok AS cellsOk, cells_failed AS cellsFailed, claim_conflicts AS claimConflicts FROM job_runs WHERE id = ?', {
    replacements: [run.runId],
    type: QueryTypes.SELECT,
  });
  return { run, row, fetched, ms: endedAt - begun, begunAt: begun, endedAt };
}

async function alertsSetup() {
  const gardens = await sequelize.query<{ id: number }>(
    "SELECT DISTINCT m.garden_id AS id FROM memberships m JOIN users u ON u.id = m.user_id WHERE u.email LIKE '%@hollowbrook.example' ORDER BY id",
    { type: QueryTypes.SELECT },
  );
  const ids = gardens.map((g) => g.id);
  await sequelize.query('DELETE FROM mail_outbox WHERE garden_id IN (?)', { replacements: [ids] });
  await sequelize.query('DELETE FROM alerts WHERE garden_id IN (?)', { replacements: [ids] });
  await sequelize.query('DELETE FROM alert_evaluations WHERE garden_id IN (?)', { replacements: [ids] });
  const members = await sequelize.query<{ userId: number; gardenId: number }>('SELECT user_id AS userId, garden_id AS gardenId FROM memberships WHERE garden_id IN (?)', {
    replacements: [ids],
    type: QueryTypes.SELECT,
  });
  for (const m of members) {
    await sequelize.query(
      `INSERT INTO notification_preferences (user_id, garden_id, delivery, digest_hour, types_json, unsubscribe_nonce, created_at, updated_at)
       VALUES (?, ?, 'immediate', 7, ?, ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))
       ON DUPLICATE KEY UPDATE delivery = 'immediate', types_json = VALUES(types_json)`,
      { replacements: [m.userId, m.gardenId, JSON.stringify(ALERT_TYPES), randomBytes(16).toString('base64url').slice(0, 22)] },
    );
  }
  return { gardenIds: ids };
}

async function alerts(gardenIds: number[]) {
  const smtp = await startFakeSmtp({ sequelize });
  const transport = createMailTransport({ ...config.mail, mode: 'fake', smtpUrl: null, fakePort: smtp.port });
  const sender = createMailSender({ sequelize, transport, logger, onlyGardens: gardenIds });
  const service = new AlertService(sequelize, weather, new ProgressService(sequelize, weather));
  service.mail = { enqueue: enqueueAlertMail, afterCommit: () => undefined };
  const startAt = Number(process.env.START_AT ?? 0);
  if (startAt > Date.now()) await new Promise((r) => setTimeout(r, startAt - Date.now()));
  let retried = 0;
  let opened = 0;
  // As the event worker would: an evaluation that lost a conflict is run again (it is idempotent).
  const begun = Date.now();
  for (const id of gardenIds) opened += (await retryOnConflict(() => service.evaluate(id), { onRetry: () => retried++ })).opened;
  await sender.drain();
  const endedAt = Date.now();
  await smtp.close();
  return { evaluated: gardenIds.length, opened, retried, ms: endedAt - begun, begunAt: begun, endedAt };
}

const [mode, arg] = process.argv.slice(2);
const work =
  mode === 'setup' ? setup(Number(arg ?? 10)) : mode === 'alerts-setup' ? alertsSetup() : mode === 'alerts' ? alerts(arg.split(',').map(Number)) : nightly();
work.then(
  async (answer) => {
    await sequelize.close();
    process.stdout.write(`\n${JSON.stringify(answer)}\n`);
    process.exit(0);
  },
  (err: unknown) => {
    process.stderr.write(`${(err as Error).stack ?? String(err)}\n`);
    process.exit(1);
  },
);
