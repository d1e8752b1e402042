import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * Creates answered once per Idempotency-Key (server/lib/idempotency.ts): the key, scoped to the
 * user, method and path, is stored hashed with a fingerprint of the request and, once answered,
 * the answer, for 24 hours.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'idempotency_keys',
    {
      scope_hash: { type: DataTypes.CHAR(64).BINARY, primaryKey: true },
      fingerprint: { type: DataTypes.CHAR(64).BINARY, allowNull: false },
      state: { type: DataTypes.ENUM('pending', 'done'), allowNull: false },
      status: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
      body: { type: DataTypes.TEXT('medium'), allowNull: true },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('idempotency_keys', ['expires_at'], { name: 'idempotency_keys_expiry' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('idempotency_keys');
}
