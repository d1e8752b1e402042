import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db/sequelize';
import { migrate } from '../../server/db/migrate';

/** Brings the test database's schema up to date once per run (scripts/test.sh has started MariaDB). */
export default async function setup() {
  if (process.env.HEATCLOCK_NO_DB) return;
  process.env.NODE_ENV = 'test';
  const config = loadConfig();
  const sequelize = createSequelize(config.db);
  try {
    await migrate(sequelize);
  } finally {
    await sequelize.close();
  }
}
