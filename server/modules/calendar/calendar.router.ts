import { Router } from 'express';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import type { CalendarService } from './calendar.service';

/**
 * The signed-in user's private calendar link (`/api/me/calendar-feed`) and the public feed it
 * opens (`/api/calendar/<token>.ics`, no session: calendar apps send only the address).
 */
export function calendarRouter(calendar: CalendarService, table: RouteTableEntry[]) {
  const router = Router();
  mountRoutes(
    router,
    '/api/me/calendar-feed',
    [
      {
        method: 'get',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          const { feed, created } = await calendar.getOrCreate(requireSignedIn(req).id);
          res.status(created ? 201 : 200).json(feed);
        },
      },
      {
        method: 'post',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          res.status(201).json(await calendar.rotate(requireSignedIn(req).id));
        },
      },
      {
        method: 'delete',
        path: '/',
        access: 'signed-in',
        handler: async (req, res) => {
          await calendar.revoke(requireSignedIn(req).id);
          res.status(204).end();
        },
      },
    ],
    table,
  );
  mountRoutes(
    router,
    '/api/calendar',
    [
      {
        method: 'get',
        path: '/:token.ics',
        access: 'public',
        handler: async (req, res) => {
          const text = await calendar.feed(String(req.params.token));
          res.set({
            'Content-Type': 'text/calendar; charset=utf-8',
            'Content-Disposition': 'inline; filename="heatclock.ics"',
            'X-Content-Type-Options': 'nosniff',
            // The address is the secret: keep it out of shared caches and referrers.
            'Cache-Control': 'private, no-store',
            'Referrer-Policy': 'no-referrer',
          });
          res.send(text);
        },
      },
    ],
    table,
  );
  return router;
}
