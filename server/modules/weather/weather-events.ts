/**
 * "A garden's weather changed" as rows of the garden_events outbox, written in the transaction
 * that changed the days, so an evaluation is owed exactly when the change committed. One row per
 * consumer and garden: later changes widen its date range and bump its version instead of
 * queueing again, so eleven backfill batches leave one evaluation to run, not eleven.
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import { moveGardenRevisions } from '../../lib/garden-revision';

/** Every step that re-evaluates a garden when its weather changes; the progress step evaluates alerts after it. */
export const GARDEN_EVENT_CONSUMERS = ['planting-progress'] as const;

export type WeatherChangeTarget = { cellId: number } | { gardenId: number };

// Sequelize keeps the instance on every transaction; its typings do not declare it.
const sequelizeOf = (transaction: Transaction) => (transaction as Transaction & { sequelize: Sequelize }).sequelize;

export async function recordWeatherChanged(
  transaction: Transaction,
  target: WeatherChangeTarget,
  from: string,
  to: string,
  consumers: readonly string[] = GARDEN_EVENT_CONSUMERS,
): Promise<void> {
  const db = sequelizeOf(transaction);
  // A plain read of the gardens, not INSERT … SELECT, which would share-lock them until commit.
  const gardenIds =
    'gardenId' in target
      ? [target.gardenId]
      : (
          await db.query<{ id: number }>('SELECT id FROM gardens WHERE weather_cell_id = ? ORDER BY id', {
            replacements: [target.cellId],
            type: QueryTypes.SELECT,
            transaction,
          })
        ).map((g) => g.id);
  if (!gardenIds.length) return;
  // The gardens' counters move in the same transaction: a progress answer computed from the days
  // before the change is not stored (epoch), and cached reads stop being served the moment the
  // change commits (revision, server/lib/read-cache.ts).
  await db.query(
    `INSERT INTO progress_epochs (garden_id, epoch) VALUES ${gardenIds.map(() => '(?, 1)').join(', ')} ON DUPLICATE KEY UPDATE epoch = epoch + 1`,
    { replacements: gardenIds, transaction },
  );
  await moveGardenRevisions(db, gardenIds, transaction);
  const rows = gardenIds.flatMap((gardenId) => consumers.map((consumer) => [consumer, gardenId, from, to]));
  await db.query(
    `INSERT INTO garden_events (consumer, garden_id, from_date, to_date, version, attempts, status, run_after, created_at, updated_at)
     VALUES ${rows.map(() => "(?, ?, ?, ?, 1, 0, 'pending', UTC_TIMESTAMP(3), UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))").join(', ')}
     ON DUPLICATE KEY UPDATE from_date = LEAST(from_date, VALUES(from_date)), to_date = GREATEST(to_date, VALUES(to_date)),
       version = version + 1, attempts = 0, status = 'pending', last_error = NULL,
       run_after = VALUES(run_after), updated_at = VALUES(updated_at)`,
    { replacements: rows.flat(), transaction },
  );
}
