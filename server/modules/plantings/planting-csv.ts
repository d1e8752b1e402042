/**
 * Plantings with their logs as CSV: one row per log entry (a planting without entries gets one
 * row), so the file opens as a plain table. Import reads the same layout, validates every row
 * before writing anything, and writes all of it in one transaction. A planting is matched by its
 * natural key (bed, variety, method, start date) and a log entry by all of its fields, so
 * uploading the same file again changes nothing.
 */
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import { z } from 'zod';
import { CROP_LIBRARY } from '#shared/crops/library';
import { PLANTING_CSV_COLUMNS, logEntryCreateSchema, plantingCreateSchema } from '#shared/schemas/plantings';
import type { ImportProblem, ImportReport, LogEntryCreateInput, PlantingCreateInput } from '#shared/schemas/plantings';
import { Bed, Planting, PlantingLog, SeedLot, Variety } from '../../db/models';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import { recordAudit } from '../audit/audit';
import type { AuditActor } from '../audit/audit';
import { isTextFile, NOT_TEXT_CSV } from '../../lib/upload';
import { plantingIncludes } from './plantings.service';
import { plantingFields } from './plantings.presenter';
import { countOf } from '#shared/format/count-words';

type Column = (typeof PLANTING_CSV_COLUMNS)[number];

const FORMULA_START = /^[=+\-@\t\r]/;
// A cell's lines, each with the break that ends it: a spreadsheet starts a new row at a bare CR or LF too.
const LINES = /[^\r\n]*(?:\r\n|\r|\n|$)/g;

const eachLine = (cell: string, f: (line: string) => string) => (cell.match(LINES) ?? []).map(f).join('');

/**
 * OWASP CSV injection: every line of a cell that a spreadsheet would run as a formula (= + - @,
 * tab or CR first) is prefixed with an apostrophe. A line that already starts with an apostrophe
 * gets one more, so the import can take exactly one off and the file round-trips unchanged.
 */
export function neutralise(cell: string): string {
  return eachLine(cell, (line) => (FORMULA_START.test(line) || line.startsWith("'") ? `'${line}` : line));
}

/** Undoes neutralise on import: one apostrophe off the start of each line that has one. */
export function unneutralise(cell: string): string {
  return eachLine(cell, (line) => (line.startsWith("'") ? line.slice(1) : line));
}

/** Free text keeps its spaces on import (a note may start with one); names and codes are trimmed. */
const FREE_TEXT: ReadonlySet<string> = new Set(['notes', 'log_note']);

const cropName = new Map(CROP_LIBRARY.map((c) => [c.key, c.name]));

export async function exportPlantingsCsv(gardenId: number): Promise<string> {
  const plantings = await Planting.findAll({ where: { gardenId }, include: plantingIncludes, order: [['startOn', 'ASC'], ['id', 'ASC']] });
  const logs = await PlantingLog.findAll({ where: { gardenId }, order: [['entryOn', 'ASC'], ['id', 'ASC']] });
  const byPlanting = new Map<number, PlantingLog[]>();
  // Photo entries stay out: the file carries no photos, and an entry without its photo is refused on import.
  for (const l of logs) if (l.kind !== 'photo') byPlanting.set(l.plantingId, [...(byPlanting.get(l.plantingId) ?? []), l]);
  const rows: string[][] = [];
  for (const p of plantings) {
    const base: Record<Column, string> = {
      bed: p.bed!.name,
      crop: p.variety!.cropKey,
      variety: p.variety!.name,
      seed_lot: p.seedLot?.lotNumber ?? '',
      method: p.method,
      status: p.status,
      quantity: p.quantity === null ? '' : String(p.quantity),
      quantity_unit: p.quantityUnit,
      sown: p.sownOn ?? '',
      emerged: p.emergedOn ?? '',
      thinned: p.thinnedOn ?? '',
      transplanted: p.transplantedOn ?? '',
      first_harvest: p.firstHarvestOn ?? '',
      last_harvest: p.lastHarvestOn ?? '',
      bolted: p.boltedOn ?? '',
      notes: p.notes,
      log_date: '',
      log_kind: '',
      log_amount: '',
      log_unit: '',
      log_note: '',
    };
    const entries = byPlanting.get(p.id) ?? [];
    const withLogs = entries.length
      ? entries.map((l) => ({
          ...base,
          log_date: l.entryOn,
          log_kind: l.kind,
          log_amount: l.amount === null ? '' : String(l.amount),
          log_unit: l.amountUnit ?? '',
          log_note: l.note,
        }))
      : [base];
    for (const r of withLogs) rows.push(PLANTING_CSV_COLUMNS.map((c) => neutralise(r[c])));
  }
  // RFC 4180: CRLF line ends, fields with commas, quotes or line breaks quoted, quotes doubled.
  // A bare CR or LF inside a field is quoted as well (csv-stringify quotes only its own record delimiter).
  return stringify([[...PLANTING_CSV_COLUMNS], ...rows], { record_delimiter: 'windows', bom: true, quoted_match: /[\r\n]/ });
}

