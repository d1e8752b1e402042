import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * The outbox of "this garden's weather changed": one row per consumer and garden, written in the
 * same transaction as the days, widened by later changes until a worker has handled it.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'garden_events',
    {
      consumer: { type: DataTypes.STRING(64), allowNull: false, primaryKey: true },
      garden_id: {
        type: DataTypes.INTEGER,
        allowNull: false,
        primaryKey: true,
        references: { model: 'gardens', key: 'id' },
        onDelete: 'CASCADE',
      },
      from_date: { type: DataTypes.DATEONLY, allowNull: false },
      to_date: { type: DataTypes.DATEONLY, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      run_after: { type: DataTypes.DATE(3), allowNull: false },
      last_error: { type: DataTypes.STRING(1000), allowNull: true },
      status: { type: DataTypes.ENUM('pending', 'failed'), allowNull: false, defaultValue: 'pending' },
      lease_owner: { type: DataTypes.STRING(96), allowNull: true },
      lease_until: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('garden_events', ['status', 'run_after'], { name: 'garden_events_due' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('garden_events');
}
