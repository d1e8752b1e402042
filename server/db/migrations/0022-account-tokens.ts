import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * Links mailed about an existing account (server/modules/account/): a password reset (1 hour)
 * and the confirmation of a new e-mail address (24 hours, the address kept in `new_email`).
 * Only the SHA-256 of a link's token is stored; a used link keeps its row with `used_at` so it
 * is answered "already used" rather than "does not work", until the tidy-up removes it a week
 * after it expired.
 *
 * Sessions get the browser's User-Agent (written at sign-in) and a last-seen instant, written
 * only together with the expiry's touch (session-store.ts), so reading a session still writes nothing.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'account_tokens',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      purpose: { type: DataTypes.ENUM('password-reset', 'email-change'), allowNull: false },
      token_hash: { type: DataTypes.CHAR(64).BINARY, allowNull: false, unique: true },
      new_email: { type: DataTypes.STRING(254), allowNull: true },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      used_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await qi.addIndex('account_tokens', ['user_id', 'purpose'], { name: 'account_tokens_user' });
  await qi.addIndex('account_tokens', ['expires_at'], { name: 'account_tokens_expiry' });
  await qi.addColumn('sessions', 'user_agent', { type: DataTypes.STRING(255), allowNull: true });
  await qi.addColumn('sessions', 'last_seen_at', { type: DataTypes.DATE(3), allowNull: true });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.removeColumn('sessions', 'last_seen_at');
  await qi.removeColumn('sessions', 'user_agent');
  await qi.dropTable('account_tokens');
}
