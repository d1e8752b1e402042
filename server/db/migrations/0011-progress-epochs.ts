import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * A counter per garden, bumped in the same transaction as every change that drops cached
 * progress. A computation notes it before reading and stores its answer only if it has not
 * moved, so a slow computation can never put back a row a newer change removed.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable('progress_epochs', {
    garden_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
    epoch: { type: DataTypes.INTEGER, allowNull: false },
  });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('progress_epochs');
}
