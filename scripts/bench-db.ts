/**
 * The bench database is shared by the benches one after another (npm run bench runs weather,
 * alerts, then api, and again on the next run): each starts from no gardens and no weather, or
 * a garden left by another bench holds foreign keys on what this one deletes (DELETE FROM gardens
 * failed on the plantings bench:alerts had left). Accounts, sessions and the schema's own tables
 * stay; bench:api seeds its accounts again.
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';

const KEPT = new Set(['schema_migrations', 'schema_lock', 'users', 'sessions', 'account_tokens', 'calendar_feeds', 'calendar_event_versions', 'pending_registrations', 'rate_limits', 'captured_mail']);

export async function emptyBenchGardens(sequelize: Sequelize): Promise<void> {
  const tables = await sequelize.query<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE'",
    { type: QueryTypes.SELECT },
  );
  // One connection (the transaction's), so the switched-off checks apply to every DELETE.
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 0', { transaction });
    for (const { name } of tables) if (!KEPT.has(name)) await sequelize.query(`DELETE FROM \`${name}\``, { transaction });
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 1', { transaction });
  });
}
