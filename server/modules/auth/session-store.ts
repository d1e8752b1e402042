/**
 * The session store: rows in MariaDB (never in memory), read with one primary-key query that
 * also brings the signed-in user, written only when the session changed or its expiry has to move.
 *
 * Why our own and not connect-session-sequelize: that store built a model instance per read, did
 * not check `expires` on read, and rewrote the row on every request (express-session touches with
 * `rolling`). Here a plain read costs one SELECT; the expiry is pushed forward at most every
 * TOUCH_EVERY_MS, so a session idle for the whole idle time expires within that margin of the
 * cookie. Nothing about validity is cached between requests: a session deleted on any instance
 * (sign-out, revocation) is refused on the very next request everywhere.
 */
import session from 'express-session';
import type { SessionData } from 'express-session';
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';
import type { UserDto } from '#shared/schemas/auth';
import { accessContext, ACCESS_COLUMNS, ACCESS_JOINS } from '../../lib/garden-access';
import type { AccessRow } from '../../lib/garden-access';

/** The expiry is written again only once it would move by more than this. */
export const TOUCH_EVERY_MS = 5 * 60_000;

interface Loaded {
  expiresMs: number;
  user: UserDto | null;
}

type Callback<T = void> = (err?: unknown, value?: T) => void;

interface Row {
  data: string | null;
  expires: Date | string;
  userId: number | null;
  email: string | null;
  name: string | null;
}

/** Bounds the hand-over from `get` to `touch`/`userFor` when a request never gets that far. */
const MAX_HANDOVERS = 10_000;

export class SqlSessionStore extends session.Store {
  /**
   * What the latest read of each session found: its stored expiry and user, handed to the same
   * request's touch and deserialisation. Not a cache of validity: every request reads its session
   * row first, and a session that is gone is refused whatever this map holds.
   */
  private readonly loaded = new Map<string, Loaded>();
  private sweeper: NodeJS.Timeout | null = null;

  constructor(
    private readonly db: Sequelize,
    opts: { sweepEveryMs?: number } = {},
  ) {
    super();
    if (opts.sweepEveryMs) {
      this.sweeper = setInterval(() => void this.sweep().catch(() => undefined), opts.sweepEveryMs);
      this.sweeper.unref();
    }
  }

  override get(sid: string, cb: Callback<SessionData | null>) {
    // On a garden's path, the member's access to it comes in the same read (garden-access.ts).
    const ctx = accessContext.getStore();
    const gardenId = ctx?.gardenId ?? null;
    const access = gardenId ? `, m.user_id AS memberId, ${ACCESS_COLUMNS}` : '';
    const joins = gardenId ? `LEFT JOIN (memberships m ${ACCESS_JOINS}) ON m.user_id = s.user_id AND m.garden_id = ?` : '';
    this.db
      .query<Row & Partial<AccessRow> & { memberId?: number | null }>(
        `SELECT s.data, s.expires, u.id AS userId, u.email, u.name${access}
           FROM sessions s LEFT JOIN users u ON u.id = s.user_id ${joins}
          WHERE s.sid = ? AND s.expires > ?`,
        { replacements: gardenId ? [gardenId, sid, new Date()] : [sid, new Date()], type: QueryTypes.SELECT },
      )
      .then(([row]) => {
        if (ctx && gardenId && row?.userId != null) {
          const { memberId, role, gardenName, timeZone, units, latitude, weatherCellId, revision, alerts } = row;
          ctx.userId = row.userId;
          ctx.access =
            memberId == null
              ? null
              : { role: role!, gardenName: gardenName!, timeZone: timeZone!, units: units!, latitude: latitude ?? null, weatherCellId: weatherCellId ?? null, revision: revision ?? null, alerts: alerts ?? null };
        }
        if (!row?.data) {
          this.loaded.delete(sid);
          return cb(null, null);
        }
        const user = row.userId === null ? null : { id: row.userId, email: row.email!, name: row.name! };
        // Least recently read first: re-inserting keeps the map in that order.
        this.loaded.delete(sid);
        this.loaded.set(sid, { expiresMs: new Date(row.expires).getTime(), user });
        if (this.loaded.size > MAX_HANDOVERS) this.loaded.delete(this.loaded.keys().next().value!);
        cb(null, JSON.parse(row.data) as SessionData);
      })
      .catch((err: unknown) => cb(err));
  }

