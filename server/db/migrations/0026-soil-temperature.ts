import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

const utf8 = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

/**
 * Soil temperature for timing sowings:
 * - `soil_days`: a weather cell's daily mean soil temperature near seed depth, from the weather
 *   service's hourly soil variable (observed days over forecast ones, like `weather_days`).
 * - `soil_readings`: a grower's own thermometer readings for one garden; on a day with readings
 *   their mean wins over the service's value.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'soil_days',
    {
      cell_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'weather_cells', key: 'id' }, onDelete: 'CASCADE' },
      date: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      soil_c: { type: DataTypes.DECIMAL(4, 1), allowNull: false },
      source: { type: DataTypes.ENUM('observed', 'forecast'), allowNull: false },
      fetched_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );
  await qi.createTable(
    'soil_readings',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      read_on: { type: DataTypes.DATEONLY, allowNull: false },
      // Hundredths: a reading typed in °F comes back as typed (40 °F is 4.44 °C).
      soil_c: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
      depth_cm: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
      note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
      user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );
  await qi.addIndex('soil_readings', ['garden_id', 'read_on'], { name: 'soil_readings_garden_day' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('soil_readings');
  await qi.dropTable('soil_days');
}
