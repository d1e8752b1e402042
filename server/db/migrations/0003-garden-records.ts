import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

const utf8 = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};
const garden = {
  type: DataTypes.INTEGER,
  allowNull: false,
  references: { model: 'gardens', key: 'id' },
  onDelete: 'CASCADE',
};
const byUser = {
  type: DataTypes.INTEGER,
  allowNull: true,
  references: { model: 'users', key: 'id' },
  onDelete: 'SET NULL',
};

export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'beds',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: garden,
      name: { type: DataTypes.STRING(80), allowNull: false },
      kind: { type: DataTypes.ENUM('bed', 'raised-bed', 'plot', 'row', 'container'), allowNull: false, defaultValue: 'bed' },
      length_m: { type: DataTypes.DOUBLE, allowNull: true },
      width_m: { type: DataTypes.DOUBLE, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: false },
      ...timestamps,
    },
    utf8,
  );
  await qi.addIndex('beds', ['garden_id', 'name'], { unique: true, name: 'beds_garden_name' });

  // A garden's own value for one crop parameter; the shared default stays in code.
  await qi.createTable(
    'crop_overrides',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: garden,
      crop_key: { type: DataTypes.STRING(40), allowNull: false },
      param_key: { type: DataTypes.STRING(40), allowNull: false },
      value_json: { type: DataTypes.STRING(100), allowNull: false },
      note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
      updated_by: byUser,
      ...timestamps,
    },
    utf8,
  );
  await qi.addIndex('crop_overrides', ['garden_id', 'crop_key', 'param_key'], { unique: true, name: 'crop_overrides_key' });

  await qi.createTable(
    'varieties',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: garden,
      crop_key: { type: DataTypes.STRING(40), allowNull: false },
      name: { type: DataTypes.STRING(100), allowNull: false },
      dtm_days: { type: DataTypes.INTEGER, allowNull: true },
      dtm_from: { type: DataTypes.ENUM('sowing', 'emergence', 'transplant'), allowNull: false },
      emergence_days_min: { type: DataTypes.INTEGER, allowNull: true },
      emergence_days_max: { type: DataTypes.INTEGER, allowNull: true },
      bolt_tolerance: { type: DataTypes.TINYINT, allowNull: true },
      heat_tolerance: { type: DataTypes.TINYINT, allowNull: true },
      traits: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      container_friendly: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      sun_hours: { type: DataTypes.DOUBLE, allowNull: true },
      water_cm_per_week: { type: DataTypes.DOUBLE, allowNull: true },
      sow_depth_cm: { type: DataTypes.DOUBLE, allowNull: true },
      spacing_cm: { type: DataTypes.DOUBLE, allowNull: true },
      thin_spacing_cm: { type: DataTypes.DOUBLE, allowNull: true },
      gdd_target_override_c: { type: DataTypes.DOUBLE, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: false },
      ...timestamps,
    },
    utf8,
  );
  await qi.addIndex('varieties', ['garden_id', 'crop_key', 'name'], { unique: true, name: 'varieties_garden_crop_name' });

  await qi.createTable(
    'seed_lots',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: garden,
      variety_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'varieties', key: 'id' }, onDelete: 'RESTRICT' },
      supplier: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      lot_number: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
      packed_for_year: { type: DataTypes.SMALLINT, allowNull: true },
      quantity: { type: DataTypes.DOUBLE, allowNull: true },
      quantity_unit: { type: DataTypes.ENUM('seeds', 'grams'), allowNull: false, defaultValue: 'seeds' },
      storage_notes: { type: DataTypes.TEXT, allowNull: false },
      ...timestamps,
    },
    utf8,
  );
  await qi.addIndex('seed_lots', ['garden_id', 'variety_id'], { name: 'seed_lots_garden_variety' });

  await qi.createTable(
    'germination_tests',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: garden,
      seed_lot_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'seed_lots', key: 'id' }, onDelete: 'CASCADE' },
      tested_on: { type: DataTypes.DATEONLY, allowNull: false },
      seeds_tested: { type: DataTypes.INTEGER, allowNull: false },
      germinated: { type: DataTypes.INTEGER, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false },
      ...timestamps,
    },
    utf8,
  );
  await qi.addIndex('germination_tests', ['seed_lot_id', 'tested_on'], { name: 'germination_tests_lot_date' });

  await qi.createTable(
    'plantings',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: garden,
      bed_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'beds', key: 'id' }, onDelete: 'RESTRICT' },
      variety_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'varieties', key: 'id' }, onDelete: 'RESTRICT' },
      seed_lot_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'seed_lots', key: 'id' }, onDelete: 'RESTRICT' },
      method: { type: DataTypes.ENUM('direct-sow', 'transplant', 'indoor-start'), allowNull: false },
      status: { type: DataTypes.ENUM('planned', 'growing', 'harvested', 'bolted', 'failed'), allowNull: false },
      quantity: { type: DataTypes.DOUBLE, allowNull: true },
      quantity_unit: { type: DataTypes.ENUM('plants', 'seeds', 'row-m', 'grams'), allowNull: false, defaultValue: 'plants' },
      sown_on: { type: DataTypes.DATEONLY, allowNull: true },
      emerged_on: { type: DataTypes.DATEONLY, allowNull: true },
      thinned_on: { type: DataTypes.DATEONLY, allowNull: true },
      transplanted_on: { type: DataTypes.DATEONLY, allowNull: true },
      first_harvest_on: { type: DataTypes.DATEONLY, allowNull: true },
      last_harvest_on: { type: DataTypes.DATEONLY, allowNull: true },
      bolted_on: { type: DataTypes.DATEONLY, allowNull: true },
      // Sowing date, else transplant date: the natural key for idempotent imports, and the sort key.
      start_on: { type: DataTypes.DATEONLY, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: false },
      created_by: byUser,
      ...timestamps,
    },
    utf8,
  );
  await qi.addIndex('plantings', ['garden_id', 'bed_id', 'variety_id', 'method', 'start_on'], { unique: true, name: 'plantings_natural_key' });
  await qi.addIndex('plantings', ['garden_id', 'start_on'], { name: 'plantings_garden_start' });
  await qi.addIndex('plantings', ['garden_id', 'status'], { name: 'plantings_garden_status' });

  await qi.createTable(
    'planting_photos',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: garden,
      planting_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'plantings', key: 'id' }, onDelete: 'CASCADE' },
      storage_name: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      width: { type: DataTypes.INTEGER, allowNull: false },
      height: { type: DataTypes.INTEGER, allowNull: false },
      bytes: { type: DataTypes.INTEGER, allowNull: false },
      caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
      taken_on: { type: DataTypes.DATEONLY, allowNull: false },
      created_by: byUser,
      ...timestamps,
    },
    utf8,
  );
  await qi.addIndex('planting_photos', ['planting_id'], { name: 'planting_photos_planting' });

  await qi.createTable(
    'planting_logs',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      garden_id: garden,
      planting_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'plantings', key: 'id' }, onDelete: 'CASCADE' },
      entry_on: { type: DataTypes.DATEONLY, allowNull: false },
      kind: { type: DataTypes.ENUM('watered', 'fed', 'thinned', 'observation', 'harvest', 'bolted', 'photo'), allowNull: false },
      amount: { type: DataTypes.DOUBLE, allowNull: true },
      amount_unit: { type: DataTypes.ENUM('kg', 'g', 'lb', 'count', 'bunches'), allowNull: true },
      note: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
      photo_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'planting_photos', key: 'id' }, onDelete: 'SET NULL' },
      created_by: byUser,
      ...timestamps,
    },
    utf8,
  );
  await qi.addIndex('planting_logs', ['planting_id', 'entry_on'], { name: 'planting_logs_planting_date' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('planting_logs');
  await qi.dropTable('planting_photos');
  await qi.dropTable('plantings');
  await qi.dropTable('germination_tests');
  await qi.dropTable('seed_lots');
  await qi.dropTable('varieties');
  await qi.dropTable('crop_overrides');
  await qi.dropTable('beds');
}
