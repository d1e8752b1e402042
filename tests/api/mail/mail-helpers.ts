import { afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { testApp, testDb } from '../../helpers/test-app';
import { startFakeSmtp } from '../../../fixtures/mail/smtp-fake';
import type { FakeSmtp } from '../../../fixtures/mail/smtp-fake';
import { createMailTransport } from '../../../server/integrations/mail/transport';
import { createMailSender } from '../../../server/modules/notifications/mail-sender';
import type { MailSenderOptions } from '../../../server/modules/notifications/mail-sender';
import { createLogger } from '../../../server/lib/logger';
import type { AlertSeverity, AlertType } from '#shared/schemas/alerts';
import type { Delivery } from '#shared/schemas/notifications';

const fakes: FakeSmtp[] = [];
afterAll(async () => {
  await Promise.all(fakes.map((f) => f.close()));
});

/** A capture server of this test file; closed with the file. */
export async function fakeSmtp(port = 0) {
  const fake = await startFakeSmtp({ sequelize: testDb().sequelize, port });
  fakes.push(fake);
  return fake;
}

export function mailApp(port: number) {
  const { config } = testDb();
  return testApp({ mail: { ...config.mail, fakePort: port } });
}

/** A sender as another instance would run it, limited to the test's garden (other files share the database). */
export function sender(port: number, gardenId: number, opts: Partial<MailSenderOptions> = {}) {
  const { sequelize, config } = testDb();
  const transport = createMailTransport({ ...config.mail, mode: 'fake', smtpUrl: null, fakePort: port });
  return createMailSender({ sequelize, transport, logger: createLogger('silent'), onlyGardens: [gardenId], ...opts });
}

let seq = 0;
export async function insertAlert(
  gardenId: number,
  attrs: Partial<{ type: AlertType; severity: AlertSeverity; status: string; firstOn: string; endsOn: string | null; caution: string | null }> = {},
) {
  const { sequelize } = testDb();
  const [id] = await sequelize.query(
    `INSERT INTO alerts (garden_id, planting_id, subject_key, type, first_on, ends_on, severity, status, subject, title, reasons_json, action, caution, created_at, updated_at)
     VALUES (?, NULL, ?, ?, ?, ?, ?, ?, 'Lettuce: Copper Leaf (Plot 3)', 'Bolt risk high from 9 Jun', ?, 'Harvest the biggest heads now; sow a slower-bolting variety.', ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))`,
    {
      replacements: [
        gardenId,
        `t${++seq}`,
        attrs.type ?? 'bolt-risk',
        attrs.firstOn ?? '2026-06-09',
        attrs.endsOn === undefined ? '2026-06-12' : attrs.endsOn,
        attrs.severity ?? 'warning',
        attrs.status ?? 'open',
        JSON.stringify(['4 days ≥ 80 °F forecast 9–12 Jun', 'day length 15.1 h']),
        attrs.caution === undefined ? 'Working outdoors in heat: drink water, rest in shade, stop if dizzy.' : attrs.caution,
      ],
      type: QueryTypes.INSERT,
    },
  );
  return id;
}

export async function setPreference(userId: number, gardenId: number, delivery: Delivery, types: AlertType[] | null = null, digestHour = 7) {
  const { sequelize } = testDb();
  const typesJson = JSON.stringify(types ?? ['bolt-risk', 'frost', 'heat-stress', 'chilling', 'harvest-window', 'data-gap']);
  await sequelize.query(
    `INSERT INTO notification_preferences (user_id, garden_id, delivery, digest_hour, types_json, unsubscribe_nonce, created_at, updated_at)
     VALUES (?, ?, ?, ?, ?, ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))
     ON DUPLICATE KEY UPDATE delivery = VALUES(delivery), digest_hour = VALUES(digest_hour), types_json = VALUES(types_json)`,
    { replacements: [userId, gardenId, delivery, digestHour, typesJson, `n${String(++seq).padStart(21, '0')}`] },
  );
}

export interface Captured {
  to_addr: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  headers: Record<string, string>;
}

export async function capturedFor(email: string): Promise<Captured[]> {
  const rows = await testDb().sequelize.query<Omit<Captured, 'headers'> & { headers_json: string }>(
    'SELECT to_addr, subject, text_body, html_body, headers_json FROM captured_mail WHERE to_addr = ? ORDER BY id',
    { replacements: [email], type: QueryTypes.SELECT },
  );
  return rows.map(({ headers_json, ...r }) => ({ ...r, headers: JSON.parse(headers_json) as Record<string, string> }));
}

export interface OutboxRow {
  id: number;
  status: string;
  attempts: number;
  last_error: string | null;
  dueInMs: number;
  dedupe_key: string;
}

export async function outboxFor(gardenId: number): Promise<OutboxRow[]> {
  return testDb().sequelize.query<OutboxRow>(
    `SELECT id, status, attempts, last_error, dedupe_key, TIMESTAMPDIFF(MICROSECOND, UTC_TIMESTAMP(3), run_after) / 1000 AS dueInMs
       FROM mail_outbox WHERE garden_id = ? ORDER BY id`,
    { replacements: [gardenId], type: QueryTypes.SELECT },
  );
}

export async function inTx<T>(work: (t: import('sequelize').Transaction) => Promise<T>): Promise<T> {
  return testDb().sequelize.transaction(work);
}