  override set(sid: string, sess: SessionData, cb?: Callback) {
    const expires = expiryOf(sess);
    const now = new Date();
    // A row already ended (expired, or revoked by endAllFor) stays ended: a request that loaded the
    // session before it was revoked cannot write it back to life. `expires` is assigned last, as
    // MariaDB evaluates the assignments in order.
    this.db
      .query(
        `INSERT INTO sessions (sid, user_id, expires, data, user_agent, last_seen_at, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)
         ON DUPLICATE KEY UPDATE user_id = IF(expires > ?, VALUES(user_id), user_id), data = IF(expires > ?, VALUES(data), data),
           user_agent = IF(expires > ?, VALUES(user_agent), user_agent), last_seen_at = VALUES(last_seen_at),
           updated_at = VALUES(updated_at), expires = IF(expires > ?, VALUES(expires), expires)`,
        { replacements: [sid, sess.passport?.user ?? null, expires, JSON.stringify(sess), sess.userAgent ?? null, now, now, now, now, now, now, now] },
      )
      .then(() => {
        this.loaded.delete(sid);
        cb?.();
      })
      .catch((err: unknown) => cb?.(err));
  }

  /**
   * Moves the expiry only when it would move by more than TOUCH_EVERY_MS; never revives a removed row.
   * The session list's "last seen" rides on this write, so it is true to within TOUCH_EVERY_MS.
   */
  override touch(sid: string, sess: SessionData, cb?: Callback) {
    const expires = expiryOf(sess);
    const found = this.loaded.get(sid);
    if (found && expires.getTime() - found.expiresMs < TOUCH_EVERY_MS) return cb?.();
    this.db
      .query('UPDATE sessions SET expires = ?, updated_at = ?, last_seen_at = ? WHERE sid = ? AND expires < ? AND expires > ?', {
        replacements: [expires, new Date(), new Date(), sid, new Date(expires.getTime() - TOUCH_EVERY_MS), new Date()],
      })
      .then(() => {
        // Concurrent requests of the same session need not write it again.
        if (found) found.expiresMs = Math.max(found.expiresMs, expires.getTime());
        cb?.();
      })
      .catch((err: unknown) => cb?.(err));
  }

  override destroy(sid: string, cb?: Callback) {
    this.loaded.delete(sid);
    this.db
      .query('DELETE FROM sessions WHERE sid = ?', { replacements: [sid] })
      .then(() => cb?.())
      .catch((err: unknown) => cb?.(err));
  }

  /**
   * The user this session's latest read found, when it is the one passport asks for (null when
   * that user is gone); undefined when there is no such read to hand over, and the caller looks
   * the user up itself.
   */
  userFor(sid: string, userId: number): UserDto | null | undefined {
    const found = this.loaded.get(sid);
    if (!found || found.user?.id !== userId) return undefined;
    return found.user;
  }

  /** Ends every session of a user (optionally but one), on every instance at once. */
  async endAllFor(userId: number, exceptSid?: string, transaction?: Transaction): Promise<number> {
    return endSessionsOf(this.db, userId, exceptSid, transaction);
  }

  /** Ends one session of a user (not a delete: see `set`, a request still running must not write it back). */
  async endOne(userId: number, sid: string): Promise<number> {
    const [, removed] = await this.db.query('UPDATE sessions SET expires = ? WHERE user_id = ? AND sid = ? AND expires > ?', {
      replacements: [new Date(0), userId, sid, new Date()],
      type: QueryTypes.UPDATE,
    });
    this.loaded.delete(sid);
    return removed;
  }

  /** Removes expired rows (reads already ignore them). */
  async sweep(): Promise<void> {
    await this.db.query('DELETE FROM sessions WHERE expires <= ?', { replacements: [new Date()] });
  }

  close() {
    if (this.sweeper) clearInterval(this.sweeper);
    this.sweeper = null;
  }
}

function expiryOf(sess: SessionData): Date {
  const e = sess.cookie?.expires;
  return e ? new Date(e) : new Date(Date.now() + (sess.cookie?.originalMaxAge ?? 0));
}

/**
 * Ends every session of a user (optionally but one) by expiring it in place: refused at once on
 * every instance, swept later, and a request still running cannot write it back (see `set`).
 */
export async function endSessionsOf(db: Sequelize, userId: number, exceptSid?: string, transaction?: Transaction): Promise<number> {
  const [, removed] = await db.query(`UPDATE sessions SET expires = ? WHERE user_id = ?${exceptSid ? ' AND sid <> ?' : ''}`, {
    replacements: exceptSid ? [new Date(0), userId, exceptSid] : [new Date(0), userId],
    type: QueryTypes.UPDATE,
    transaction,
  });
  return removed;
}
