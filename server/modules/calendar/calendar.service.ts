/**
 * The private calendar feed: one link per user (calendar-token.ts), and the iCalendar text it
 * serves — for every garden the user is a member of, each planned or growing planting's likely
 * harvest window (p10…p90 of the stored progress summaries) and each open alert, as all-day
 * events on the garden's own calendar days.
 *
 * SEQUENCE: `calendar_event_versions` keeps, per user and UID, the SHA-256 of what the feed last
 * said about the event (dates, title, description). Serving the feed upserts every event's hash in
 * one statement; a different hash raises SEQUENCE by one and moves the event's DTSTAMP, so
 * calendar apps replace the event they hold. Unchanged events keep both.
 */
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import ical, { ICalEventTransparency } from 'ical-generator';
import { findCrop } from '#shared/crops/library';
import { DEFAULT_LOCALE, resolveDates } from '#shared/format/dates';
import { addDays } from '#shared/thermal/dates';
import type { CalendarFeedDto } from '#shared/schemas/calendar';
import { AppError } from '../../errors';
import { localDate } from '../../lib/local-date';
import type { AlertService } from '../alerts/alerts.service';
import type { ProgressService } from '../progress/progress.service';
import { isTokenShape, newToken, openToken, sealToken, tokenHash } from './calendar-token';

export interface CalendarDeps {
  sequelize: Sequelize;
  progress: ProgressService;
  alerts: AlertService;
  appUrl: string;
  secret: string;
}

/** One all-day event; `last` is the last day it covers (DTEND is the day after). */
export interface FeedEvent {
  uid: string;
  first: string;
  last: string;
  summary: string;
  description: string;
}

interface FeedRow {
  tokenSealed: string;
  createdAt: Date | string;
}

const iso = (d: Date | string) => new Date(d).toISOString();
const dayDate = (day: string) => new Date(`${day}T00:00:00Z`);

export const plantingUid = (plantingId: number) => `planting-${plantingId}-harvest@heatclock`;
export const alertUid = (alertId: number) => `alert-${alertId}@heatclock`;

export class CalendarService {
  constructor(private readonly deps: CalendarDeps) {}

  private urlOf(token: string) {
    return `${this.deps.appUrl}/api/calendar/${token}.ics`;
  }

  private async row(userId: number): Promise<FeedRow | undefined> {
    const [row] = await this.deps.sequelize.query<FeedRow>('SELECT token_sealed AS tokenSealed, created_at AS createdAt FROM calendar_feeds WHERE user_id = ?', {
      replacements: [userId],
      type: QueryTypes.SELECT,
    });
    return row;
  }

  private present(row: FeedRow): CalendarFeedDto {
    const token = openToken(row.tokenSealed, this.deps.secret);
    return { url: token ? this.urlOf(token) : null, createdAt: iso(row.createdAt) };
  }

  /** The user's link, made on the first call (two first calls at once make one link). */
  async getOrCreate(userId: number): Promise<{ feed: CalendarFeedDto; created: boolean }> {
    const existing = await this.row(userId);
    if (existing) return { feed: this.present(existing), created: false };
    const token = newToken();
    const [, inserted] = await this.deps.sequelize.query(
      'INSERT IGNORE INTO calendar_feeds (user_id, token_hash, token_sealed, created_at) VALUES (?, ?, ?, UTC_TIMESTAMP(3))',
      { replacements: [userId, tokenHash(token), sealToken(token, this.deps.secret)], type: QueryTypes.INSERT },
    );
    return { feed: this.present((await this.row(userId))!), created: Number(inserted) > 0 };
  }

  /** A new link; the old one stops working at once. */
  async rotate(userId: number): Promise<CalendarFeedDto> {
    const token = newToken();
    await this.deps.sequelize.query(
      `INSERT INTO calendar_feeds (user_id, token_hash, token_sealed, created_at) VALUES (?, ?, ?, UTC_TIMESTAMP(3))
       ON DUPLICATE KEY UPDATE token_hash = VALUES(token_hash), token_sealed = VALUES(token_sealed), created_at = VALUES(created_at)`,
      { replacements: [userId, tokenHash(token), sealToken(token, this.deps.secret)] },
    );
    return this.present((await this.row(userId))!);
  }

  async revoke(userId: number): Promise<void> {
    await this.deps.sequelize.query('DELETE FROM calendar_feeds WHERE user_id = ?', { replacements: [userId] });
  }

  /** The user a token opens the feed of; 404 for anything else (malformed, revoked, replaced). */
  async userOf(token: string): Promise<number> {
    if (!isTokenShape(token)) throw AppError.notFound('That calendar');
    const [row] = await this.deps.sequelize.query<{ userId: number }>('SELECT user_id AS userId FROM calendar_feeds WHERE token_hash = ?', {
      replacements: [tokenHash(token)],
      type: QueryTypes.SELECT,
    });
    if (!row) throw AppError.notFound('That calendar');
    return row.userId;
  }

