import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

const utf8 = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

/**
 * Calendar feeds (server/modules/calendar/): one private link per user. The link's token is found
 * by its SHA-256 (`token_hash`); `token_sealed` is the token encrypted with a key derived from the
 * session secret (AES-256-GCM), so the owner can be shown their link again while the table alone
 * gives nobody a working link. `calendar_event_versions` keeps, per user and event UID, the hash of
 * what the feed last said about the event and its SEQUENCE, raised when that content changes.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'calendar_feeds',
    {
      user_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      token_hash: { type: DataTypes.CHAR(64).BINARY, allowNull: false, unique: true },
      token_sealed: { type: DataTypes.STRING(160).BINARY, allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );
  await qi.createTable(
    'calendar_event_versions',
    {
      user_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      uid: { type: DataTypes.STRING(190).BINARY, primaryKey: true },
      content_hash: { type: DataTypes.CHAR(64).BINARY, allowNull: false },
      sequence: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      changed_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('calendar_event_versions');
  await qi.dropTable('calendar_feeds');
}
