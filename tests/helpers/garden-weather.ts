import { randomUUID } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { addDays, daysBetween } from '#shared/thermal/dates';
import type { DailyTemp } from '#shared/thermal/types';
import type { Garden } from '../../server/db/models';

/**
 * Gives a test garden its own weather cell holding exactly these days (any provenance, forecast
 * included), so a test controls every temperature progress is computed from.
 */
export async function giveGardenWeather(sequelize: Sequelize, garden: Garden, days: readonly DailyTemp[]) {
  // A cell key no real place has (keys are tenths of a degree), so no other garden shares it; and
  // "refreshed" far ahead, so no nightly run in a parallel test file rewrites these days.
  const latKey = 100_000 + Math.floor(Math.random() * 1_000_000_000);
  const lonKey = Number.parseInt(randomUUID().slice(0, 6), 16);
  await sequelize.query(
    `INSERT INTO weather_cells (lat_key, lon_key, time_zone, latitude, longitude, history_from, history_through, refreshed_at, created_at, updated_at)
     VALUES (?, ?, 'UTC', ?, ?, ?, ?, '2999-01-01', UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`,
    { replacements: [latKey, lonKey, garden.latitude, garden.longitude, days[0]?.date ?? null, days.at(-1)?.date ?? null] },
  );
  const [[cell]] = (await sequelize.query("SELECT id FROM weather_cells WHERE lat_key = ? AND lon_key = ? AND time_zone = 'UTC'", { replacements: [latKey, lonKey] })) as [Array<{ id: number }>, unknown];
  for (let i = 0; i < days.length; i += 2000) {
    const chunk = days.slice(i, i + 2000);
    await sequelize.query(
      `INSERT INTO weather_days (cell_id, date, tmax_c, tmin_c, source, fill_note, fetched_at) VALUES ${chunk.map(() => '(?, ?, ?, ?, ?, NULL, UTC_TIMESTAMP(3))').join(', ')}`,
      { replacements: chunk.flatMap((d) => [cell.id, d.date, d.tmax, d.tmin, d.source === 'imported' ? 'observed' : d.source]) },
    );
  }
  await garden.update({ weatherCellId: cell.id });
  return cell.id;
}

/** Days from `from` through `to` with the same high and low. */
export function steadyDays(from: string, to: string, tmax: number, tmin: number, source: DailyTemp['source'] = 'observed'): DailyTemp[] {
  return Array.from({ length: daysBetween(from, to) + 1 }, (_, k) => ({ date: addDays(from, k), tmax, tmin, source }));
}
