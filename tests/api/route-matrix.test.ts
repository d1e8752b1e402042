import { describe, expect, it } from 'vitest';
import { testApp, agent } from '../helpers/test-app';
import type { TestAgent } from '../helpers/test-app';
import { gardenWithMembers, signIn } from '../helpers/factories';
import type { RouteTableEntry } from '../../server/lib/routes';

/**
 * Every mounted API route must be listed here with its expected access. A route added without a
 * line here fails the first test, so no route ships without its role check being exercised.
 */
const EXPECTED: Record<string, RouteTableEntry['access']> = {
  'get /api/health': 'public',
  'get /api/ready': 'public',
  'post /api/auth/register': 'public',
  'post /api/auth/register/confirm/:token': 'public',
  'post /api/auth/login': 'public',
  'post /api/auth/logout': 'public',
  'get /api/auth/me': 'signed-in',
  'post /api/auth/password-reset': 'public',
  'get /api/auth/password-reset/:token': 'public',
  'post /api/auth/password-reset/:token': 'public',
  'patch /api/me': 'signed-in',
  'post /api/me/email-change': 'signed-in',
  'post /api/me/email-change/:token': 'signed-in',
  'post /api/me/password': 'signed-in',
  'get /api/me/sessions': 'signed-in',
  'post /api/me/sessions/sign-out-others': 'signed-in',
  'delete /api/me/sessions/:id': 'signed-in',
  'get /api/gardens': 'signed-in',
  'get /api/gardens/:gardenId': 'viewer',
  'patch /api/gardens/:gardenId': 'owner',
  'get /api/gardens/:gardenId/climate': 'viewer',
  'put /api/gardens/:gardenId/climate': 'owner',
  'get /api/gardens/:gardenId/chill': 'viewer',
  'get /api/places': 'signed-in',
  'get /api/gardens/:gardenId/soil': 'viewer',
  'post /api/gardens/:gardenId/soil/readings': 'grower',
  'delete /api/gardens/:gardenId/soil/readings/:readingId': 'grower',
  'get /api/gardens/:gardenId/weather': 'viewer',
  'post /api/gardens/:gardenId/weather/refresh': 'grower',
  'post /api/gardens/:gardenId/weather/imports': 'grower',
  'get /api/gardens/:gardenId/weather/runs': 'owner',
  'get /api/gardens/:gardenId/beds': 'viewer',
  'post /api/gardens/:gardenId/beds': 'grower',
  'get /api/gardens/:gardenId/beds/:bedId': 'viewer',
  'patch /api/gardens/:gardenId/beds/:bedId': 'grower',
  'delete /api/gardens/:gardenId/beds/:bedId': 'grower',
  'get /api/gardens/:gardenId/crops': 'viewer',
  'get /api/gardens/:gardenId/crops/:cropKey': 'viewer',
  'patch /api/gardens/:gardenId/crops/:cropKey': 'owner',
  'get /api/gardens/:gardenId/varieties': 'viewer',
  'post /api/gardens/:gardenId/varieties': 'grower',
  'get /api/gardens/:gardenId/varieties/:varietyId': 'viewer',
  'get /api/gardens/:gardenId/varieties/:varietyId/calibration': 'viewer',
  'patch /api/gardens/:gardenId/varieties/:varietyId': 'grower',
  'delete /api/gardens/:gardenId/varieties/:varietyId': 'grower',
  'get /api/gardens/:gardenId/seed-lots': 'viewer',
  'post /api/gardens/:gardenId/seed-lots': 'grower',
  'get /api/gardens/:gardenId/seed-lots/:seedLotId': 'viewer',
  'patch /api/gardens/:gardenId/seed-lots/:seedLotId': 'grower',
  'delete /api/gardens/:gardenId/seed-lots/:seedLotId': 'grower',
  'post /api/gardens/:gardenId/seed-lots/:seedLotId/germination-tests': 'grower',
  'delete /api/gardens/:gardenId/seed-lots/:seedLotId/germination-tests/:testId': 'grower',
  'get /api/gardens/:gardenId/seed-lots/:seedLotId/seeds-to-sow': 'viewer',
  'get /api/gardens/:gardenId/plantings': 'viewer',
  'post /api/gardens/:gardenId/plantings': 'grower',
  'get /api/gardens/:gardenId/plantings/export.csv': 'viewer',
  'get /api/gardens/:gardenId/plantings/preview': 'viewer',
  'get /api/gardens/:gardenId/plan': 'viewer',
  'get /api/gardens/:gardenId/compare': 'viewer',
  'get /api/gardens/:gardenId/compare.csv': 'viewer',
  'post /api/gardens/:gardenId/plantings/import': 'grower',
  'get /api/gardens/:gardenId/plantings/:plantingId': 'viewer',
  'patch /api/gardens/:gardenId/plantings/:plantingId': 'grower',
  'delete /api/gardens/:gardenId/plantings/:plantingId': 'grower',
  'get /api/gardens/:gardenId/plantings/:plantingId/log': 'viewer',
  'post /api/gardens/:gardenId/plantings/:plantingId/log': 'grower',
  'delete /api/gardens/:gardenId/plantings/:plantingId/log/:entryId': 'grower',
  'get /api/gardens/:gardenId/plantings/:plantingId/progress': 'viewer',
  'get /api/gardens/:gardenId/today': 'viewer',
  'get /api/gardens/:gardenId/alerts': 'viewer',
  'get /api/gardens/:gardenId/alerts/counts': 'viewer',
  'post /api/gardens/:gardenId/alerts/:alertId/acknowledge': 'grower',
  'get /api/gardens/:gardenId/plantings/:plantingId/photos': 'viewer',
  'post /api/gardens/:gardenId/plantings/:plantingId/photos': 'grower',
  'get /api/gardens/:gardenId/plantings/:plantingId/photos/:photoId': 'viewer',
  'delete /api/gardens/:gardenId/plantings/:plantingId/photos/:photoId': 'grower',
  'get /api/unsubscribe/:token': 'public',
  'post /api/unsubscribe/:token': 'public',
  'get /api/me/notification-preferences': 'signed-in',
  'put /api/me/notification-preferences': 'signed-in',
  'get /api/gardens/:gardenId/mail/failed': 'owner',
  'get /api/gardens/:gardenId/audit': 'owner',
  'get /api/dev/mail': 'signed-in',
  'get /api/dev/mail/sign-up': 'public',
  'get /api/me/calendar-feed': 'signed-in',
  'post /api/me/calendar-feed': 'signed-in',
  'delete /api/me/calendar-feed': 'signed-in',
  'get /api/calendar/:token.ics': 'public',
  'get /api/gardens/:gardenId/plantings/:plantingId/degree-days.csv': 'viewer',
  'get /api/gardens/:gardenId/members': 'viewer',
  'delete /api/gardens/:gardenId/members/me': 'viewer',
  'patch /api/gardens/:gardenId/members/:userId': 'owner',
  'delete /api/gardens/:gardenId/members/:userId': 'owner',
  'get /api/gardens/:gardenId/invitations': 'owner',
  'post /api/gardens/:gardenId/invitations': 'owner',
  'delete /api/gardens/:gardenId/invitations/:invitationId': 'owner',
  'get /api/gardens/:gardenId/invitations/:invitationId/test-mail': 'owner',
  'get /api/invitations/:token': 'public',
  'post /api/invitations/:token/accept': 'public',
};

