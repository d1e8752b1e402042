/**
 * The one reader of a garden's daily weather. Progress, targets, alerts and the weather page all
 * read through here, so they agree on which value a day has: the garden's own station (imported)
 * over the cell's observed, over filled, over forecast. Days without a value stay absent: a gap
 * is never bridged by the reader.
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { DailyTemp, TempSource } from '#shared/thermal/types';
import { localDate } from '../../lib/local-date';
import { WeatherRepository } from './weather.repository';
import type { StoredDay } from './weather.repository';

export type GardenDay = DailyTemp & { note: string | null };

export interface GardenWeather {
  /** Every day in the range that has a value, oldest first, forecasts included. */
  days: GardenDay[];
  /** The past of `days`: no forecasts, and nothing from the garden's local today on. */
  history: GardenDay[];
}

export interface WeatherGarden {
  id: number;
  weatherCellId: number | null;
  /** With `now`, ends `history` before the garden's local today. */
  timeZone?: string;
}

export interface WeatherRange {
  from: string;
  to: string;
  now?: Date;
  transaction?: Transaction;
}

const PRECEDENCE: Record<TempSource, number> = { forecast: 1, filled: 2, observed: 3, imported: 4 };

export function mergeGardenDays(sources: StoredDay[][], today: string | null): GardenWeather {
  const byDate = new Map<string, GardenDay>();
  for (const list of sources) {
    for (const d of list) {
      const held = byDate.get(d.date);
      if (!held || PRECEDENCE[d.source] > PRECEDENCE[held.source]) byDate.set(d.date, { ...d, note: d.note ?? null });
    }
  }
  const days = [...byDate.values()].sort((a, b) => (a.date < b.date ? -1 : 1));
  const history = days.filter((d) => d.source !== 'forecast' && (today === null || d.date < today));
  return { days, history };
}

/** Many gardens over one range with one query per source table (cell days, station days). */
export async function loadGardensWeather(sequelize: Sequelize, gardens: readonly WeatherGarden[], range: WeatherRange): Promise<Map<number, GardenWeather>> {
  const repo = new WeatherRepository(sequelize);
  const cellIds = [...new Set(gardens.map((g) => g.weatherCellId).filter((id): id is number => id !== null))];
  const [cellDays, stationDays] = await Promise.all([
    repo.cellsDays(cellIds, range.from, range.to, range.transaction),
    repo.gardensDays(gardens.map((g) => g.id), range.from, range.to, range.transaction),
  ]);
  const out = new Map<number, GardenWeather>();
  for (const g of gardens) {
    const today = range.now && g.timeZone ? localDate(g.timeZone, range.now) : null;
    const cell = g.weatherCellId === null ? [] : cellDays.get(g.weatherCellId)!;
    out.set(g.id, mergeGardenDays([cell, stationDays.get(g.id)!], today));
  }
  return out;
}

export async function loadGardenWeather(sequelize: Sequelize, garden: WeatherGarden, range: WeatherRange): Promise<GardenWeather> {
  return (await loadGardensWeather(sequelize, [garden], range)).get(garden.id)!;
}
