import { z } from 'zod';
import { isoDateSchema } from './records';
import type { TempSource } from '../thermal/types';

/** The most days one weather request returns; the range is checked after defaults fill it in. */
export const MAX_WEATHER_DAYS = 800;

export const weatherQuerySchema = z
  .object({ from: isoDateSchema('From').optional(), to: isoDateSchema('To').optional() })
  .strict()
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: '"from" must not be after "to".', path: ['from'] });

export const weatherImportFieldsSchema = z
  .object({ unit: z.enum(['F', 'C'], { error: 'Choose the unit of the file: F or C.' }) })
  .strict();

export interface WeatherDayDto {
  date: string;
  tmax: number;
  tmin: number;
  source: TempSource;
  /** How a filled day was made, in words. */
  note?: string;
  /** Daily mean soil temperature near sowing depth, in the display unit; absent where not known. */
  soil?: number;
  /** Where `soil` came from: the grower's thermometer, or the weather service (observed, forecast). */
  soilSource?: 'reading' | 'observed' | 'forecast';
}

export interface WeatherGapDto {
  from: string;
  to: string;
  days: number;
}

/** A crop threshold of a planting in the ground, for reference lines on the weather chart. */
export interface WeatherThresholdDto {
  label: string;
  kind: 'base' | 'upper' | 'bolt-heat';
  /** In the garden's display unit, like the days. */
  value: number;
}

export interface WeatherResponse {
  unit: 'F' | 'C';
  thresholds: WeatherThresholdDto[];
  from: string;
  to: string;
  today: string;
  days: WeatherDayDto[];
  gaps: WeatherGapDto[];
  history: {
    historyFrom: string | null;
    historyThrough: string | null;
    targetFrom: string;
    percent: number;
    complete: boolean;
    error: string | null;
    refreshedAt: string | null;
    running: boolean;
  } | null;
}

export interface CsvRowError {
  line: number;
  column: string | null;
  message: string;
}

export interface WeatherImportResult {
  importId: number | null;
  rowsInFile: number;
  rowsAdded: number;
  rowsChanged: number;
  alreadyImported: boolean;
  from: string | null;
  to: string | null;
}

export interface JobRunDto {
  id: number;
  kind: string;
  startedAt: string;
  finishedAt: string | null;
  status: string;
  cellsOk: number;
  cellsFailed: number;
  cellsSkipped: number;
  daysWritten: number;
  daysRejected: number;
  requests: number;
  message: string | null;
}
