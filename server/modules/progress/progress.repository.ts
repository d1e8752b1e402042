/**
 * The progress cache: one row per planting, valid for one calendar day of its garden, removed
 * whenever something it was computed from changes (progress-invalidation.ts, the weather
 * processor). Raw SQL: the hot reads are one indexed query each.
 */
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { ProgressSummaryDto } from '#shared/schemas/progress';
import { inTransaction, isRetryable } from '../../lib/transaction';
import { moveGardenRevisions } from '../../lib/garden-revision';

export const BOLT_RANK = { none: 0, low: 1, elevated: 2, high: 3 } as const;

/** Bump when the stored ProgressDto or summary changes shape: older rows then count as missing. */
export const PROGRESS_FORMAT = 4;

/** Rows per INSERT when storing answers. */
const SAVE_SLICE = 250;

export interface ProgressRow {
  plantingId: number;
  gardenId: number;
  computedFor: string;
  percent: number | null;
  readyOn: string | null;
  boltRank: number;
  summary: ProgressSummaryDto;
  /** The whole ProgressDto as JSON, sent as it is. */
  body: string;
}

export interface GrowingRow {
  plantingId: number;
  status: 'growing';
  varietyId: number;
  varietyName: string;
  cropKey: string;
  bedId: number;
  bedName: string;
  /** Every date recorded for it: stage dates and the latest log entry's (for the stale flag). */
  recordedOn: (string | null)[];
  firstHarvestOn: string | null;
  summary: ProgressSummaryDto | null;
}

type Scope = { gardenId: number } & ({ plantingId: number } | { varietyId: number } | { cropKey?: string });

export class ProgressRepository {
  constructor(private readonly db: Sequelize) {}

  async summaries(gardenId: number, plantingIds: number[], day: string): Promise<Map<number, ProgressSummaryDto>> {
    if (!plantingIds.length) return new Map();
    const rows = await this.db.query<{ plantingId: number; summary: string }>(
      `SELECT planting_id AS plantingId, summary_json AS summary FROM planting_progress
        WHERE garden_id = ? AND computed_for = ? AND format = ? AND planting_id IN (?)`,
      { replacements: [gardenId, day, PROGRESS_FORMAT, plantingIds], type: QueryTypes.SELECT },
    );
    return new Map(rows.map((r) => [r.plantingId, JSON.parse(r.summary) as ProgressSummaryDto]));
  }

  /**
   * The planting's stored answer with the day it was made for and its garden's time zone, in one
   * query (the hot read); undefined when the garden has no such planting.
   */
  async body(gardenId: number, plantingId: number): Promise<{ timeZone: string; computedFor: string | null; body: string | null } | undefined> {
    const [row] = await this.db.query<{ timeZone: string; computedFor: string | null; body: string | null }>(
      `SELECT g.time_zone AS timeZone, pp.computed_for AS computedFor, pp.body_json AS body
         FROM plantings p
         JOIN gardens g ON g.id = p.garden_id
         LEFT JOIN planting_progress pp ON pp.planting_id = p.id AND pp.format = ?
        WHERE p.id = ? AND p.garden_id = ?`,
      { replacements: [PROGRESS_FORMAT, plantingId, gardenId], type: QueryTypes.SELECT },
    );
    return row;
  }

  /** The garden's growing plantings with what Today shows of them, and their stored summaries for `day` where present. */
  async growing(gardenId: number, day: string): Promise<GrowingRow[]> {
    const rows = await this.db.query<Omit<GrowingRow, 'summary' | 'recordedOn'> & { summary: string | null; recorded: string | null }>(
      `SELECT p.id AS plantingId, p.status, v.id AS varietyId, v.name AS varietyName, v.crop_key AS cropKey,
              b.id AS bedId, b.name AS bedName, pp.summary_json AS summary,
              DATE_FORMAT(p.first_harvest_on, '%Y-%m-%d') AS firstHarvestOn,
              DATE_FORMAT(GREATEST(COALESCE(p.sown_on, '1000-01-01'), COALESCE(p.emerged_on, '1000-01-01'), COALESCE(p.thinned_on, '1000-01-01'),
                COALESCE(p.transplanted_on, '1000-01-01'), COALESCE(p.last_harvest_on, '1000-01-01'), COALESCE(p.bolted_on, '1000-01-01'),
                COALESCE((SELECT MAX(l.entry_on) FROM planting_logs l WHERE l.planting_id = p.id), '1000-01-01')), '%Y-%m-%d') AS recorded
         FROM plantings p
         JOIN varieties v ON v.id = p.variety_id
         JOIN beds b ON b.id = p.bed_id
         LEFT JOIN planting_progress pp ON pp.planting_id = p.id AND pp.computed_for = ? AND pp.format = ?
        WHERE p.garden_id = ? AND p.status = 'growing'
        ORDER BY p.start_on, p.id`,
      { replacements: [day, PROGRESS_FORMAT, gardenId], type: QueryTypes.SELECT },
    );
    return rows.map(({ recorded, ...r }) => ({
      ...r,
      recordedOn: [recorded === '1000-01-01' ? null : recorded, r.firstHarvestOn],
      summary: r.summary === null ? null : (JSON.parse(r.summary) as ProgressSummaryDto),
    }));
  }