  /** Every event of the user's gardens, worded in DEFAULT_LOCALE. */
  async events(userId: number): Promise<FeedEvent[]> {
    const { sequelize, progress, alerts } = this.deps;
    const gardens = await sequelize.query<{ id: number; name: string; timeZone: string }>(
      `SELECT g.id, g.name, g.time_zone AS timeZone FROM memberships m JOIN gardens g ON g.id = m.garden_id WHERE m.user_id = ? ORDER BY g.id`,
      { replacements: [userId], type: QueryTypes.SELECT },
    );
    const out: FeedEvent[] = [];
    for (const garden of gardens) {
      const today = localDate(garden.timeZone, progress.now());
      const words = (text: string) => resolveDates(text, DEFAULT_LOCALE, today);
      const plantings = await sequelize.query<{ id: number; status: string; varietyName: string; cropKey: string; bedName: string }>(
        `SELECT p.id, p.status, v.name AS varietyName, v.crop_key AS cropKey, b.name AS bedName
           FROM plantings p JOIN varieties v ON v.id = p.variety_id JOIN beds b ON b.id = p.bed_id
          WHERE p.garden_id = ? AND p.status IN ('planned', 'growing')
          ORDER BY p.start_on, p.id`,
        { replacements: [garden.id], type: QueryTypes.SELECT },
      );
      const summaries = await progress.summaries(
        garden.id,
        plantings.map((p) => p.id),
      );
      for (const p of plantings) {
        const s = summaries.get(p.id);
        if (!s?.maturity.p10 || !s.maturity.p90) continue;
        const crop = findCrop(p.cropKey)?.name ?? p.cropKey;
        out.push({
          uid: plantingUid(p.id),
          first: s.maturity.p10,
          last: s.maturity.p90,
          summary: `${p.status === 'planned' ? 'Likely harvest (planned)' : 'Likely harvest'}: ${crop}: ${p.varietyName}, ${p.bedName}, ${garden.name}`,
          description: words(s.summary),
        });
      }
      await alerts.ensureEvaluated(garden.id);
      for (const a of await alerts.list(garden.id, { status: 'open' })) {
        const where = a.subject === garden.name ? garden.name : `${words(a.subject)}, ${garden.name}`;
        out.push({
          uid: alertUid(a.id),
          first: a.startsOn,
          last: a.endsOn ?? a.startsOn,
          summary: `${words(a.title)}: ${where}`,
          description: [...a.reasons.map(words), words(a.action), ...(a.caution ? [words(a.caution)] : [])].join('\n'),
        });
      }
    }
    return out;
  }

  /** Stores each event's content hash; returns SEQUENCE and DTSTAMP per UID. */
  async versions(userId: number, events: FeedEvent[]): Promise<Map<string, { sequence: number; changedAt: Date }>> {
    if (!events.length) return new Map();
    const { sequelize } = this.deps;
    const hash = (e: FeedEvent) => createHash('sha256').update(JSON.stringify([e.first, e.last, e.summary, e.description])).digest('hex');
    // Assignments run left to right: sequence and changed_at compare against the old hash first.
    await sequelize.query(
      `INSERT INTO calendar_event_versions (user_id, uid, content_hash, sequence, changed_at)
       VALUES ${events.map(() => '(?, ?, ?, 0, UTC_TIMESTAMP(3))').join(', ')}
       ON DUPLICATE KEY UPDATE
         sequence = IF(content_hash = VALUES(content_hash), sequence, sequence + 1),
         changed_at = IF(content_hash = VALUES(content_hash), changed_at, VALUES(changed_at)),
         content_hash = VALUES(content_hash)`,
      { replacements: events.flatMap((e) => [userId, e.uid, hash(e)]) },
    );
    const rows = await sequelize.query<{ uid: string; sequence: number; changedAt: Date }>(
      'SELECT uid, sequence, changed_at AS changedAt FROM calendar_event_versions WHERE user_id = ? AND uid IN (?)',
      { replacements: [userId, events.map((e) => e.uid)], type: QueryTypes.SELECT },
    );
    return new Map(rows.map((r) => [r.uid, { sequence: Number(r.sequence), changedAt: new Date(r.changedAt) }]));
  }

  /** The iCalendar text (RFC 5545) the token opens. */
  async feed(token: string): Promise<string> {
    const userId = await this.userOf(token);
    const events = await this.events(userId);
    const versions = await this.versions(userId, events);
    const cal = ical({
      name: 'Heatclock harvest dates',
      description: 'Likely harvest windows and open alerts from your Heatclock gardens.',
      prodId: { company: 'Heatclock', product: 'Heatclock harvest calendar', language: 'EN' },
      // No METHOD: DTSTAMP then means when the event's information last changed (RFC 5545 3.8.7.2).
      ttl: 60 * 60 * 3,
    });
    for (const e of events) {
      const v = versions.get(e.uid) ?? { sequence: 0, changedAt: new Date() };
      cal.createEvent({
        id: e.uid,
        allDay: true,
        start: dayDate(e.first),
        end: dayDate(addDays(e.last, 1)),
        summary: e.summary,
        description: e.description,
        sequence: v.sequence,
        stamp: v.changedAt,
        lastModified: v.changedAt,
        // Harvest days and alerts do not make the grower busy.
        transparency: ICalEventTransparency.TRANSPARENT,
      });
    }
    return cal.toString();
  }
}
