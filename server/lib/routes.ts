import type { Request, RequestHandler, Router } from 'express';
import type { Role } from '#shared/schemas/gardens';
import { QueryTypes } from 'sequelize';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { AppError } from '../errors';
import { Membership } from '../db/models';

/**
 * Every API route is declared with the access it needs; the middleware follows from the
 * declaration, and the table of all routes is what the role × route test walks.
 */
export type Access = 'public' | 'signed-in' | Role;
export type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

export interface RouteSpec {
  method: Method;
  path: string;
  access: Access;
  handler: RequestHandler;
  /** Extra middleware (e.g. rate limiting) that runs after access checks. */
  before?: RequestHandler[];
}

export interface RouteTableEntry {
  method: Method;
  path: string;
  access: Access;
}

const rank: Record<Role, number> = { viewer: 1, grower: 2, owner: 3 };

/** What a garden route knows of its garden from the access check, without asking again. */
export interface GardenFacts {
  id: number;
  name: string;
  timeZone: string;
  units: DisplayUnit;
  latitude: number | null;
  weatherCellId: number | null;
}

export interface GardenMembership {
  gardenId: number;
  role: Role;
  garden: GardenFacts;
  /**
   * The garden's change counters as read by this request's access check (garden_revisions for
   * records, settings and weather; alert_evaluations.revision for alerts): a cached answer made at the same revision is still right (server/lib/read-cache.ts).
   */
  revision: string;
}

interface AccessRow extends Omit<GardenFacts, 'id'> {
  role: Role;
  revision: number | null;
  alerts: number | null;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      membership?: GardenMembership;
    }
  }
}

export function requireSignedIn(req: Request) {
  if (!req.user) throw AppError.unauthenticated();
  return req.user;
}

/** Membership and role come from the database on every request, so a demotion applies at once. */
function gardenAccess(min: Role): RequestHandler {
  return async (req, _res, next) => {
    const user = requireSignedIn(req);
    const raw = String(req.params.gardenId ?? '');
    const gardenId = /^[1-9]\d{0,9}$/.test(raw) ? Number(raw) : NaN;
    if (!Number.isSafeInteger(gardenId) || gardenId > 2_147_483_647) throw AppError.notFound('That garden');
    // One indexed read: the role, the garden's facts and its change counters.
    const [m] = await Membership.sequelize!.query<AccessRow>(
      `SELECT m.role, g.name, g.time_zone AS timeZone, g.units, g.latitude, g.weather_cell_id AS weatherCellId,
              gr.revision, ae.revision AS alerts
         FROM memberships m
         JOIN gardens g ON g.id = m.garden_id
         LEFT JOIN garden_revisions gr ON gr.garden_id = m.garden_id
         LEFT JOIN alert_evaluations ae ON ae.garden_id = m.garden_id
        WHERE m.user_id = ? AND m.garden_id = ?`,
      { replacements: [user.id, gardenId], type: QueryTypes.SELECT },
    );
    if (!m) throw AppError.notFound('That garden');
    if (rank[m.role] < rank[min]) {
      throw AppError.forbidden(
        min === 'owner'
          ? 'Only the garden owner can do this.'
          : 'Viewers can look at everything but cannot change records. Ask the owner for the grower role.',
      );
    }
    const { role, revision, alerts, ...facts } = m;
    req.membership = { gardenId, role, garden: { id: gardenId, ...facts }, revision: `${revision ?? 0}.${alerts ?? 0}` };
    next();
  };
}

function accessMiddleware(access: Access): RequestHandler[] {
  if (access === 'public') return [];
  if (access === 'signed-in')
    return [
      (req, _res, next) => {
        requireSignedIn(req);
        next();
      },
    ];
  return [gardenAccess(access)];
}

export function mountRoutes(router: Router, base: string, specs: RouteSpec[], table: RouteTableEntry[]) {
  for (const spec of specs) {
    const full = spec.path === '/' ? base : base + spec.path;
    if (full.includes(':gardenId') !== ['viewer', 'grower', 'owner'].includes(spec.access)) {
      throw new Error(`Route ${spec.method.toUpperCase()} ${full}: garden routes need a garden role and only they`);
    }
    router[spec.method](full, ...accessMiddleware(spec.access), ...(spec.before ?? []), spec.handler);
    table.push({ method: spec.method, path: full, access: spec.access });
  }
}
