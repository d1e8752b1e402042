import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * Alerts with their history. The natural key (garden, subject, type, first date) is a unique
 * index, so re-runs, concurrent evaluations and several instances never make a second row: an
 * evaluation upserts by it. `subject_key` is 'p<plantingId>' or 'garden' (a NULL planting id would
 * not be unique in an index).
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'alerts',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      planting_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'plantings', key: 'id' }, onDelete: 'CASCADE' },
      subject_key: { type: DataTypes.STRING(24), allowNull: false },
      type: { type: DataTypes.STRING(24), allowNull: false },
      first_on: { type: DataTypes.DATEONLY, allowNull: false },
      ends_on: { type: DataTypes.DATEONLY, allowNull: true },
      severity: { type: DataTypes.ENUM('info', 'watch', 'warning', 'severe'), allowNull: false },
      status: { type: DataTypes.ENUM('open', 'acknowledged', 'resolved'), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      title: { type: DataTypes.STRING(300), allowNull: false },
      reasons_json: { type: DataTypes.TEXT, allowNull: false },
      action: { type: DataTypes.TEXT, allowNull: false },
      caution: { type: DataTypes.TEXT, allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
      acknowledged_at: { type: DataTypes.DATE(3), allowNull: true },
      acknowledged_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      resolved_at: { type: DataTypes.DATE(3), allowNull: true },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('alerts', ['garden_id', 'subject_key', 'type', 'first_on'], { unique: true, name: 'alerts_natural_key' });
  await qi.addIndex('alerts', ['garden_id', 'status'], { name: 'alerts_garden_status' });
  // The garden day each garden was last evaluated for: Today evaluates on read when it is behind.
  await qi.createTable(
    'alert_evaluations',
    {
      garden_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      evaluated_for: { type: DataTypes.DATEONLY, allowNull: false },
      evaluated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('alert_evaluations');
  await qi.dropTable('alerts');
}
