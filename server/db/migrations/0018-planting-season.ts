import { DataTypes, QueryTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';
import { SEASON_ROWS_SQL, seasonRowOf, writeSeasons } from '../planting-season';

/**
 * Each planting's growing season, stored so lists, compare and plan can query by it
 * (server/db/planting-season.ts): the season's start year, the calendar year in the north and the
 * July–June starting year in the south; null while a planting has no start event. Existing rows
 * are filled by the same rule (shared/thermal/start-event.ts plantingSeason), computed here in
 * batches of plantings in id order.
 */
const BATCH = 2000;

export async function up({ sequelize, queryInterface: qi }: MigrationContext) {
  await qi.addColumn('plantings', 'season_year', { type: DataTypes.SMALLINT, allowNull: true });
  await qi.addIndex('plantings', ['garden_id', 'season_year'], { name: 'plantings_garden_season' });
  let after = 0;
  for (;;) {
    const rows = await sequelize.query<Record<string, unknown>>(`${SEASON_ROWS_SQL} WHERE p.id > ? ORDER BY p.id LIMIT ${BATCH}`, {
      replacements: [after],
      type: QueryTypes.SELECT,
    });
    if (!rows.length) break;
    const batch = rows.map(seasonRowOf);
    await writeSeasons(sequelize, batch);
    after = batch[batch.length - 1].id;
  }
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.removeIndex('plantings', 'plantings_garden_season');
  await qi.removeColumn('plantings', 'season_year');
}
