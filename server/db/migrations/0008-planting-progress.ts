import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * Each planting's computed progress, kept until its weather, dates, variety, crop or garden
 * change, or the garden's calendar day turns. The sortable figures are columns so the plantings
 * list can order by them in SQL; the small summary and the full answer are JSON in °C.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'planting_progress',
    {
      planting_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'plantings', key: 'id' }, onDelete: 'CASCADE' },
      garden_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      computed_for: { type: DataTypes.DATEONLY, allowNull: false },
      percent: { type: DataTypes.DOUBLE, allowNull: true },
      ready_on: { type: DataTypes.DATEONLY, allowNull: true },
      bolt_rank: { type: DataTypes.TINYINT, allowNull: false },
      summary_json: { type: DataTypes.TEXT, allowNull: false },
      body_json: { type: DataTypes.TEXT('medium'), allowNull: false },
      computed_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('planting_progress', ['garden_id'], { name: 'planting_progress_garden' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('planting_progress');
}
