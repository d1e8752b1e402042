import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * Running on several instances (and on a Galera cluster):
 * - `job_runs.heartbeat_at` is moved while a run works, so a run whose instance died can be told
 *   from a slow one and closed as failed by the next run or boot; `claim_conflicts` counts the
 *   cell claims that lost to another instance (certification or deadlock), apart from cell failures.
 * - `planting_photo_contents` keeps each photo's re-encoded JPEG in the database, so every instance
 *   serves every photo (a local disk is one instance's). One row per photo, keyed by the photo.
 */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.addColumn('job_runs', 'heartbeat_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn('job_runs', 'claim_conflicts', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  await qi.addIndex('job_runs', ['status', 'heartbeat_at'], { name: 'job_runs_status_heartbeat' });
  await qi.createTable(
    'planting_photo_contents',
    {
      photo_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'planting_photos', key: 'id' }, onDelete: 'CASCADE' },
      // MEDIUMBLOB (16 MiB); the service refuses anything over its own, smaller bound.
      data: { type: DataTypes.BLOB('medium'), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.dropTable('planting_photo_contents');
  await qi.removeIndex('job_runs', 'job_runs_status_heartbeat');
  await qi.removeColumn('job_runs', 'claim_conflicts');
  await qi.removeColumn('job_runs', 'heartbeat_at');
}
