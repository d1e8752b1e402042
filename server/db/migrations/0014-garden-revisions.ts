import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * One counter per garden that moves in the transaction of any change to what its pages show
 * (records, weather, settings): cached reads key on it. Separate from progress_epochs, which
 * moves only when progress inputs change (a moved epoch makes a running evaluation give way).
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'garden_revisions',
    {
      garden_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('garden_revisions');
}
