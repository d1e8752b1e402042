/**
 * A planting's growing season, stored (plantings.season_year, migration 0018) so lists, compare
 * and plan can filter and group by it in SQL. The value always comes from the one rule,
 * shared/thermal/start-event.ts `plantingSeason` (the season of the start event, hemisphere-aware):
 * the Planting model's beforeSave hook writes it on every save (forms, log entries, CSV import),
 * and `refreshGardenSeasons` rewrites a garden's plantings when its latitude changes.
 *
 * Stored as the season's start year (SMALLINT): the calendar year north of the equator, the
 * July–June starting year south of it; `seasonOfYear(year, latitude).label` gives '2025' or
 * '2025–26' back. A garden without a location counts as northern, as its presenter always did.
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import { plantingSeason } from '#shared/thermal/start-event';
import type { StartEventPlanting, StartEventVariety } from '#shared/thermal/start-event';

export interface SeasonRow extends StartEventPlanting, StartEventVariety {
  id: number;
  latitude: number | null;
}

/** The stored form of a planting's season: its start year, or null without a start event. */
export function seasonYearOf(p: StartEventPlanting, v: StartEventVariety, latitude: number | null): number | null {
  return plantingSeason(p, v, latitude ?? 0)?.startYear ?? null;
}

const dateText = (d: unknown): string | null => (d instanceof Date ? d.toISOString().slice(0, 10) : typeof d === 'string' ? d.slice(0, 10) : null);

/** The plantings with what the rule reads (their variety's packet fields, their garden's latitude). */
export const SEASON_ROWS_SQL = `SELECT p.id, p.method, p.status, p.sown_on AS sownOn, p.emerged_on AS emergedOn, p.transplanted_on AS transplantedOn,
       v.dtm_days AS dtmDays, v.dtm_from AS dtmFrom, v.emergence_days_min AS emergenceDaysMin, v.emergence_days_max AS emergenceDaysMax,
       g.latitude
  FROM plantings p JOIN varieties v ON v.id = p.variety_id JOIN gardens g ON g.id = p.garden_id`;

/** Rows as the driver hands them back, dates as 'YYYY-MM-DD'. */
export function seasonRowOf(r: Record<string, unknown>): SeasonRow {
  return {
    id: Number(r.id),
    method: r.method as SeasonRow['method'],
    status: r.status as SeasonRow['status'],
    sownOn: dateText(r.sownOn),
    emergedOn: dateText(r.emergedOn),
    transplantedOn: dateText(r.transplantedOn),
    dtmDays: r.dtmDays === null ? null : Number(r.dtmDays),
    dtmFrom: r.dtmFrom as SeasonRow['dtmFrom'],
    emergenceDaysMin: r.emergenceDaysMin === null ? null : Number(r.emergenceDaysMin),
    emergenceDaysMax: r.emergenceDaysMax === null ? null : Number(r.emergenceDaysMax),
    latitude: r.latitude === null ? null : Number(r.latitude),
  };
}

/** Writes each row's season, one UPDATE per distinct season (ids in batches of 1,000). */
export async function writeSeasons(db: Sequelize, rows: readonly SeasonRow[], transaction?: Transaction) {
  const bySeason = new Map<number | null, number[]>();
  for (const r of rows) {
    const year = seasonYearOf(r, r, r.latitude);
    const ids = bySeason.get(year) ?? [];
    ids.push(r.id);
    bySeason.set(year, ids);
  }
  for (const [year, ids] of bySeason) {
    for (let i = 0; i < ids.length; i += 1000) {
      const chunk = ids.slice(i, i + 1000);
      await db.query(`UPDATE plantings SET season_year = ? WHERE id IN (${chunk.map(() => '?').join(', ')})`, { replacements: [year, ...chunk], transaction });
    }
  }
}

/** Recomputes every planting of a garden (its latitude changed), in the change's transaction. */
export async function refreshGardenSeasons(db: Sequelize, gardenId: number, transaction?: Transaction) {
  const rows = await db.query<Record<string, unknown>>(`${SEASON_ROWS_SQL} WHERE p.garden_id = ? FOR UPDATE`, { replacements: [gardenId], type: QueryTypes.SELECT, transaction });
  await writeSeasons(db, rows.map(seasonRowOf), transaction);
}

/** For the model hook: the planting's garden latitude and variety packet fields. */
export async function seasonInputs(db: Sequelize, gardenId: number, varietyId: number, transaction?: Transaction | null) {
  const [row] = await db.query<Record<string, unknown>>(
    `SELECT g.latitude, v.dtm_days AS dtmDays, v.dtm_from AS dtmFrom, v.emergence_days_min AS emergenceDaysMin, v.emergence_days_max AS emergenceDaysMax
       FROM gardens g JOIN varieties v ON v.id = ? WHERE g.id = ?`,
    { replacements: [varietyId, gardenId], type: QueryTypes.SELECT, transaction: transaction ?? undefined },
  );
  if (!row) return null;
  return {
    latitude: row.latitude === null ? null : Number(row.latitude),
    variety: {
      dtmDays: row.dtmDays === null ? null : Number(row.dtmDays),
      dtmFrom: row.dtmFrom as StartEventVariety['dtmFrom'],
      emergenceDaysMin: row.emergenceDaysMin === null ? null : Number(row.emergenceDaysMin),
      emergenceDaysMax: row.emergenceDaysMax === null ? null : Number(row.emergenceDaysMax),
    } satisfies StartEventVariety,
  };
}
