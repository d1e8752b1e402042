/**
 * A grower's own station data as CSV: date, high, low in °F or °C. Every row is checked and every
 * problem reported with its line and column; the file is stored all or nothing, in one
 * transaction with the garden's "weather changed" event, and re-uploading the same file adds nothing.
 */
import { createHash } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import type { Sequelize } from 'sequelize';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { inTransaction } from '../../lib/transaction';
import { isTextFile, NOT_TEXT_CSV } from '../../lib/upload';
import type { CsvRowError, WeatherImportResult } from '#shared/schemas/weather';
import { parseIsoDate } from '#shared/thermal/dates';
import { fToC } from '#shared/thermal/units';
import { AppError } from '../../errors';
import { recordWeatherChanged } from './weather-events';
import { sameTemp } from './weather.repository';
import { countOf } from '#shared/format/count-words';
import { rangeToken } from '#shared/format/dates';
import { recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';

const ALIASES: Record<'date' | 'high' | 'low', string[]> = {
  date: ['date', 'day'],
  high: ['high', 'tmax', 'max', 'maximum', 'temp_max', 'max_temp', 'high_temp', 'temperature_max'],
  low: ['low', 'tmin', 'min', 'minimum', 'temp_min', 'min_temp', 'low_temp', 'temperature_min'],
};
const MAX_REPORTED = 50;

interface ParsedRow {
  date: string;
  tmax: number;
  tmin: number;
}

function csvError(message: string, rows: CsvRowError[]) {
  const err = new AppError(422, 'csv_invalid', message);
  err.extra = { rows };
  return err;
}

function parseNumber(raw: string): number | null {
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(raw.trim())) return null;
  return Number(raw);
}

export function parseStationCsv(buffer: Buffer, unit: 'F' | 'C', today: string): ParsedRow[] {
  if (!isTextFile(buffer)) throw csvError(NOT_TEXT_CSV, []);
  let records: string[][];
  try {
    records = parse(buffer, { bom: true, skip_empty_lines: true, trim: true, relax_column_count: false });
  } catch (err) {
    const e = err as { lines?: number; message: string };
    throw csvError('The file is not valid CSV.', [{ line: e.lines ?? 1, column: null, message: e.message }]);
  }
  if (!records.length) throw csvError('The file is empty.', [{ line: 1, column: null, message: 'No header row.' }]);
  // "High (°F)", "tmax [C]" and "Low °C" all name a column by its first words.
  const header = records[0].map((h) =>
    h
      .toLowerCase()
      .replace(/\(.*?\)|\[.*?\]|°\s*[fc]\b/g, '')
      .trim()
      .replace(/[\s-]+/g, '_'),
  );
  const col: Partial<Record<'date' | 'high' | 'low', number>> = {};
  const problems: CsvRowError[] = [];
  for (const key of ['date', 'high', 'low'] as const) {
    const at = header.findIndex((h) => ALIASES[key].includes(h));
    if (at < 0) problems.push({ line: 1, column: key, message: `No "${key}" column; the header needs date, high and low.` });
    else col[key] = at;
  }
  if (problems.length) throw csvError('The header row is missing columns.', problems);

  const rows: ParsedRow[] = [];
  const seen = new Map<string, number>();
  const toC = unit === 'F' ? fToC : (v: number) => v;
  records.slice(1).forEach((rec, i) => {
    const line = i + 2;
    const rowProblems: CsvRowError[] = [];
    const rawDate = rec[col.date!] ?? '';
    let date: string | null = null;
    try {
      parseIsoDate(rawDate);
      date = rawDate;
    } catch {
      rowProblems.push({ line, column: 'date', message: `"${rawDate}" is not a date like 2026-05-31.` });
    }
    if (date && date > today) rowProblems.push({ line, column: 'date', message: `${date} is in the future.` });
    if (date && seen.has(date)) rowProblems.push({ line, column: 'date', message: `${date} already appears on line ${seen.get(date)}.` });
    const values: Record<'high' | 'low', number | null> = { high: null, low: null };
    for (const key of ['high', 'low'] as const) {
      const raw = rec[col[key]!] ?? '';
      const v = parseNumber(raw);
      if (v === null) {
        rowProblems.push({ line, column: key, message: `"${raw}" is not a number.` });
        continue;
      }
      // Unrounded: 24 °F must stay exactly the severe-freeze threshold, not −4.4 °C above it.
      const c = toC(v);
      if (c < -90 || c > 60) {
        rowProblems.push({ line, column: key, message: `${v} °${unit} is outside the plausible range for air temperature.` });
        continue;
      }
      values[key] = c;
    }
    if (values.high !== null && values.low !== null && values.low > values.high) {
      rowProblems.push({ line, column: 'low', message: 'The low is above the high.' });
    }
    if (date && !seen.has(date)) seen.set(date, line);
    if (rowProblems.length) problems.push(...rowProblems);
    else rows.push({ date: date!, tmax: values.high!, tmin: values.low! });
  });
  if (problems.length) {
    const shown = problems.slice(0, MAX_REPORTED);
    const more = problems.length > MAX_REPORTED ? ` (first ${MAX_REPORTED} of ${problems.length} shown)` : '';
    throw csvError(`${countOf(problems.length, 'problem')} in the file; nothing was imported${more}.`, shown);
  }
  if (!rows.length) throw csvError('The file has a header but no data rows.', [{ line: 2, column: null, message: 'No rows.' }]);
  return rows;
}