interface ParsedRow {
  line: number;
  planting: PlantingCreateInput;
  log: LogEntryCreateInput | null;
}

const FIELD_COLUMN: Record<string, Column> = {
  bedId: 'bed',
  varietyId: 'variety',
  seedLotId: 'seed_lot',
  method: 'method',
  status: 'status',
  quantity: 'quantity',
  quantityUnit: 'quantity_unit',
  sownOn: 'sown',
  emergedOn: 'emerged',
  thinnedOn: 'thinned',
  transplantedOn: 'transplanted',
  firstHarvestOn: 'first_harvest',
  lastHarvestOn: 'last_harvest',
  boltedOn: 'bolted',
  notes: 'notes',
  entryOn: 'log_date',
  kind: 'log_kind',
  amount: 'log_amount',
  amountUnit: 'log_unit',
  note: 'log_note',
};

const REQUIRED: Column[] = ['bed', 'crop', 'variety', 'method', 'status'];
const MAX_ROWS = 5000;

function numberOrNull(cell: string): number | null | string {
  if (cell === '') return null;
  const n = Number(cell);
  return Number.isFinite(n) ? n : cell;
}

function issuesToProblems(line: number, error: z.ZodError): ImportProblem[] {
  return error.issues.map((i) => ({ line, column: FIELD_COLUMN[String(i.path[0])] ?? String(i.path[0] ?? ''), message: i.message }));
}

function parseRows(buffer: Buffer): { header: string[]; records: { line: number; cells: Record<string, string> }[] } {
  let parsed: { record: Record<string, string>; info: { lines: number } }[];
  let header: string[] = [];
  if (!isTextFile(buffer)) reject([{ line: 1, column: '', message: 'Save the sheet as CSV (comma-separated text) and upload that file.' }], NOT_TEXT_CSV);
  try {
    parsed = parse(buffer, {
      bom: true,
      columns: (h: string[]) => (header = h.map((c) => c.trim().toLowerCase())),
      info: true,
      skip_empty_lines: true,
      relax_column_count: false,
    });
  } catch (err) {
    const e = err as { message?: string; lines?: number };
    reject([{ line: e.lines ?? 1, column: '', message: e.message ?? 'Malformed CSV.' }], 'The file could not be read as CSV.');
  }
  return { header, records: parsed.map((p) => ({ line: p.info.lines, cells: p.record })) };
}

/** A 422 whose `rows` list each problem by line and column, the same report the weather import gives. */
function reject(problems: ImportProblem[], headline?: string): never {
  const shown = problems.slice(0, 50);
  const more = problems.length > shown.length ? ` (showing the first ${shown.length})` : '';
  const err = new AppError(
    422,
    'import_invalid',
    headline ?? `Nothing was imported: ${countOf(problems.length, 'problem')} in the file${more}.`,
  );
  err.extra = { rows: shown.map((p) => ({ line: p.line, column: p.column || null, message: p.message })) };
  throw err;
}

const sameLog = (a: PlantingLog, b: LogEntryCreateInput) =>
  a.entryOn === b.entryOn && a.kind === b.kind && (a.amount ?? null) === (b.amount ?? null) && (a.amountUnit ?? null) === (b.amountUnit ?? null) && a.note === (b.note ?? '');

