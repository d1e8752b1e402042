/** Alerts by their natural key (garden, subject, type, first date); raw SQL for the upserts. */
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import { ALERT_LIST_MAX } from '#shared/schemas/alerts';
import type { AlertListQuery, AlertSeverity, AlertStatus, AlertType } from '#shared/schemas/alerts';
import type { AlertCandidate } from './alert-rules';
import { inTransaction } from '../../lib/transaction';

export interface AlertRow {
  id: number;
  gardenId: number;
  plantingId: number | null;
  subjectKey: string;
  type: AlertType;
  firstOn: string;
  endsOn: string | null;
  severity: AlertSeverity;
  status: AlertStatus;
  subject: string;
  title: string;
  reasonsJson: string;
  action: string;
  caution: string | null;
  createdAt: Date;
  updatedAt: Date;
  acknowledgedAt: Date | null;
  acknowledgedBy: string | null;
  resolvedAt: Date | null;
}

const COLUMNS = `a.id, a.garden_id AS gardenId, a.planting_id AS plantingId, a.subject_key AS subjectKey, a.type,
  a.first_on AS firstOn, a.ends_on AS endsOn, a.severity, a.status, a.subject, a.title, a.reasons_json AS reasonsJson,
  a.action, a.caution, a.created_at AS createdAt, a.updated_at AS updatedAt, a.acknowledged_at AS acknowledgedAt,
  u.name AS acknowledgedBy, a.resolved_at AS resolvedAt`;

export const subjectKey = (c: Pick<AlertCandidate, 'plantingId'>) => (c.plantingId === null ? 'garden' : `p${c.plantingId}`);
export const naturalKey = (c: { subjectKey: string; type: string; firstOn: string }) => `${c.subjectKey}|${c.type}|${c.firstOn}`;

export class AlertsRepository {
  constructor(private readonly db: Sequelize) {}

  /** The garden's evaluation row, locked: one evaluation of a garden at a time, on any instance. */
  async lockGarden(gardenId: number, transaction: Transaction) {
    await this.db.query(
      `INSERT INTO alert_evaluations (garden_id, evaluated_for, evaluated_at) VALUES (?, '1970-01-01', UTC_TIMESTAMP(3))
       ON DUPLICATE KEY UPDATE garden_id = garden_id`,
      { replacements: [gardenId], transaction },
    );
    await this.db.query('SELECT garden_id FROM alert_evaluations WHERE garden_id = ? FOR UPDATE', { replacements: [gardenId], transaction });
  }

  /** The garden's alerts, current and past, under the garden's evaluation lock. */
  async forEvaluation(gardenId: number, transaction: Transaction): Promise<AlertRow[]> {
    return this.db.query<AlertRow>(`SELECT ${COLUMNS} FROM alerts a LEFT JOIN users u ON u.id = a.acknowledged_by WHERE a.garden_id = ? FOR UPDATE`, {
      replacements: [gardenId],
      type: QueryTypes.SELECT,
      transaction,
    });
  }

  /**
   * Inserts the new candidates in one statement, skipping any natural key a concurrent evaluation
   * got to first; returns the ids of the rows this call created (created_at is this statement's).
   */
  async insertMany(gardenId: number, list: AlertCandidate[], transaction: Transaction): Promise<number[]> {
    if (!list.length) return [];
    const [[{ stamp }]] = (await this.db.query('SELECT UTC_TIMESTAMP(3) AS stamp', { transaction })) as [Array<{ stamp: Date }>, unknown];
    await this.db.query(
      `INSERT IGNORE INTO alerts (garden_id, planting_id, subject_key, type, first_on, ends_on, severity, status, subject, title, reasons_json, action, caution, created_at, updated_at)
       VALUES ${list.map(() => "(?, ?, ?, ?, ?, ?, ?, 'open', ?, ?, ?, ?, ?, ?, ?)").join(', ')}`,
      {
        replacements: list.flatMap((c) => [gardenId, c.plantingId, subjectKey(c), c.type, c.firstOn, c.endsOn, c.severity, c.subject, c.title, JSON.stringify(c.reasons), c.action, c.caution, stamp, stamp]),
        transaction,
      },
    );
    const rows = await this.db.query<{ id: number }>('SELECT id FROM alerts WHERE garden_id = ? AND created_at = ?', {
      replacements: [gardenId, stamp],
      type: QueryTypes.SELECT,
      transaction,
    });
    return rows.map((r) => r.id);
  }

