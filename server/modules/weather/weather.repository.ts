/** Data access for weather cells, daily values, imports and job runs (raw SQL for bulk upserts). */
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { TempSource } from '#shared/thermal/types';

/** How many of the first due cells a claimer chooses among (in its own random order). */
const CLAIM_SPREAD = 16;

function shuffled<T>(xs: readonly T[]): T[] {
  const out = [...xs];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(Math.random() * (i + 1));
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

export interface CellRow {
  id: number;
  latitude: number;
  longitude: number;
  timeZone: string;
  historyFrom: string | null;
  historyThrough: string | null;
  backfillTargetFrom: string | null;
  backfillError: string | null;
  refreshedAt: Date | null;
}

export interface StoredDay {
  date: string;
  tmax: number;
  tmin: number;
  source: TempSource;
  note: string | null;
}

export type CellSource = 'observed' | 'forecast' | 'filled';

/** A cell's daily mean soil temperature, °C. */
export interface SoilDay {
  date: string;
  soil: number;
  source: 'observed' | 'forecast';
}

export interface CellDayWrite {
  date: string;
  tmax: number;
  tmin: number;
  source: CellSource;
  note?: string | null;
}

/**
 * Temperatures are DOUBLE and may come from °F arithmetic: equal readings can differ in the last
 * bits, and no real change is ever this small.
 */
export const sameTemp = (a: number, b: number) => Math.abs(a - b) < 1e-9;
/** An observation replaces a fill, and a fill replaces a forecast; never the other way round. */
const RANK: Record<CellSource, number> = { forecast: 1, filled: 2, observed: 3 };

/**
 * The provenance rule again in SQL, so a concurrent writer of lower rank (a fill racing an
 * observation) cannot win between our read and our write. `source` is assigned last: MariaDB
 * evaluates the assignments in order, and the others must compare against the stored source.
 */
const NEWER_RANKS_HIGHER = "FIELD(VALUES(source), 'forecast', 'filled', 'observed') >= FIELD(source, 'forecast', 'filled', 'observed')";
export const RANKED_UPDATE = ['tmax_c', 'tmin_c', 'fill_note', 'fetched_at', 'source']
  .map((col) => `${col} = IF(${NEWER_RANKS_HIGHER}, VALUES(${col}), ${col})`)
  .join(', ');

const cellColumns = `id, latitude, longitude, time_zone AS timeZone, history_from AS historyFrom,
  history_through AS historyThrough, backfill_target_from AS backfillTargetFrom,
  backfill_error AS backfillError, refreshed_at AS refreshedAt`;

export function cellKey(latitude: number, longitude: number) {
  return { latKey: Math.round(latitude * 10), lonKey: Math.round(longitude * 10) };
}

export class WeatherRepository {
  constructor(private readonly db: Sequelize) {}

  async findOrCreateCell(latitude: number, longitude: number, timeZone: string, transaction?: Transaction): Promise<number> {
    const { latKey, lonKey } = cellKey(latitude, longitude);
    await this.db.query(
      `INSERT IGNORE INTO weather_cells (lat_key, lon_key, time_zone, latitude, longitude, created_at, updated_at)
       VALUES (?, ?, ?, ?, ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`,
      { replacements: [latKey, lonKey, timeZone, latKey / 10, lonKey / 10], transaction },
    );
    const [row] = await this.db.query<{ id: number }>(
      'SELECT id FROM weather_cells WHERE lat_key = ? AND lon_key = ? AND time_zone = ?',
      { replacements: [latKey, lonKey, timeZone], type: QueryTypes.SELECT, transaction },
    );
    return row.id;
  }

  async cell(id: number): Promise<CellRow | null> {
    const [row] = await this.db.query<CellRow>(`SELECT ${cellColumns} FROM weather_cells WHERE id = ?`, {
      replacements: [id],
      type: QueryTypes.SELECT,
    });
    return row ?? null;
  }

  /**
   * Claims one cell that gardens use and that nobody refreshed since `cutoff`: a conditional UPDATE
   * of its lease, and the affected-row count decides who won (row locks and SKIP LOCKED are
   * node-local on a Galera cluster). Each claimer tries the first CLAIM_SPREAD due cells in its own
   * random order, so claimers on several nodes rarely reach for the same row at once; when they do,
   * the later commit fails certification (1213), and that error is thrown, not retried here: the
   * caller counts it as a claim conflict and backs off.
   */
  async claimCell(owner: string, cutoff: Date, leaseMs: number, onlyCellId?: number, skip: readonly number[] = []): Promise<CellRow | null> {
    for (let look = 0; look < 3; look++) {
      const due = await this.db.query<{ id: number }>(
        `SELECT c.id FROM weather_cells c
          WHERE EXISTS (SELECT 1 FROM gardens g WHERE g.weather_cell_id = c.id)
            AND (c.refreshed_at IS NULL OR c.refreshed_at < ?)
            AND (c.lease_until IS NULL OR c.lease_until < UTC_TIMESTAMP(3))
            ${onlyCellId ? 'AND c.id = ?' : ''}
            ${skip.length ? 'AND c.id NOT IN (?)' : ''}
          ORDER BY c.id LIMIT ${CLAIM_SPREAD}`,
        { replacements: [cutoff, ...(onlyCellId ? [onlyCellId] : []), ...(skip.length ? [skip] : [])], type: QueryTypes.SELECT },
      );
      if (due.length === 0) return null;
      for (const { id } of shuffled(due)) {
        const [, affected] = await this.db.query(
          `UPDATE weather_cells SET lease_owner = ?, lease_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND
            WHERE id = ? AND (refreshed_at IS NULL OR refreshed_at < ?) AND (lease_until IS NULL OR lease_until < UTC_TIMESTAMP(3))`,
          { replacements: [owner, leaseMs * 1000, id, cutoff], type: QueryTypes.UPDATE },
        );
        if (affected !== 1) continue;
        const [cell] = await this.db.query<CellRow>(`SELECT ${cellColumns} FROM weather_cells WHERE id = ? AND lease_owner = ?`, {
          replacements: [id, owner],
          type: QueryTypes.SELECT,
        });
        if (cell) return cell;
      }
      // Every candidate was taken between the look and the claim: look again.
    }
    return null;
  }

  /**
   * Due cells (as claimCell picks them) that another claimer holds under a short lease, one that
   * runs out within `horizonMs`: a refresh in progress elsewhere, or one whose instance died and
   * whose lease will lapse soon. Backfill leases are longer and not counted.
   */
  async cellsLeasedElsewhere(cutoff: Date, horizonMs: number, skip: readonly number[] = []): Promise<number> {
    const [row] = await this.db.query<{ n: number }>(
      `SELECT COUNT(*) AS n FROM weather_cells c
        WHERE EXISTS (SELECT 1 FROM gardens g WHERE g.weather_cell_id = c.id)
          AND (c.refreshed_at IS NULL OR c.refreshed_at < ?)
          AND c.lease_until >= UTC_TIMESTAMP(3)
          AND c.lease_until <= UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND
          ${skip.length ? 'AND c.id NOT IN (?)' : ''}`,
      { replacements: [cutoff, horizonMs * 1000, ...(skip.length ? [skip] : [])], type: QueryTypes.SELECT },
    );
    return Number(row?.n ?? 0);
  }

  /** Moves the lease of a cell this owner still holds; false when it was lost (ran out and taken). */
  async renewCell(id: number, owner: string, leaseMs: number): Promise<boolean> {
    const [, affected] = await this.db.query(
      'UPDATE weather_cells SET lease_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND WHERE id = ? AND lease_owner = ?',
      { replacements: [leaseMs * 1000, id, owner], type: QueryTypes.UPDATE },
    );
    return affected === 1;
  }

  /** Takes the lease of one cell regardless of its refresh time (backfill), if nobody holds it. */
  async leaseCell(id: number, owner: string, leaseMs: number): Promise<boolean> {
    const [, affected] = await this.db.query(
      `UPDATE weather_cells SET lease_owner = ?, lease_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND
        WHERE id = ? AND (lease_until IS NULL OR lease_until < UTC_TIMESTAMP(3) OR lease_owner = ?)`,
      { replacements: [owner, leaseMs * 1000, id, owner], type: QueryTypes.UPDATE },
    );
    return affected === 1;
  }

  async releaseCell(id: number, owner: string, patch: { refreshed?: boolean; historyFrom?: string; historyThrough?: string; backfillError?: string | null; backfillTargetFrom?: string } = {}) {
    await this.db.query(
      `UPDATE weather_cells SET lease_owner = NULL, lease_until = NULL,
         refreshed_at = IF(?, UTC_TIMESTAMP(3), refreshed_at),
         history_from = COALESCE(LEAST(history_from, ?), history_from, ?),
         history_through = COALESCE(GREATEST(history_through, ?), history_through, ?),
         backfill_error = IF(?, ?, backfill_error),
         backfill_target_from = COALESCE(?, backfill_target_from),
         updated_at = UTC_TIMESTAMP(3)
       WHERE id = ? AND lease_owner = ?`,
      {
        replacements: [
          patch.refreshed ? 1 : 0,
          patch.historyFrom ?? null,
          patch.historyFrom ?? null,
          patch.historyThrough ?? null,
          patch.historyThrough ?? null,
          patch.backfillError !== undefined ? 1 : 0,
          patch.backfillError ?? null,
          patch.backfillTargetFrom ?? null,
          id,
          owner,
        ],
      },
    );
  }

  async cellDays(cellId: number, from: string, to: string, transaction?: Transaction): Promise<StoredDay[]> {
    const rows = await this.db.query<{ date: string; tmax: number; tmin: number; source: CellSource; note: string | null }>(
      `SELECT date, tmax_c AS tmax, tmin_c AS tmin, source, fill_note AS note FROM weather_days
        WHERE cell_id = ? AND date BETWEEN ? AND ? ORDER BY date`,
      { replacements: [cellId, from, to], type: QueryTypes.SELECT, transaction },
    );
    return rows;
  }

  /**
   * Writes days for a cell, skipping any that would lower provenance or change nothing, so a
   * re-run of the same day writes nothing. Returns the dates inserted or changed, in order.
   */
  async upsertCellDays(cellId: number, days: CellDayWrite[], transaction: Transaction): Promise<string[]> {
    if (!days.length) return [];
    const sorted = [...days].sort((a, b) => (a.date < b.date ? -1 : 1));
    const existing = new Map(
      (await this.cellDays(cellId, sorted[0].date, sorted[sorted.length - 1].date, transaction)).map((d) => [d.date, d]),
    );
    const writes = sorted.filter((d) => {
      const old = existing.get(d.date);
      if (!old) return true;
      if (RANK[d.source] < RANK[old.source as CellSource]) return false;
      return !sameTemp(old.tmax, d.tmax) || !sameTemp(old.tmin, d.tmin) || old.source !== d.source || (old.note ?? null) !== (d.note ?? null);
    });
    for (let i = 0; i < writes.length; i += 1000) {
      const chunk = writes.slice(i, i + 1000);
      await this.db.query(
        `INSERT INTO weather_days (cell_id, date, tmax_c, tmin_c, source, fill_note, fetched_at)
         VALUES ${chunk.map(() => '(?, ?, ?, ?, ?, ?, UTC_TIMESTAMP(3))').join(', ')}
         ON DUPLICATE KEY UPDATE ${RANKED_UPDATE}`,
        { replacements: chunk.flatMap((d) => [cellId, d.date, d.tmax, d.tmin, d.source, d.note ?? null]), transaction },
      );
    }
    return writes.map((d) => d.date);
  }

  /** The first and last date a cell has a value for, if any. */
  async cellSpan(cellId: number, transaction?: Transaction): Promise<{ from: string; to: string } | null> {
    const [row] = await this.db.query<{ from: string | null; to: string | null }>(
      'SELECT MIN(date) AS `from`, MAX(date) AS `to` FROM weather_days WHERE cell_id = ?',
      { replacements: [cellId], type: QueryTypes.SELECT, transaction },
    );
    return row?.from && row.to ? { from: row.from, to: row.to } : null;
  }

  /** The days of several cells in one query, per cell in date order. */
  async cellsDays(cellIds: number[], from: string, to: string, transaction?: Transaction): Promise<Map<number, StoredDay[]>> {
    const out = new Map<number, StoredDay[]>(cellIds.map((id) => [id, []]));
    if (!cellIds.length) return out;
    const rows = await this.db.query<StoredDay & { cellId: number }>(
      `SELECT cell_id AS cellId, date, tmax_c AS tmax, tmin_c AS tmin, source, fill_note AS note FROM weather_days
        WHERE cell_id IN (?) AND date BETWEEN ? AND ? ORDER BY cell_id, date`,
      { replacements: [cellIds, from, to], type: QueryTypes.SELECT, transaction },
    );
    for (const { cellId, ...d } of rows) out.get(cellId)!.push(d);
    return out;
  }

  /** Station days of several gardens in one query, per garden in date order. */
  async gardensDays(gardenIds: number[], from: string, to: string, transaction?: Transaction): Promise<Map<number, StoredDay[]>> {
    const out = new Map<number, StoredDay[]>(gardenIds.map((id) => [id, []]));
    if (!gardenIds.length) return out;
    const rows = await this.db.query<{ gardenId: number; date: string; tmax: number; tmin: number }>(
      `SELECT garden_id AS gardenId, date, tmax_c AS tmax, tmin_c AS tmin FROM garden_weather_days
        WHERE garden_id IN (?) AND date BETWEEN ? AND ? ORDER BY garden_id, date`,
      { replacements: [gardenIds, from, to], type: QueryTypes.SELECT, transaction },
    );
    for (const { gardenId, ...d } of rows) out.get(gardenId)!.push({ ...d, source: 'imported', note: null });
    return out;
  }

  /** A cell's daily soil means (°C) in a range, oldest first. */
  async cellSoil(cellId: number, from: string, to: string, transaction?: Transaction): Promise<SoilDay[]> {
    const rows = await this.db.query<SoilDay>(
      'SELECT date, soil_c AS soil, source FROM soil_days WHERE cell_id = ? AND date BETWEEN ? AND ? ORDER BY date',
      { replacements: [cellId, from, to], type: QueryTypes.SELECT, transaction },
    );
    // DECIMAL may come back as text.
    return rows.map((r) => ({ ...r, soil: Number(r.soil) }));
  }

  /**
   * Writes a cell's soil means: an observed day replaces a forecast one, never the reverse, and
   * an unchanged day is not written. Returns how many were written.
   */
  async upsertCellSoil(cellId: number, days: SoilDay[], transaction: Transaction): Promise<number> {
    if (!days.length) return 0;
    const sorted = [...days].sort((a, b) => (a.date < b.date ? -1 : 1));
    const existing = new Map((await this.cellSoil(cellId, sorted[0].date, sorted[sorted.length - 1].date, transaction)).map((d) => [d.date, d]));
    const writes = sorted.filter((d) => {
      const old = existing.get(d.date);
      if (!old) return true;
      if (old.source === 'observed' && d.source === 'forecast') return false;
      return !sameTemp(old.soil, d.soil) || old.source !== d.source;
    });
    if (!writes.length) return 0;
    const newer = "FIELD(VALUES(source), 'forecast', 'observed') >= FIELD(source, 'forecast', 'observed')";
    await this.db.query(
      `INSERT INTO soil_days (cell_id, date, soil_c, source, fetched_at)
       VALUES ${writes.map(() => '(?, ?, ?, ?, UTC_TIMESTAMP(3))').join(', ')}
       ON DUPLICATE KEY UPDATE ${['soil_c', 'fetched_at', 'source'].map((c) => `${c} = IF(${newer}, VALUES(${c}), ${c})`).join(', ')}`,
      { replacements: writes.flatMap((d) => [cellId, d.date, d.soil, d.source]), transaction },
    );
    return writes.length;
  }

  async gardensOfCell(cellId: number, transaction?: Transaction): Promise<number[]> {
    const rows = await this.db.query<{ id: number }>('SELECT id FROM gardens WHERE weather_cell_id = ?', {
      replacements: [cellId],
      type: QueryTypes.SELECT,
      transaction,
    });
    return rows.map((r) => r.id);
  }

  async cellsInUse(): Promise<number[]> {
    const rows = await this.db.query<{ id: number }>(
      'SELECT c.id FROM weather_cells c WHERE EXISTS (SELECT 1 FROM gardens g WHERE g.weather_cell_id = c.id) ORDER BY c.id',
      { type: QueryTypes.SELECT },
    );
    return rows.map((r) => r.id);
  }

  /** Dates in a range that have a value better than a forecast. */
  async knownDates(cellId: number, from: string, to: string): Promise<Set<string>> {
    const rows = await this.db.query<{ date: string }>(
      "SELECT date FROM weather_days WHERE cell_id = ? AND date BETWEEN ? AND ? AND source <> 'forecast'",
      { replacements: [cellId, from, to], type: QueryTypes.SELECT },
    );
    return new Set(rows.map((r) => r.date));
  }

  async recordHistory(cellId: number, h: { historyFrom: string; historyThrough: string; targetFrom: string }) {
    await this.db.query(
      'UPDATE weather_cells SET history_from = ?, history_through = ?, backfill_target_from = ?, backfill_error = NULL WHERE id = ?',
      { replacements: [h.historyFrom, h.historyThrough, h.targetFrom, cellId] },
    );
  }

  async cellsNeedingBackfill(): Promise<number[]> {
    const rows = await this.db.query<{ id: number }>(
      `SELECT c.id FROM weather_cells c
        WHERE EXISTS (SELECT 1 FROM gardens g WHERE g.weather_cell_id = c.id)
          AND (c.history_from IS NULL OR c.backfill_target_from IS NULL OR c.history_from > c.backfill_target_from)`,
      { type: QueryTypes.SELECT },
    );
    return rows.map((r) => r.id);
  }

  async startRun(kind: string, instance: string, gardenId: number | null): Promise<number> {
    const [id] = (await this.db.query(
      `INSERT INTO job_runs (kind, instance, garden_id, started_at, heartbeat_at, status) VALUES (?, ?, ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3), 'running')`,
      { replacements: [kind, instance, gardenId] },
    )) as unknown as [number, number];
    return id;
  }

  /** Shows the run is alive; a run whose heartbeat stops is closed by sweepStaleRuns. */
  async heartbeatRun(id: number) {
    await this.db.query("UPDATE job_runs SET heartbeat_at = UTC_TIMESTAMP(3) WHERE id = ? AND status = 'running'", { replacements: [id] });
  }

  /**
   * Closes as failed every run still `running` whose heartbeat (or start, for rows older than the
   * heartbeat) is older than `staleMs`: its instance died or was cut off mid-run. Returns how many.
   */
  async sweepStaleRuns(staleMs: number): Promise<number> {
    const [, affected] = await this.db.query(
      `UPDATE job_runs SET status = 'failed', finished_at = UTC_TIMESTAMP(3),
         message = LEFT(CONCAT('abandoned: no heartbeat since ', DATE_FORMAT(COALESCE(heartbeat_at, started_at), '%Y-%m-%d %H:%i:%s'),
           ' UTC (the instance stopped mid-run)', IF(message IS NULL, '', CONCAT('; ', message))), 1000)
       WHERE status = 'running' AND COALESCE(heartbeat_at, started_at) < UTC_TIMESTAMP(3) - INTERVAL ? MICROSECOND`,
      { replacements: [staleMs * 1000], type: QueryTypes.UPDATE },
    );
    return affected;
  }

  /**
   * Records the end of a run. Only cell failures (and errors that stopped a worker) make it
   * partial or failed; claims lost to another instance are counted in `claim_conflicts` apart.
   * A run that was swept meanwhile (status no longer `running`) is still given its real figures.
   */
  async finishRun(id: number, r: RunTotals) {
    const status = r.cellsFailed === 0 ? 'ok' : r.cellsOk > 0 ? 'partial' : 'failed';
    await this.db.query(
      `UPDATE job_runs SET finished_at = UTC_TIMESTAMP(3), heartbeat_at = UTC_TIMESTAMP(3), status = ?, cells_ok = ?, cells_failed = ?, cells_skipped = ?,
         days_written = ?, days_rejected = ?, requests = ?, claim_conflicts = ?, message = ? WHERE id = ?`,
      {
        replacements: [status, r.cellsOk, r.cellsFailed, r.cellsSkipped, r.daysWritten, r.daysRejected, r.requests, r.claimConflicts ?? 0, r.message?.slice(0, 1000) ?? null, id],
      },
    );
  }

  async runs(gardenId: number, limit: number) {
    return this.db.query<RunRow>(
      `SELECT id, kind, garden_id AS gardenId, started_at AS startedAt, finished_at AS finishedAt, status,
              cells_ok AS cellsOk, cells_failed AS cellsFailed, cells_skipped AS cellsSkipped,
              days_written AS daysWritten, days_rejected AS daysRejected, requests,
              -- A nightly run's message may name other gardens' cells: owners see only their own runs' messages.
              CASE WHEN garden_id = ? THEN message END AS message
         FROM job_runs WHERE garden_id IS NULL OR garden_id = ? ORDER BY id DESC LIMIT ?`,
      { replacements: [gardenId, gardenId, limit], type: QueryTypes.SELECT },
    );
  }
}

export interface RunTotals {
  cellsOk: number;
  cellsFailed: number;
  cellsSkipped: number;
  daysWritten: number;
  daysRejected: number;
  requests: number;
  /** Claims that lost to another claimer (1213: deadlock, or certification against another node). */
  claimConflicts?: number;
  message?: string;
}

export interface RunRow extends RunTotals {
  id: number;
  kind: string;
  gardenId: number | null;
  startedAt: Date;
  finishedAt: Date | null;
  status: string;
}
