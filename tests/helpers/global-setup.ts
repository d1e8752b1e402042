import type { TestProject } from 'vitest/node';
import { QueryTypes } from 'sequelize';
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db/sequelize';
import { migrate } from '../../server/db/migrate';
import { initModels } from '../../server/db/models';
import { seedDemo } from '../../server/db/seeders/demo';
import { perWorkerDatabases, workerDatabase } from './worker-db';

/**
 * Once per run: brings each test worker's database (tests/helpers/worker-db.ts) up to date and
 * seeds the invented demo the browser tests sign in to (scripts/test.sh has started MariaDB).
 */
export default async function setup(project: TestProject) {
  if (process.env.HEATCLOCK_NO_DB) return;
  process.env.NODE_ENV = 'test';
  const config = loadConfig();
  const base = config.db.database;
  const names = perWorkerDatabases() ? Array.from({ length: Math.max(1, project.config.maxWorkers) }, (_, i) => workerDatabase(base, i + 1)) : [base];
  const admin = createSequelize(config.db);
  try {
    for (const name of names) {
      await admin.query(`CREATE DATABASE IF NOT EXISTS \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`, { type: QueryTypes.RAW });
    }
  } finally {
    await admin.close();
  }
  // One after another: the models are bound to one connection at a time.
  for (const name of names) {
    const sequelize = createSequelize({ ...config.db, database: name });
    try {
      await migrate(sequelize);
      initModels(sequelize);
      await seedDemo(sequelize);
    } finally {
      await sequelize.close();
    }
  }
}