function samePlanting(a: PlantingCreateInput, b: PlantingCreateInput) {
  return (Object.keys(a) as (keyof PlantingCreateInput)[]).every((k) => (a[k] ?? null) === (b[k] ?? null));
}

const keyOf = (p: PlantingCreateInput) => [p.bedId, p.varietyId, p.method, p.sownOn ?? p.transplantedOn ?? ''].join('|');

export async function importPlantingsCsv(gardenId: number, actor: AuditActor, buffer: Buffer): Promise<ImportReport> {
  const userId = actor.id;
  const { header, records } = parseRows(buffer);
  const problems: ImportProblem[] = [];
  const unknown = header.filter((h) => !(PLANTING_CSV_COLUMNS as readonly string[]).includes(h));
  for (const h of unknown) problems.push({ line: 1, column: h, message: `Unknown column "${h}".` });
  for (const r of REQUIRED) if (!header.includes(r)) problems.push({ line: 1, column: r, message: `The column "${r}" is required.` });
  if (!records.length) problems.push({ line: 1, column: '', message: 'The file has no rows below the header.' });
  if (records.length > MAX_ROWS) problems.push({ line: 1, column: '', message: `At most ${MAX_ROWS} rows per file.` });
  if (problems.length) reject(problems);

  const [beds, varieties, lots] = await Promise.all([
    Bed.findAll({ where: { gardenId } }),
    Variety.findAll({ where: { gardenId } }),
    SeedLot.findAll({ where: { gardenId } }),
  ]);
  const bedByName = new Map(beds.map((b) => [b.name.toLowerCase(), b]));
  const varietyByKey = new Map(varieties.map((v) => [`${v.cropKey}|${v.name.toLowerCase()}`, v]));
  const cropKeyByWord = new Map(CROP_LIBRARY.flatMap((c) => [[c.key, c.key], [c.name.toLowerCase(), c.key]]));

  const rows: ParsedRow[] = [];
  for (const { line, cells: raw } of records) {
    const cells = Object.fromEntries(
      PLANTING_CSV_COLUMNS.map((c) => {
        const cell = unneutralise(raw[c] ?? '');
        return [c, FREE_TEXT.has(c) ? cell : cell.trim()];
      }),
    ) as Record<Column, string>;
    const bad = (column: Column, message: string) => problems.push({ line, column, message });
    const bed = bedByName.get(cells.bed.toLowerCase());
    if (!bed) bad('bed', `No bed named "${cells.bed}" in this garden.`);
    const cropKey = cropKeyByWord.get(cells.crop.toLowerCase());
    if (!cropKey) bad('crop', `Unknown crop "${cells.crop}".`);
    const variety = cropKey ? varietyByKey.get(`${cropKey}|${cells.variety.toLowerCase()}`) : undefined;
    if (cropKey && !variety) bad('variety', `No ${cropName.get(cropKey)} variety named "${cells.variety}" in this garden.`);
    let seedLotId: number | null = null;
    if (cells.seed_lot && variety) {
      const matches = lots.filter((l) => l.varietyId === variety.id && l.lotNumber.toLowerCase() === cells.seed_lot.toLowerCase());
      if (matches.length !== 1) bad('seed_lot', matches.length ? `Several lots of this variety are numbered "${cells.seed_lot}".` : `No lot "${cells.seed_lot}" of this variety.`);
      else seedLotId = matches[0].id;
    }
    const planting = plantingCreateSchema.safeParse({
      bedId: bed?.id ?? 1,
      varietyId: variety?.id ?? 1,
      seedLotId,
      method: cells.method,
      status: cells.status,
      quantity: numberOrNull(cells.quantity),
      quantityUnit: cells.quantity_unit || 'plants',
      sownOn: cells.sown || null,
      emergedOn: cells.emerged || null,
      thinnedOn: cells.thinned || null,
      transplantedOn: cells.transplanted || null,
      firstHarvestOn: cells.first_harvest || null,
      lastHarvestOn: cells.last_harvest || null,
      boltedOn: cells.bolted || null,
      notes: cells.notes,
    });
    if (!planting.success) problems.push(...issuesToProblems(line, planting.error));
    let log: LogEntryCreateInput | null = null;
    if (cells.log_date || cells.log_kind || cells.log_amount || cells.log_unit || cells.log_note) {
      const parsed = logEntryCreateSchema.safeParse({
        entryOn: cells.log_date,
        kind: cells.log_kind,
        amount: numberOrNull(cells.log_amount),
        amountUnit: cells.log_unit || null,
        note: cells.log_note,
      });
      if (parsed.success) log = parsed.data;
      else problems.push(...issuesToProblems(line, parsed.error));
    }
    if (planting.success && bed && variety) rows.push({ line, planting: planting.data, log });
  }

  const firstOf = new Map<string, ParsedRow>();
  for (const r of rows) {
    const first = firstOf.get(keyOf(r.planting));
    if (!first) firstOf.set(keyOf(r.planting), r);
    else if (!samePlanting(first.planting, r.planting)) {
      problems.push({ line: r.line, column: 'status', message: `Same planting as line ${first.line} (bed, variety, method, start date) but with different details.` });
    }
  }
  if (problems.length) reject(problems);

  return inTransaction(Planting.sequelize!, async (transaction) => {
    const report: ImportReport = { plantingsCreated: 0, plantingsUpdated: 0, plantingsUnchanged: 0, logEntriesCreated: 0, logEntriesExisting: 0 };
    const idByKey = new Map<string, number>();
    for (const [key, { planting }] of firstOf) {
      const existing = await Planting.findOne({
        where: { gardenId, bedId: planting.bedId, varietyId: planting.varietyId, method: planting.method, startOn: planting.sownOn ?? planting.transplantedOn ?? null },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      if (!existing) {
        const created = await Planting.create({ gardenId, createdBy: userId, ...planting }, { transaction });
        idByKey.set(key, created.id);
        report.plantingsCreated++;
      } else if (samePlanting(plantingFields(existing), planting)) {
        idByKey.set(key, existing.id);
        report.plantingsUnchanged++;
      } else {
        await existing.update(planting, { transaction });
        idByKey.set(key, existing.id);
        report.plantingsUpdated++;
      }
    }
    const logsOf = new Map<number, PlantingLog[]>();
    for (const r of rows) {
      if (!r.log) continue;
      const plantingId = idByKey.get(keyOf(r.planting))!;
      if (!logsOf.has(plantingId)) logsOf.set(plantingId, await PlantingLog.findAll({ where: { plantingId }, transaction }));
      const have = logsOf.get(plantingId)!;
      if (have.some((l) => sameLog(l, r.log!))) {
        report.logEntriesExisting++;
        continue;
      }
      const entry = await PlantingLog.create(
        {
          gardenId,
          plantingId,
          entryOn: r.log.entryOn,
          kind: r.log.kind,
          amount: r.log.amount ?? null,
          amountUnit: r.log.amountUnit ?? null,
          note: r.log.note ?? '',
          photoId: null,
          createdBy: userId,
        },
        { transaction },
      );
      have.push(entry);
      report.logEntriesCreated++;
    }
    // One entry for the file (an import of the same file again changes nothing and writes none).
    if (report.plantingsCreated || report.plantingsUpdated || report.logEntriesCreated) {
      const parts = [
        report.plantingsCreated ? `${countOf(report.plantingsCreated, 'planting')} added` : '',
        report.plantingsUpdated ? `${countOf(report.plantingsUpdated, 'planting')} changed` : '',
        report.logEntriesCreated ? `${countOf(report.logEntriesCreated, 'log entry', 'log entries')} added` : '',
      ].filter(Boolean);
      await recordAudit(transaction, {
        gardenId,
        actor,
        entity: 'planting',
        entityId: null,
        action: 'imported',
        summary: `Imported a plantings file: ${parts.join(', ')}`,
        changes: {
          plantingsCreated: { to: report.plantingsCreated },
          plantingsUpdated: { to: report.plantingsUpdated },
          logEntriesCreated: { to: report.logEntriesCreated },
        },
      });
    }
    return report;
  });
}
