/**
 * A garden's winter chill so far this season, from its stored daily weather (the one reader,
 * loadGardenWeather) through the engine's chill functions (shared/thermal/chill.ts).
 */
import type { Sequelize } from 'sequelize';
import { addDays, chillOfHours, chillSeasonOf, daysBetween, estimatedHours } from '#shared/thermal';
import { FRUIT_CHILL, chillStatus } from '#shared/crops/fruit';
import type { GardenChill } from '#shared/schemas/chill';
import { localDate } from '../../lib/local-date';
import { loadGardenWeather } from '../weather/garden-weather';

export interface ChillGarden {
  id: number;
  latitude: number;
  timeZone: string;
  weatherCellId: number | null;
}

export async function gardenChill(sequelize: Sequelize, garden: ChillGarden, now = new Date()): Promise<GardenChill> {
  const today = localDate(garden.timeZone, now);
  const { since, until } = chillSeasonOf(garden.latitude, today);
  const last = addDays(today, -1) < until ? addDays(today, -1) : until;
  // One day either side: the first night continues the day before, the last night runs to the next low.
  const weather = await loadGardenWeather(sequelize, garden, { from: addDays(since, -1), to: addDays(last, 1), now });
  const counted = weather.history.filter((d) => d.date >= since && d.date <= last);
  const edges = weather.history.filter((d) => d.date < since || d.date > last);
  const hours = estimatedHours(garden.latitude, [...edges.filter((d) => d.date < since), ...counted, ...edges.filter((d) => d.date > last)]);
  // Only the season's own days count: drop the hours of the edge days.
  const before = edges.some((d) => d.date < since) ? 24 : 0;
  const totals = chillOfHours(hours.slice(before, before + counted.length * 24));
  const seasonDays = last < since ? 0 : daysBetween(since, last) + 1;
  return {
    since,
    through: counted.length ? counted[counted.length - 1].date : null,
    until,
    seasonEnded: today > until,
    hoursAtOrBelow7C: totals.hoursAtOrBelow7C,
    utahUnits: totals.utahUnits,
    method: 'linvill-1990-from-daily',
    estimated: true,
    daysCounted: counted.length,
    daysMissing: Math.max(0, seasonDays - counted.length),
    fruit: FRUIT_CHILL.map((f) => ({ key: f.key, name: f.name, chillHours: f.chillHours, source: f.source, ...chillStatus(totals.hoursAtOrBelow7C, f.chillHours) })),
  };
}
