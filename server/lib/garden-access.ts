/**
 * What a garden request needs to know before its handler runs: the member's role, the garden's
 * facts and its change counters. Read on every request (a demotion applies at once), either in
 * the session read itself (one round trip: session-store.ts joins this onto the session row for
 * /api/gardens/:id/… paths) or, when that was not possible, on its own.
 */
import { AsyncLocalStorage } from 'node:async_hooks';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { DisplayUnit, Role } from '#shared/schemas/gardens';

export interface AccessRow {
  role: Role;
  gardenName: string;
  timeZone: string;
  units: DisplayUnit;
  latitude: number | null;
  weatherCellId: number | null;
  revision: number | null;
  alerts: number | null;
}

/** Columns of the garden, the role and the counters; `m` is the member's membership row. */
export const ACCESS_COLUMNS =
  'm.role, g.name AS gardenName, g.time_zone AS timeZone, g.units, g.latitude, g.weather_cell_id AS weatherCellId, gr.revision, ae.revision AS alerts';

/** Joins from a membership row `m` to what ACCESS_COLUMNS reads. */
export const ACCESS_JOINS = `JOIN gardens g ON g.id = m.garden_id
  LEFT JOIN garden_revisions gr ON gr.garden_id = m.garden_id
  LEFT JOIN alert_evaluations ae ON ae.garden_id = m.garden_id`;

export async function readAccess(db: Sequelize, userId: number, gardenId: number): Promise<AccessRow | null> {
  const [row] = await db.query<AccessRow>(`SELECT ${ACCESS_COLUMNS} FROM memberships m ${ACCESS_JOINS} WHERE m.user_id = ? AND m.garden_id = ?`, {
    replacements: [userId, gardenId],
    type: QueryTypes.SELECT,
  });
  return row ?? null;
}

/** The garden id of a garden API path, or null. */
export function gardenIdOfPath(path: string): number | null {
  const m = /^\/api\/gardens\/([1-9]\d{0,9})(?:\/|$)/.exec(path);
  const id = m ? Number(m[1]) : NaN;
  return Number.isSafeInteger(id) && id <= 2_147_483_647 ? id : null;
}

/**
 * Per request: the garden the path names, and what the session read found of the user's access
 * to it (`access`, for `userId`). Set by `gardenAccessContext` before the session is read.
 */
export interface AccessContext {
  gardenId: number | null;
  userId?: number;
  access?: AccessRow | null;
}

export const accessContext = new AsyncLocalStorage<AccessContext>();
