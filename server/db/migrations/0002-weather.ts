import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

const utf8 = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

export async function up({ queryInterface: qi }: MigrationContext) {
  // One cell serves every garden within ~0.1° that keeps the same local calendar (time zone).
  await qi.createTable(
    'weather_cells',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      lat_key: { type: DataTypes.INTEGER, allowNull: false },
      lon_key: { type: DataTypes.INTEGER, allowNull: false },
      time_zone: { type: DataTypes.STRING(64), allowNull: false },
      latitude: { type: DataTypes.DOUBLE, allowNull: false },
      longitude: { type: DataTypes.DOUBLE, allowNull: false },
      history_from: { type: DataTypes.DATEONLY, allowNull: true },
      history_through: { type: DataTypes.DATEONLY, allowNull: true },
      backfill_target_from: { type: DataTypes.DATEONLY, allowNull: true },
      backfill_error: { type: DataTypes.STRING(500), allowNull: true },
      refreshed_at: { type: DataTypes.DATE(3), allowNull: true },
      lease_owner: { type: DataTypes.STRING(64), allowNull: true },
      lease_until: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );
  await qi.addIndex('weather_cells', ['lat_key', 'lon_key', 'time_zone'], { unique: true, name: 'weather_cells_key' });

  await qi.addColumn('gardens', 'weather_cell_id', {
    type: DataTypes.INTEGER,
    allowNull: true,
    references: { model: 'weather_cells', key: 'id' },
    onDelete: 'SET NULL',
  });

  await qi.createTable(
    'weather_days',
    {
      cell_id: {
        type: DataTypes.INTEGER,
        allowNull: false,
        primaryKey: true,
        references: { model: 'weather_cells', key: 'id' },
        onDelete: 'CASCADE',
      },
      date: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      tmax_c: { type: DataTypes.DECIMAL(4, 1), allowNull: false },
      tmin_c: { type: DataTypes.DECIMAL(4, 1), allowNull: false },
      source: { type: DataTypes.ENUM('observed', 'forecast', 'filled'), allowNull: false },
      fill_note: { type: DataTypes.STRING(200), allowNull: true },
      fetched_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );

  await qi.createTable(
    'weather_imports',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: {
        type: DataTypes.INTEGER,
        allowNull: false,
        references: { model: 'gardens', key: 'id' },
        onDelete: 'CASCADE',
      },
      user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      file_name: { type: DataTypes.STRING(255), allowNull: false },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      unit: { type: DataTypes.ENUM('F', 'C'), allowNull: false },
      rows_in_file: { type: DataTypes.INTEGER, allowNull: false },
      rows_added: { type: DataTypes.INTEGER, allowNull: false },
      rows_changed: { type: DataTypes.INTEGER, allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );

  // A grower's own station readings for one garden; they win over the service for that garden.
  await qi.createTable(
    'garden_weather_days',
    {
      garden_id: {
        type: DataTypes.INTEGER,
        allowNull: false,
        primaryKey: true,
        references: { model: 'gardens', key: 'id' },
        onDelete: 'CASCADE',
      },
      date: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      tmax_c: { type: DataTypes.DECIMAL(4, 1), allowNull: false },
      tmin_c: { type: DataTypes.DECIMAL(4, 1), allowNull: false },
      import_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'weather_imports', key: 'id' }, onDelete: 'SET NULL' },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );

  await qi.createTable(
    'job_runs',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      kind: { type: DataTypes.STRING(32), allowNull: false },
      instance: { type: DataTypes.STRING(64), allowNull: false },
      garden_id: { type: DataTypes.INTEGER, allowNull: true },
      started_at: { type: DataTypes.DATE(3), allowNull: false },
      finished_at: { type: DataTypes.DATE(3), allowNull: true },
      status: { type: DataTypes.ENUM('running', 'ok', 'partial', 'failed'), allowNull: false },
      cells_ok: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      cells_failed: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      cells_skipped: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      days_written: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      days_rejected: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      requests: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      message: { type: DataTypes.STRING(1000), allowNull: true },
    },
    utf8,
  );
  await qi.addIndex('job_runs', ['started_at'], { name: 'job_runs_started' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('job_runs');
  await qi.dropTable('garden_weather_days');
  await qi.dropTable('weather_imports');
  await qi.dropTable('weather_days');
  await qi.removeColumn('gardens', 'weather_cell_id');
  await qi.dropTable('weather_cells');
}
