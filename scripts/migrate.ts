/**
 * Applies migrations to the configured database. With --seed-demo it also seeds the invented
 * demo scenario and fetches its gardens' weather (from the local fake unless WEATHER_MODE=live).
 */
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { migrate, retryOnConflict } from '../server/db/migrate';
import { databaseIsEmpty, demoAlreadySeeded, seedDemo } from '../server/db/seeders/demo';
import { createLogger } from '../server/lib/logger';
import { createWeatherService } from '../server/app';
import { ProgressService } from '../server/modules/progress/progress.service';
import { AlertService } from '../server/modules/alerts/alerts.service';
import { enqueueAlertMail } from '../server/modules/notifications/alert-mail';
import { enqueueDigests } from '../server/modules/notifications/digests';

const config = loadConfig();
// No statement bound here: a migration's ALTER or index build on a big table may run for minutes
// (DB_QUERY_TIMEOUT_MS is for requests and jobs).
const sequelize = createSequelize({ ...config.db, queryTimeoutMs: 0 });
initModels(sequelize);
try {
  const applied = await migrate(sequelize);
  console.log(`[db] ${config.db.database}: ${applied.length ? `applied ${applied.join(', ')}` : 'schema up to date'}`);
  // The invented demo goes only into an empty local database, never into a deployment's.
  const wantDemo = process.argv.includes('--seed-demo') && (!process.env.DATABASE_URL || process.env.HEATCLOCK_DEMO === '1');
  if (wantDemo && !(await databaseIsEmpty()) && !(await demoAlreadySeeded())) {
    console.log('[db] accounts exist and none is the demo coordinator: demo not seeded');
  } else if (wantDemo) {
    const fake = config.weather.mode === 'fake' ? (await import('../fixtures/weather/server')).startFakeWeather('error') : null;
    const weather = createWeatherService(config, sequelize, createLogger('warn'));
    // The gardens' weather is fetched inside, and decides the past lettuce and spinach outcomes.
    const { users, gardens } = await seedDemo(sequelize, { weather });
    fake?.close();
    console.log(`[db] demo ready: ${gardens.length} gardens, ${users.length} accounts, weather from the ${config.weather.mode === 'fake' ? 'local fake' : 'weather service'}`);
    // Alerts from that weather, and today's digest for each demo member: the server sends them on start.
    const alerts = new AlertService(sequelize, weather, new ProgressService(sequelize, weather));
    alerts.mail = { enqueue: enqueueAlertMail, afterCommit: () => undefined };
    // Instances starting together (on several Galera nodes) may conflict here: each step is idempotent and retried.
    for (const garden of gardens) await retryOnConflict(() => alerts.evaluate(garden.id));
    const digests = await retryOnConflict(() => enqueueDigests(sequelize, new Date(), { onlyGardens: gardens.map((g) => g.id), anyHour: true }));
    console.log(`[db] demo alerts evaluated; ${digests} digest${digests === 1 ? '' : 's'} queued for the local mailbox`);
  }
} finally {
  await sequelize.close();
}
