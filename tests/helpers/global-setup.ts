import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db/sequelize';
import { migrate } from '../../server/db/migrate';
import { initModels } from '../../server/db/models';
import { seedDemo } from '../../server/db/seeders/demo';

/**
 * Once per run: brings the test database's schema up to date and seeds the invented demo the
 * browser tests sign in to (scripts/test.sh has started MariaDB).
 */
export default async function setup() {
  if (process.env.HEATCLOCK_NO_DB) return;
  process.env.NODE_ENV = 'test';
  const config = loadConfig();
  const sequelize = createSequelize(config.db);
  try {
    await migrate(sequelize);
    initModels(sequelize);
    await seedDemo(sequelize);
  } finally {
    await sequelize.close();
  }
}