const app = testApp();
const table = app.locals.routes as RouteTableEntry[];

const rank = { outsider: 0, viewer: 1, grower: 2, owner: 3 } as const;
const need = { viewer: 1, grower: 2, owner: 3 } as const;

describe('role × route matrix', () => {
  it('when the app is built, then every mounted route is listed with the access it declares', () => {
    const mounted = Object.fromEntries(table.map((r) => [`${r.method} ${r.path}`, r.access]));
    expect(mounted).toEqual(EXPECTED);
  });

  it('when each role calls each garden route, then outsiders get 404, lower roles 403, enough roles pass the check', async () => {
    const ctx = await gardenWithMembers();
    const people = { outsider: ctx.outsider, viewer: ctx.viewer, grower: ctx.grower, owner: ctx.owner };
    // One signed-in client per role: signing in per route would spend the test's time on password hashing.
    const clients = new Map<keyof typeof rank, TestAgent>();
    for (const [role, user] of Object.entries(people) as [keyof typeof rank, typeof ctx.owner][]) {
      const c = agent(app);
      await signIn(c, user.email);
      clients.set(role, c);
    }
    // Leaving ends the caller's membership, so it is tried after every other route.
    const leaving = (r: RouteTableEntry) => Number(r.path.endsWith('/members/me'));
    for (const route of table.filter((r) => r.path.includes(':gardenId')).sort((x, y) => leaving(x) - leaving(y))) {
      for (const role of Object.keys(people) as (keyof typeof rank)[]) {
        const c = clients.get(role)!;
        const url = route.path.replace(':gardenId', String(ctx.garden.id));
        const res = await c[route.method](url).send({});
        const label = `${route.method} ${route.path} as ${role}`;
        if (role === 'outsider') expect(res.status, label).toBe(404);
        else if (rank[role] < need[route.access as keyof typeof need]) expect(res.status, label).toBe(403);
        // Past the access check: success, or the route's own answer to an empty body.
        else expect([200, 201, 204, 400, 409, 413, 415, 422], label).toContain(res.status);
      }
    }
  });

  it('when nobody is signed in, then every non-public route answers 401', async () => {
    const ctx = await gardenWithMembers();
    for (const route of table.filter((r) => r.access !== 'public')) {
      const url = route.path.replace(':gardenId', String(ctx.garden.id));
      const res = await agent(app)[route.method](url).send({});
      expect(res.status, `${route.method} ${route.path}`).toBe(401);
    }
  });
});
