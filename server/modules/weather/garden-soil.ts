/**
 * The one reader of a garden's soil temperature by day: the grower's own thermometer readings
 * (their mean, on a day that has any) over the weather cell's observed value, over its forecast.
 * °C throughout; days without any value are absent.
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import { WeatherRepository } from './weather.repository';

export type SoilSource = 'reading' | 'observed' | 'forecast';

export interface GardenSoilDay {
  date: string;
  soil: number;
  source: SoilSource;
}

export interface SoilGarden {
  id: number;
  weatherCellId: number | null;
}

export async function loadGardenSoil(
  sequelize: Sequelize,
  garden: SoilGarden,
  range: { from: string; to: string; transaction?: Transaction },
): Promise<Map<string, GardenSoilDay>> {
  const [cell, readings] = await Promise.all([
    garden.weatherCellId === null ? [] : new WeatherRepository(sequelize).cellSoil(garden.weatherCellId, range.from, range.to, range.transaction),
    sequelize.query<{ date: string; soil: number | string }>(
      `SELECT read_on AS date, AVG(soil_c) AS soil FROM soil_readings
        WHERE garden_id = ? AND read_on BETWEEN ? AND ? GROUP BY read_on`,
      { replacements: [garden.id, range.from, range.to], type: QueryTypes.SELECT, transaction: range.transaction },
    ),
  ]);
  const out = new Map<string, GardenSoilDay>();
  for (const d of cell) out.set(d.date, { date: d.date, soil: d.soil, source: d.source });
  for (const r of readings) out.set(r.date, { date: r.date, soil: Number(r.soil), source: 'reading' });
  return out;
}
