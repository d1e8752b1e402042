import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

const utf8 = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

/**
 * E-mail: each member's choices per garden, the outbox of messages (written in the transaction of
 * what they report, sent by a lease-claiming sender) and the local fake server's captured mail.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.createTable(
    'notification_preferences',
    {
      user_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      garden_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      delivery: { type: DataTypes.ENUM('immediate', 'digest', 'off'), allowNull: false },
      digest_hour: { type: DataTypes.TINYINT, allowNull: false },
      types_json: { type: DataTypes.TEXT, allowNull: false },
      // Part of every unsubscribe link; replaced when a link is used, so no link works twice.
      unsubscribe_nonce: { type: DataTypes.CHAR(22).BINARY, allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );
  await qi.createTable(
    'mail_outbox',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      garden_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'gardens', key: 'id' }, onDelete: 'CASCADE' },
      kind: { type: DataTypes.ENUM('alert', 'digest'), allowNull: false },
      dedupe_key: { type: DataTypes.STRING(255).BINARY, allowNull: false, unique: true },
      to_addr: { type: DataTypes.STRING(254), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      text_body: { type: DataTypes.TEXT('medium'), allowNull: false },
      html_body: { type: DataTypes.TEXT('medium'), allowNull: false },
      headers_json: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.ENUM('pending', 'sending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      run_after: { type: DataTypes.DATE(3), allowNull: false },
      last_error: { type: DataTypes.STRING(1000), allowNull: true },
      lease_owner: { type: DataTypes.STRING(96), allowNull: true },
      lease_until: { type: DataTypes.DATE(3), allowNull: true },
      sent_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );
  await qi.addIndex('mail_outbox', ['status', 'run_after'], { name: 'mail_outbox_due' });
  await qi.addIndex('mail_outbox', ['garden_id', 'status'], { name: 'mail_outbox_garden_status' });
  await qi.createTable(
    'captured_mail',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      to_addr: { type: DataTypes.STRING(1000), allowNull: false },
      subject: { type: DataTypes.STRING(1000), allowNull: false },
      text_body: { type: DataTypes.TEXT('medium'), allowNull: false },
      html_body: { type: DataTypes.TEXT('medium'), allowNull: true },
      headers_json: { type: DataTypes.TEXT('medium'), allowNull: false },
      received_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    utf8,
  );
  await qi.addIndex('captured_mail', ['received_at'], { name: 'captured_mail_received' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('captured_mail');
  await qi.dropTable('mail_outbox');
  await qi.dropTable('notification_preferences');
}