  /** New figures for a current alert; a resolved one whose condition is back opens again. */
  async update(id: number, c: AlertCandidate, transaction: Transaction) {
    await this.db.query(
      `UPDATE alerts SET ends_on = ?, severity = ?, subject = ?, title = ?, reasons_json = ?, action = ?, caution = ?,
         acknowledged_at = IF(status = 'resolved', NULL, acknowledged_at), acknowledged_by = IF(status = 'resolved', NULL, acknowledged_by),
         resolved_at = NULL, status = IF(status = 'resolved', 'open', status), updated_at = UTC_TIMESTAMP(3)
       WHERE id = ?`,
      { replacements: [c.endsOn, c.severity, c.subject, c.title, JSON.stringify(c.reasons), c.action, c.caution, id], transaction },
    );
  }

  async resolve(ids: number[], transaction: Transaction) {
    if (!ids.length) return;
    await this.db.query("UPDATE alerts SET status = 'resolved', resolved_at = UTC_TIMESTAMP(3), updated_at = UTC_TIMESTAMP(3) WHERE id IN (?) AND status <> 'resolved'", {
      replacements: [ids],
      transaction,
    });
  }

  async markEvaluated(gardenId: number, day: string, transaction: Transaction) {
    await this.db.query(
      `INSERT INTO alert_evaluations (garden_id, evaluated_for, evaluated_at, revision) VALUES (?, ?, UTC_TIMESTAMP(3), 1)
       ON DUPLICATE KEY UPDATE evaluated_for = VALUES(evaluated_for), evaluated_at = VALUES(evaluated_at), revision = revision + 1`,
      { replacements: [gardenId, day], transaction },
    );
  }

  async evaluatedFor(gardenId: number): Promise<string | null> {
    const [row] = await this.db.query<{ day: string }>('SELECT evaluated_for AS day FROM alert_evaluations WHERE garden_id = ?', { replacements: [gardenId], type: QueryTypes.SELECT });
    return row?.day ?? null;
  }

  async list(gardenId: number, q: AlertListQuery): Promise<AlertRow[]> {
    const where = ['a.garden_id = ?'];
    const replacements: unknown[] = [gardenId];
    if (q.status) {
      where.push('a.status = ?');
      replacements.push(q.status);
    }
    if (q.type) {
      where.push('a.type = ?');
      replacements.push(q.type);
    }
    return this.db.query<AlertRow>(
      `SELECT ${COLUMNS} FROM alerts a LEFT JOIN users u ON u.id = a.acknowledged_by WHERE ${where.join(' AND ')}
        ORDER BY FIELD(a.status, 'open', 'acknowledged', 'resolved'), FIELD(a.severity, 'severe', 'warning', 'watch', 'info'), a.first_on, a.id DESC
        LIMIT ?`,
      { replacements: [...replacements, Math.min(q.limit ?? ALERT_LIST_MAX, ALERT_LIST_MAX)], type: QueryTypes.SELECT },
    );
  }

  async counts(gardenId: number): Promise<Array<{ type: AlertType; n: number }>> {
    return this.db.query<{ type: AlertType; n: number }>("SELECT type, COUNT(*) AS n FROM alerts WHERE garden_id = ? AND status = 'open' GROUP BY type", {
      replacements: [gardenId],
      type: QueryTypes.SELECT,
    });
  }

  async one(gardenId: number, id: number): Promise<AlertRow | null> {
    const [row] = await this.db.query<AlertRow>(`SELECT ${COLUMNS} FROM alerts a LEFT JOIN users u ON u.id = a.acknowledged_by WHERE a.garden_id = ? AND a.id = ?`, {
      replacements: [gardenId, id],
      type: QueryTypes.SELECT,
    });
    return row ?? null;
  }

  async acknowledge(gardenId: number, id: number, userId: number) {
    await inTransaction(this.db, async (transaction) => {
      const [, changed] = await this.db.query(
        "UPDATE alerts SET status = 'acknowledged', acknowledged_at = UTC_TIMESTAMP(3), acknowledged_by = ?, updated_at = UTC_TIMESTAMP(3) WHERE garden_id = ? AND id = ? AND status = 'open'",
        { replacements: [userId, gardenId, id], type: QueryTypes.UPDATE, transaction },
      );
      if (!changed) return;
      // The evaluation row exists once the garden has alerts; its revision tells cached reads.
      await this.db.query('UPDATE alert_evaluations SET revision = revision + 1 WHERE garden_id = ?', { replacements: [gardenId], transaction });
    });
  }
}