  /** Plantings of the garden with no row for `day` (missing or from an earlier day). */
  async stale(gardenId: number, day: string, where: { status?: string } = {}): Promise<number[]> {
    const rows = await this.db.query<{ id: number }>(
      `SELECT p.id FROM plantings p
         LEFT JOIN planting_progress pp ON pp.planting_id = p.id AND pp.computed_for = ? AND pp.format = ?
        WHERE p.garden_id = ? AND pp.planting_id IS NULL ${where.status ? 'AND p.status = ?' : ''}`,
      { replacements: where.status ? [day, PROGRESS_FORMAT, gardenId, where.status] : [day, PROGRESS_FORMAT, gardenId], type: QueryTypes.SELECT },
    );
    return rows.map((r) => r.id);
  }

  /** The garden's invalidation counter, noted before a computation reads anything. */
  async epoch(gardenId: number, transaction?: Transaction): Promise<number> {
    const [row] = await this.db.query<{ epoch: number }>('SELECT epoch FROM progress_epochs WHERE garden_id = ?', { replacements: [gardenId], type: QueryTypes.SELECT, transaction });
    return row?.epoch ?? 0;
  }

  /** Stores the answers unless the garden changed since `epoch` was noted; false when they were stale. */
  async save(gardenId: number, epoch: number, rows: ProgressRow[]): Promise<boolean> {
    if (!rows.length) return true;
    return inTransaction(this.db, async (transaction) => {
      const [row] = await this.db.query<{ epoch: number }>('SELECT epoch FROM progress_epochs WHERE garden_id = ? FOR UPDATE', {
        replacements: [gardenId],
        type: QueryTypes.SELECT,
        transaction,
      });
      if ((row?.epoch ?? 0) !== epoch) return false;
      // In slices: a garden's whole answer (5,000 plantings × ~8 kB) would outgrow one packet.
      for (let i = 0; i < rows.length; i += SAVE_SLICE) {
        const params = rows.slice(i, i + SAVE_SLICE).map((r) => [r.plantingId, r.gardenId, r.computedFor, r.percent, r.readyOn, r.boltRank, JSON.stringify(r.summary), r.body]);
        // Bound, not replaced: the connector escapes the bodies as it writes the packet, where
        // Sequelize's replacements would scan and copy every byte of them first.
        const values = params.map((p, k) => `(${p.map((_, j) => `$${k * p.length + j + 1}`).join(', ')}, UTC_TIMESTAMP(3), ${PROGRESS_FORMAT})`).join(', ');
        await this.db.query(
          `INSERT INTO planting_progress (planting_id, garden_id, computed_for, percent, ready_on, bolt_rank, summary_json, body_json, computed_at, format)
           VALUES ${values}
           ON DUPLICATE KEY UPDATE format = VALUES(format), computed_for = VALUES(computed_for), percent = VALUES(percent), ready_on = VALUES(ready_on),
             bolt_rank = VALUES(bolt_rank), summary_json = VALUES(summary_json), body_json = VALUES(body_json), computed_at = VALUES(computed_at)`,
          {
            bind: params.flat(),
            transaction,
          },
        );
      }
      return true;
    }).catch((err: unknown) => {
      // A change that kept deadlocking with this write wins: the answer is served, not stored.
      if (isRetryable(err)) return false;
      throw err;
    });
  }

  /** A change progress does not read (a bed's name, a log entry): cached reads go, stored progress stays. */
  async touch(gardenId: number, transaction?: Transaction) {
    await moveGardenRevisions(this.db, [gardenId], transaction);
  }

  /**
   * Drops the rows a change makes wrong and moves the garden's progress counter (a computation
   * that read the old inputs is not stored) and its revision, in the change's own transaction.
   */
  async invalidate(scope: Scope, transaction?: Transaction) {
    await this.db.query('INSERT INTO progress_epochs (garden_id, epoch) VALUES (?, 1) ON DUPLICATE KEY UPDATE epoch = epoch + 1', {
      replacements: [scope.gardenId],
      transaction,
    });
    await this.touch(scope.gardenId, transaction);
    if ('plantingId' in scope) {
      await this.db.query('DELETE FROM planting_progress WHERE planting_id = ?', { replacements: [scope.plantingId], transaction });
    } else if ('varietyId' in scope) {
      await this.db.query('DELETE pp FROM planting_progress pp JOIN plantings p ON p.id = pp.planting_id WHERE p.variety_id = ?', {
        replacements: [scope.varietyId],
        transaction,
      });
    } else if (scope.cropKey) {
      await this.db.query(
        `DELETE pp FROM planting_progress pp JOIN plantings p ON p.id = pp.planting_id JOIN varieties v ON v.id = p.variety_id
          WHERE pp.garden_id = ? AND v.crop_key = ?`,
        { replacements: [scope.gardenId, scope.cropKey], transaction },
      );
    } else {
      await this.db.query('DELETE FROM planting_progress WHERE garden_id = ?', { replacements: [scope.gardenId], transaction });
    }
  }
}
