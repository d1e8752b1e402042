import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { localDate } from '../../lib/local-date';
import { inTransaction } from '../../lib/transaction';
import { PREF_COLUMNS, withDefaults } from './preferences.repository';
import type { PreferenceRow } from './preferences.repository';
import { renderDigest } from './mail-content';
import { contextFor, queueMessage, readAlerts } from './outbox';
import type { Recipient, StoredAlert } from './outbox';

const hourFormats = new Map<string, Intl.DateTimeFormat>();

function localHour(timeZone: string, now: Date): number {
  let f = hourFormats.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', { timeZone, hour: 'numeric', hourCycle: 'h23' });
    hourFormats.set(timeZone, f);
  }
  return Number(f.formatToParts(now).find((p) => p.type === 'hour')!.value);
}

type Candidate = Recipient & PreferenceRow & { gardenId: number; gardenName: string; timeZone: string };

/**
 * Queues one daily summary per member and garden whose digest hour (in the garden's time zone)
 * is the hour of `now`, listing the garden's open alerts of the member's types; nothing when
 * there are none. Keyed by member, garden and local date, so a second run that day (another
 * instance, a restart) adds nothing. Members without a stored preference get the default digest.
 * `onlyGardens` limits it to some gardens (the demo, tests sharing a database); `anyHour` queues
 * today's digest whatever the hour, so a freshly seeded demo has one in its mailbox at once.
 */
export async function enqueueDigests(sequelize: Sequelize, now: Date, opts: { onlyGardens?: number[]; anyHour?: boolean } = {}): Promise<number> {
  if (opts.onlyGardens?.length === 0) return 0;
  const members = await sequelize.query<Candidate>(
    `SELECT u.id AS userId, u.email, u.name, g.id AS gardenId, g.name AS gardenName, g.time_zone AS timeZone, ${PREF_COLUMNS}
       FROM memberships m JOIN users u ON u.id = m.user_id JOIN gardens g ON g.id = m.garden_id
       LEFT JOIN notification_preferences p ON p.user_id = m.user_id AND p.garden_id = m.garden_id
      WHERE (p.delivery IS NULL OR p.delivery = 'digest') ${opts.onlyGardens ? 'AND m.garden_id IN (?)' : ''}`,
    { replacements: opts.onlyGardens ? [opts.onlyGardens] : [], type: QueryTypes.SELECT },
  );
  const due = members
    .map((m) => ({ m, pref: withDefaults(m.userId, m.gardenId, m) }))
    .filter(({ m, pref }) => opts.anyHour || localHour(m.timeZone, now) === pref.digestHour);
  if (!due.length) return 0;
  const open = new Map<number, StoredAlert[]>();
  for (const { gardenId, alert } of await readAlerts(sequelize, [...new Set(due.map((d) => d.m.gardenId))], null)) {
    if (!open.has(gardenId)) open.set(gardenId, []);
    open.get(gardenId)!.push(alert);
  }
  let queued = 0;
  for (const { m, pref } of due) {
    const alerts = (open.get(m.gardenId) ?? []).filter((a) => pref.types.includes(a.type));
    if (!alerts.length) continue;
    const date = localDate(m.timeZone, now);
    const added = await inTransaction(sequelize, async (transaction) => {
      const garden = { id: m.gardenId, name: m.gardenName };
      const ctx = await contextFor(sequelize, m, garden, transaction);
      return queueMessage(sequelize, transaction, {
        userId: m.userId,
        gardenId: m.gardenId,
        kind: 'digest',
        dedupeKey: `digest:${m.userId}:${m.gardenId}:${date}`,
        to: m.email,
        content: renderDigest(ctx, alerts, date),
        ctx,
      });
    });
    if (added) queued++;
  }
  return queued;
}
