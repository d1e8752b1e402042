import { describe, expect, it } from 'vitest';
import { testApp, agent } from '../helpers/test-app';
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
  'post /api/auth/login': 'public',
  'post /api/auth/logout': 'public',
  'get /api/auth/me': 'signed-in',
  'get /api/gardens': 'signed-in',
  'get /api/gardens/:gardenId': 'viewer',
  'patch /api/gardens/:gardenId': 'owner',
  'get /api/gardens/:gardenId/weather': 'viewer',
  'post /api/gardens/:gardenId/weather/refresh': 'grower',
  'post /api/gardens/:gardenId/weather/imports': 'grower',
  'get /api/gardens/:gardenId/weather/runs': 'owner',
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
    for (const route of table.filter((r) => r.path.includes(':gardenId'))) {
      for (const [role, user] of Object.entries(people) as [keyof typeof rank, typeof ctx.owner][]) {
        const c = agent(app);
        await signIn(c, user.email);
        const url = route.path.replace(':gardenId', String(ctx.garden.id));
        const res = await c[route.method](url).send({});
        const label = `${route.method} ${route.path} as ${role}`;
        if (role === 'outsider') expect(res.status, label).toBe(404);
        else if (rank[role] < need[route.access as keyof typeof need]) expect(res.status, label).toBe(403);
        else expect([200, 201, 204, 400, 422], label).toContain(res.status);
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
