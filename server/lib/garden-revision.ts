/**
 * The garden change counter cached reads key on (server/lib/read-cache.ts): moved in the
 * transaction of every change to what a garden's pages show, so the change and the move commit
 * together. Gardens in id order, so two writers touching several gardens lock them alike.
 */
import type { Sequelize, Transaction } from 'sequelize';

export async function moveGardenRevisions(db: Sequelize, gardenIds: readonly number[], transaction?: Transaction): Promise<void> {
  if (!gardenIds.length) return;
  const ids = [...new Set(gardenIds)].sort((a, b) => a - b);
  await db.query(
    `INSERT INTO garden_revisions (garden_id, revision) VALUES ${ids.map(() => '(?, 1)').join(', ')} ON DUPLICATE KEY UPDATE revision = revision + 1`,
    { replacements: ids, transaction },
  );
}
