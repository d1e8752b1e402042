import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * Sign-ups wait here until the link mailed to the address is opened (server/modules/auth/
 * registration.service.ts): one row per e-mail, a new request replacing the old; only the
 * SHA-256 of the link's token is kept. Account mail (the link, or a note to an address that
 * already has an account) goes through the mail outbox like alerts do, as kind 'account'.
 */
export async function up({ queryInterface: qi, sequelize }: MigrationContext) {
  await qi.createTable(
    'pending_registrations',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      garden_name: { type: DataTypes.STRING(120), allowNull: false },
      password_hash: { type: DataTypes.STRING(255), allowNull: false },
      token_hash: { type: DataTypes.CHAR(64).BINARY, allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('pending_registrations', ['expires_at'], { name: 'pending_registrations_expiry' });
  // A value added at the end of an ENUM is a metadata-only change in MariaDB.
  await sequelize.query(`ALTER TABLE mail_outbox MODIFY kind ENUM('alert', 'digest', 'account') NOT NULL`);
}

export async function down({ queryInterface: qi, sequelize }: MigrationContext) {
  await sequelize.query(`DELETE FROM mail_outbox WHERE kind = 'account'`);
  await sequelize.query(`ALTER TABLE mail_outbox MODIFY kind ENUM('alert', 'digest') NOT NULL`);
  await qi.dropTable('pending_registrations');
}
