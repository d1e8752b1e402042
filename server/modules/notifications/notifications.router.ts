import { z } from 'zod';
import { emailSchema } from '#shared/schemas/auth';
import { EXISTING_SUBJECT, FINISH_SUBJECT } from '../auth/account-mail';
import { Router } from 'express';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import { notificationPreferencesUpdateSchema } from '#shared/schemas/notifications';
import type { CapturedMailDto, FailedMailDto } from '#shared/schemas/notifications';
import { AppError } from '../../errors';
import { parseBody, parseQuery } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { listPreferences, updatePreferences } from './preferences.service';

const iso = (d: Date | string) => new Date(d).toISOString();

const signUpMailQuerySchema = z.strictObject({ email: emailSchema });

export function notificationsRouter(deps: { sequelize: Sequelize; table: RouteTableEntry[]; mailIsLocalFake: boolean }) {
  const { sequelize, table, mailIsLocalFake } = deps;
  const router = Router();
  mountRoutes(
    router,
    '/api/me/notification-preferences',
    [
      {
        method: 'get',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          res.json({ items: await listPreferences(sequelize, requireSignedIn(req).id) });
        },
      },
      {
        method: 'put',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const { items } = parseBody(notificationPreferencesUpdateSchema, req.body);
          res.json({ items: await updatePreferences(sequelize, user.id, items) });
        },
      },
    ],
    table,
  );
  mountRoutes(
    router,
    '/api/gardens/:gardenId/mail',
    [
      {
        method: 'get',
        path: '/failed',
        access: 'owner',
        handler: async (req, res) => {
          const rows = await sequelize.query<{ id: number; toAddr: string; subject: string; attempts: number; lastError: string | null; createdAt: Date }>(
            `SELECT id, to_addr AS toAddr, subject, attempts, last_error AS lastError, created_at AS createdAt
               FROM mail_outbox WHERE garden_id = ? AND status = 'failed' ORDER BY created_at DESC, id DESC LIMIT 200`,
            { replacements: [req.membership!.gardenId], type: QueryTypes.SELECT },
          );
          const items: FailedMailDto[] = rows.map((r) => ({ id: r.id, to: r.toAddr, subject: r.subject, attempts: r.attempts, lastError: r.lastError, createdAt: iso(r.createdAt) }));
          res.json({ items });
        },
      },
    ],
    table,
  );
  mountRoutes(
    router,
    '/api/dev/mail',
    [
      {
        method: 'get',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          // Captured mail exists only while the transport is the local fake; with real SMTP there is no mailbox to show.
          if (!mailIsLocalFake) throw new AppError(404, 'not_found', 'No such API route.');
          // Only the signed-in member's own messages: they carry personal unsubscribe links.
          const user = requireSignedIn(req);
          const rows = await sequelize.query<{ toAddr: string; subject: string; textBody: string; htmlBody: string | null; receivedAt: Date }>(
            `SELECT to_addr AS toAddr, subject, text_body AS textBody, html_body AS htmlBody, received_at AS receivedAt
               FROM captured_mail WHERE to_addr = ? ORDER BY received_at DESC, id DESC LIMIT 100`,
            { replacements: [user.email], type: QueryTypes.SELECT },
          );
          const messages: CapturedMailDto[] = rows.map((r) => ({ to: r.toAddr, subject: r.subject, text: r.textBody, html: r.htmlBody, receivedAt: iso(r.receivedAt) }));
          res.json({ messages });
        },
      },
      {
        method: 'get',
        path: '/sign-up',
        access: 'public',
        handler: async (req, res) => {
          // Someone who has just signed up has no session to open the mailbox with. While mail only
          // reaches the local fake, the sign-up messages to an address (and nothing else) are shown.
          if (!mailIsLocalFake) throw new AppError(404, 'not_found', 'No such API route.');
          const { email } = parseQuery(signUpMailQuerySchema, req.query);
          const rows = await sequelize.query<{ toAddr: string; subject: string; textBody: string; htmlBody: string | null; receivedAt: Date }>(
            `SELECT to_addr AS toAddr, subject, text_body AS textBody, html_body AS htmlBody, received_at AS receivedAt
               FROM captured_mail WHERE to_addr = ? AND subject IN (?, ?) ORDER BY received_at DESC, id DESC LIMIT 5`,
            { replacements: [email, FINISH_SUBJECT, EXISTING_SUBJECT], type: QueryTypes.SELECT },
          );
          const messages: CapturedMailDto[] = rows.map((r) => ({ to: r.toAddr, subject: r.subject, text: r.textBody, html: r.htmlBody, receivedAt: iso(r.receivedAt) }));
          res.json({ messages });
        },
      },
    ],
    table,
  );
  return router;
}
