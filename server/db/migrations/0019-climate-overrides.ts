import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * An owner's own climate figures for a garden (PUT /api/gardens/:gardenId/climate): the median
 * last spring and first fall frost as month-days 'MM-DD', and the hardiness zone ('6a'). Each
 * NULL means "use the garden's history"; a row with all three NULL is removed.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'garden_climate_overrides',
    {
      garden_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      last_spring_frost: { type: DataTypes.CHAR(5), allowNull: true },
      first_fall_frost: { type: DataTypes.CHAR(5), allowNull: true },
      zone: { type: DataTypes.STRING(4), allowNull: true },
      updated_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('garden_climate_overrides');
}
