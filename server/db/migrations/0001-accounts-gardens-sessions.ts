import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'users',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      password_hash: { type: DataTypes.STRING(255), allowNull: false },
      ...timestamps,
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.createTable(
    'gardens',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      latitude: { type: DataTypes.DOUBLE, allowNull: true },
      longitude: { type: DataTypes.DOUBLE, allowNull: true },
      elevation_m: { type: DataTypes.DOUBLE, allowNull: true },
      time_zone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
      units: { type: DataTypes.ENUM('F', 'C'), allowNull: false, defaultValue: 'F' },
      ...timestamps,
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.createTable(
    'memberships',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      user_id: {
        type: DataTypes.INTEGER,
        allowNull: false,
        references: { model: 'users', key: 'id' },
        onDelete: 'CASCADE',
      },
      garden_id: {
        type: DataTypes.INTEGER,
        allowNull: false,
        references: { model: 'gardens', key: 'id' },
        onDelete: 'CASCADE',
      },
      role: { type: DataTypes.ENUM('owner', 'grower', 'viewer'), allowNull: false },
      ...timestamps,
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('memberships', ['user_id', 'garden_id'], { unique: true, name: 'memberships_user_garden' });
  await qi.addIndex('memberships', ['garden_id'], { name: 'memberships_garden' });
  await qi.createTable(
    'sessions',
    {
      sid: { type: DataTypes.STRING(64), primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: true },
      expires: { type: DataTypes.DATE(3), allowNull: true },
      data: { type: DataTypes.TEXT, allowNull: true },
      ...timestamps,
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('sessions', ['expires'], { name: 'sessions_expires' });
  await qi.addIndex('sessions', ['user_id'], { name: 'sessions_user' });
  await qi.createTable(
    'rate_limits',
    {
      key_hash: { type: DataTypes.CHAR(64), primaryKey: true },
      hits: { type: DataTypes.INTEGER, allowNull: false },
      reset_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'ascii', collate: 'ascii_bin' },
  );
  await qi.addIndex('rate_limits', ['reset_at'], { name: 'rate_limits_reset' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('rate_limits');
  await qi.dropTable('sessions');
  await qi.dropTable('memberships');
  await qi.dropTable('gardens');
  await qi.dropTable('users');
}