export async function importStationCsv(
  sequelize: Sequelize,
  p: { gardenId: number; actor: AuditActor; fileName: string; buffer: Buffer; unit: 'F' | 'C'; today: string },
  afterCommit: () => void = () => undefined,
): Promise<WeatherImportResult> {
  const rows = parseStationCsv(p.buffer, p.unit, p.today);
  const sha256 = createHash('sha256').update(p.buffer).update(p.unit).digest('hex');
  const dates = rows.map((r) => r.date).sort();
  const span = { from: dates[0], to: dates[dates.length - 1] };
  const already = { importId: null, rowsInFile: rows.length, rowsAdded: 0, rowsChanged: 0, alreadyImported: true, ...span };
  const write = () => inTransaction(sequelize, async (transaction) => {
    const [previous] = await sequelize.query<{ id: number }>(
      'SELECT id FROM weather_imports WHERE garden_id = ? AND sha256 = ? LIMIT 1',
      { replacements: [p.gardenId, sha256], type: QueryTypes.SELECT, transaction },
    );
    if (previous) return { ...already, importId: previous.id };

    const existing = new Map(
      (
        await sequelize.query<{ date: string; tmax: number; tmin: number }>(
          'SELECT date, tmax_c AS tmax, tmin_c AS tmin FROM garden_weather_days WHERE garden_id = ? AND date BETWEEN ? AND ? FOR UPDATE',
          { replacements: [p.gardenId, span.from, span.to], type: QueryTypes.SELECT, transaction },
        )
      ).map((r) => [r.date, r]),
    );
    const added = rows.filter((r) => !existing.has(r.date));
    const changed = rows.filter((r) => {
      const old = existing.get(r.date);
      return old && (!sameTemp(old.tmax, r.tmax) || !sameTemp(old.tmin, r.tmin));
    });
    const [importId] = (await sequelize.query(
      `INSERT INTO weather_imports (garden_id, user_id, file_name, sha256, unit, rows_in_file, rows_added, rows_changed, created_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, UTC_TIMESTAMP(3))`,
      { replacements: [p.gardenId, p.actor.id, p.fileName.slice(0, 255), sha256, p.unit, rows.length, added.length, changed.length], transaction },
    )) as unknown as [number, number];
    await recordAudit(transaction, {
      gardenId: p.gardenId,
      actor: p.actor,
      entity: 'weather-import',
      entityId: importId,
      action: 'imported',
      summary: `Imported ${countOf(rows.length, 'day')} of station weather, ${rangeToken(span.from, span.to)}`,
      changes: { file: { to: p.fileName.slice(0, 255) }, firstDay: { to: span.from }, lastDay: { to: span.to }, daysAdded: { to: added.length }, daysChanged: { to: changed.length } },
    });
    const writes = [...added, ...changed];
    for (let i = 0; i < writes.length; i += 1000) {
      const chunk = writes.slice(i, i + 1000);
      await sequelize.query(
        `INSERT INTO garden_weather_days (garden_id, date, tmax_c, tmin_c, import_id, updated_at)
         VALUES ${chunk.map(() => '(?, ?, ?, ?, ?, UTC_TIMESTAMP(3))').join(', ')}
         ON DUPLICATE KEY UPDATE tmax_c = VALUES(tmax_c), tmin_c = VALUES(tmin_c), import_id = VALUES(import_id), updated_at = VALUES(updated_at)`,
        { replacements: chunk.flatMap((r) => [p.gardenId, r.date, r.tmax, r.tmin, importId]), transaction },
      );
    }
    if (writes.length) {
      const written = writes.map((r) => r.date).sort();
      await recordWeatherChanged(transaction, { gardenId: p.gardenId }, written[0], written[written.length - 1]);
      transaction.afterCommit(afterCommit);
    }
    return { importId, rowsInFile: rows.length, rowsAdded: added.length, rowsChanged: changed.length, alreadyImported: false, ...span };
  });
  try {
    return await write();
  } catch (err) {
    // The same file uploaded twice at once: the unique (garden, file hash) key lets one through.
    if (err instanceof UniqueConstraintError) return already;
    throw err;
  }
}
