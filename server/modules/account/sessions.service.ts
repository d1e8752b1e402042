/**
 * The account's own signed-in browsers. A session is named to the client by a prefix of the
 * SHA-256 of its id, never the id itself (which is the cookie's secret).
 */
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { AccountSessionDto } from '#shared/schemas/account';
import { AppError } from '../../errors';
import type { SqlSessionStore } from '../auth/session-store';
import { deviceOf } from './device';

export const publicSessionId = (sid: string) => createHash('sha256').update(sid).digest('base64url').slice(0, 16);

interface SessionRow {
  sid: string;
  userAgent: string | null;
  lastSeenAt: Date | string | null;
  createdAt: Date | string;
}

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

async function liveSessions(db: Sequelize, userId: number): Promise<SessionRow[]> {
  return db.query<SessionRow>(
    `SELECT sid, user_agent AS userAgent, last_seen_at AS lastSeenAt, created_at AS createdAt
       FROM sessions WHERE user_id = ? AND expires > ? ORDER BY COALESCE(last_seen_at, created_at) DESC, created_at DESC LIMIT 200`,
    { replacements: [userId, new Date()], type: QueryTypes.SELECT },
  );
}

/** This device first, then the most recently seen. */
export async function listSessions(db: Sequelize, userId: number, currentSid: string): Promise<AccountSessionDto[]> {
  const items = (await liveSessions(db, userId)).map((s) => ({
    id: publicSessionId(s.sid),
    device: deviceOf(s.userAgent),
    signedInAt: iso(s.createdAt),
    lastSeenAt: iso(s.lastSeenAt ?? s.createdAt),
    current: s.sid === currentSid,
  }));
  return [...items.filter((s) => s.current), ...items.filter((s) => !s.current)];
}

export async function endSession(db: Sequelize, store: SqlSessionStore, userId: number, id: string): Promise<void> {
  const found = (await liveSessions(db, userId)).find((s) => publicSessionId(s.sid) === id);
  if (!found || !(await store.endOne(userId, found.sid))) {
    throw AppError.notFound('That signed-in device');
  }
}
