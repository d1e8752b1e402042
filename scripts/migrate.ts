/** Applies migrations to the configured database; with --seed-demo also seeds the demo scenario. */
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { migrate } from '../server/db/migrate';
import { seedDemo } from '../server/db/seeders/demo';

const config = loadConfig();
const sequelize = createSequelize(config.db);
initModels(sequelize);
try {
  const applied = await migrate(sequelize);
  console.log(`[db] ${config.db.database}: ${applied.length ? `applied ${applied.join(', ')}` : 'schema up to date'}`);
  if (process.argv.includes('--seed-demo')) {
    const { users, gardens } = await seedDemo(sequelize);
    console.log(`[db] demo ready: ${gardens.length} gardens, ${users.length} accounts`);
  }
} finally {
  await sequelize.close();
}
