import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * The audit trail (server/modules/audit/): one row per change of a garden's records, written in
 * the same transaction as the change. `changes` holds the changed fields' before and after values
 * as JSON, never a password, hash or token (audit.ts drops them by name). The actor is kept as a
 * name too, so the entry still reads right after the account is gone.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'audit_entries',
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      garden_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      actor_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      actor_name: { type: DataTypes.STRING(120), allowNull: false },
      entity: { type: DataTypes.STRING(40), allowNull: false },
      entity_id: { type: DataTypes.STRING(40), allowNull: true },
      action: { type: DataTypes.STRING(20), allowNull: false },
      summary: { type: DataTypes.STRING(300), allowNull: false },
      changes: { type: DataTypes.TEXT, allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('audit_entries', ['garden_id', 'id'], { name: 'audit_entries_garden' });
  await qi.addIndex('audit_entries', ['garden_id', 'entity', 'id'], { name: 'audit_entries_garden_entity' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('audit_entries');
}
