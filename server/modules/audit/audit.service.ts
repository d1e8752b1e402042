/** Reading a garden's audit trail: newest first, one page at a time, through the (garden_id, id) indexes. */
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { z } from 'zod';
import type { auditListQuerySchema, AuditActorDto } from '#shared/schemas/audit';
import { limitOffset } from '../records/paging';

type AuditListQuery = z.output<typeof auditListQuerySchema>;

export interface AuditRow {
  id: number | bigint | string;
  garden_id: number;
  actor_user_id: number | null;
  actor_name: string;
  entity: string;
  entity_id: string | null;
  action: string;
  summary: string;
  changes: string;
  created_at: Date;
}

/** The UTC instant a garden-local calendar day starts (the zone's offset read at that instant, checked once more across a shift). */
export function startOfLocalDay(timeZone: string, day: string): Date {
  const [y, m, d] = day.split('-').map(Number);
  const midnightUtc = Date.UTC(y, m - 1, d);
  const offsetAt = (t: number) => {
    const parts = Object.fromEntries(
      new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit' })
        .formatToParts(new Date(t))
        .map((p) => [p.type, p.value]),
    );
    return Date.UTC(+parts.year, +parts.month - 1, +parts.day, +parts.hour, +parts.minute, +parts.second) - t;
  };
  const first = midnightUtc - offsetAt(midnightUtc);
  return new Date(midnightUtc - offsetAt(first));
}

function nextDay(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + 1)).toISOString().slice(0, 10);
}

export async function listAudit(db: Sequelize, gardenId: number, timeZone: string, q: AuditListQuery) {
  const where = ['garden_id = ?'];
  const args: unknown[] = [gardenId];
  if (q.entity) {
    where.push('entity = ?');
    args.push(q.entity);
  }
  if (q.actor !== undefined) {
    where.push('actor_user_id = ?');
    args.push(q.actor);
  }
  // From and To are the garden's own calendar days, both included.
  if (q.from) {
    where.push('created_at >= ?');
    args.push(startOfLocalDay(timeZone, q.from));
  }
  if (q.to) {
    where.push('created_at < ?');
    args.push(startOfLocalDay(timeZone, nextDay(q.to)));
  }
  const sql = where.join(' AND ');
  const { limit, offset } = limitOffset(q);
  const [rows, [{ total }], actors] = await Promise.all([
    db.query<AuditRow>(`SELECT * FROM audit_entries WHERE ${sql} ORDER BY id DESC LIMIT ? OFFSET ?`, { replacements: [...args, limit, offset], type: QueryTypes.SELECT }),
    db.query<{ total: number | bigint }>(`SELECT COUNT(*) AS total FROM audit_entries WHERE ${sql}`, { replacements: args, type: QueryTypes.SELECT }),
    db.query<AuditActorDto>(
      `SELECT actor_user_id AS id, MAX(actor_name) AS name FROM audit_entries WHERE garden_id = ? AND actor_user_id IS NOT NULL GROUP BY actor_user_id ORDER BY name, id`,
      { replacements: [gardenId], type: QueryTypes.SELECT },
    ),
  ]);
  return { rows, total: Number(total), actors: actors.map((a) => ({ id: Number(a.id), name: a.name })) };
}
