import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * Invitations to a garden (server/modules/invitations/): the link's token is kept only as its
 * SHA-256, so a copy of this table cannot join anyone. A row stays after it is used or revoked,
 * so its link is answered "used" or "revoked" rather than "does not work". The inviter's name is
 * kept too, so the invitation still reads right after that account is gone.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'garden_invitations',
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      garden_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.ENUM('owner', 'grower', 'viewer'), allowNull: false },
      token_hash: { type: DataTypes.CHAR(64).BINARY, allowNull: false },
      invited_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      invited_by_name: { type: DataTypes.STRING(120), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      accepted_at: { type: DataTypes.DATE(3), allowNull: true },
      accepted_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      revoked_at: { type: DataTypes.DATE(3), allowNull: true },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('garden_invitations', ['token_hash'], { unique: true, name: 'garden_invitations_token' });
  await qi.addIndex('garden_invitations', ['garden_id', 'email'], { name: 'garden_invitations_garden_email' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('garden_invitations');
}
