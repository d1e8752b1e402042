/**
 * The process the alert-mail crash drill kills (tests/drills/alert-mail-crash.test.ts):
 * `node --import tsx tests/drills/alert-crash-child.ts <gardenId> <mode> <now ISO>`.
 * It evaluates one garden's alerts through the app's AlertService with the mail outbox wired as
 * createApp wires it, and then stops where the drill wants to be killed:
 * - `after-commit`: the evaluation's transaction (alerts + outbox row) has committed; the process
 *   freezes inside the after-commit hook, before any sender could look at the row;
 * - `mid-send`: a sender of this process (the garden's rows only, a short lease) has claimed the
 *   row and is talking to an SMTP server that accepts the connection and never answers.
 * Progress goes to stdout as one JSON line per step. It exits when its stdin closes (the test ended).
 */
import net from 'node:net';
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { createApp, createWeatherService } from '../../server/app';
import { createLogger } from '../../server/lib/logger';
import { createMailTransport } from '../../server/integrations/mail/transport';
import { createMailSender } from '../../server/modules/notifications/mail-sender';
import type { AlertService } from '../../server/modules/alerts/alerts.service';
import { startFakeWeather } from '../../fixtures/weather/server';

const [gardenArg, mode, nowIso] = process.argv.slice(2);
const gardenId = Number(gardenArg);
if (!Number.isInteger(gardenId) || !['after-commit', 'mid-send'].includes(mode) || Number.isNaN(Date.parse(nowIso))) {
  process.stderr.write('usage: alert-crash-child.ts <gardenId> after-commit|mid-send <now ISO>\n');
  process.exit(2);
}
const say = (step: string, extra: Record<string, unknown> = {}) => process.stdout.write(`${JSON.stringify({ step, ...extra })}\n`);
process.stdin.on('end', () => process.exit(0));
process.stdin.resume();

// An SMTP server that takes the connection and never greets: a send that is in progress for good.
const silent = net.createServer(() => undefined);
await new Promise<void>((resolve) => silent.listen(0, '127.0.0.1', resolve));
const silentPort = (silent.address() as net.AddressInfo).port;

const config = loadConfig({ ...process.env, NODE_ENV: 'test' });
const sequelize = createSequelize(config.db);
initModels(sequelize);
startFakeWeather('error');
const logger = createLogger('silent');
const now = () => new Date(nowIso);
const weather = createWeatherService(config, sequelize, logger, now);
const transport = createMailTransport({ ...config.mail, mode: 'fake', smtpUrl: null, fakePort: silentPort });
const app = createApp({ config, sequelize, clientDir: null, weather, logger, mailTransport: transport });
const alerts = app.locals.alerts as AlertService;

if (mode === 'after-commit') {
  const mail = alerts.mail!;
  alerts.mail = {
    enqueue: (transaction, id, alertIds) => mail.enqueue(transaction, id, alertIds),
    afterCommit: () => {
      say('committed');
      // Frozen here, the commit done and no sender told: the drill kills the process now.
      Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0);
    },
  };
} else {
  // Started before the evaluation, so the commit's kick makes it claim the row at once.
  createMailSender({ sequelize, transport, logger, onlyGardens: [gardenId], leaseMs: 5000, pollMs: 50 }).start();
}
say('ready');
const result = await alerts.evaluate(gardenId);
say('evaluated', { notified: result.notified.length });
