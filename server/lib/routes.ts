import type { Request, RequestHandler, Router } from 'express';
import type { Role } from '#shared/schemas/gardens';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { AppError } from '../errors';
import { Membership } from '../db/models';
import { accessContext, readAccess } from './garden-access';
import { idempotency } from './idempotency';
import type { Sequelize } from 'sequelize';

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
  /** Extra middleware (e.g. rate limiting, a multipart parse) that runs after access checks. */
  before?: RequestHandler[];
  /**
   * Garden POSTs honour Idempotency-Key (lib/idempotency.ts) unless this is false: for a route
   * that is idempotent by its nature, or that reads its body only in the handler (the key's
   * fingerprint must see the whole request, so a multipart body is parsed in `before`).
   */
  idempotent?: boolean;
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



declare global {
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
    // Read with this request's session when it could be (one round trip), else on its own.
    const ctx = accessContext.getStore();
    const m = ctx && ctx.gardenId === gardenId && ctx.userId === user.id && ctx.access !== undefined ? ctx.access : await readAccess(Membership.sequelize!, user.id, gardenId);
    if (!m) throw AppError.notFound('That garden');
    if (rank[m.role] < rank[min]) {
      throw AppError.forbidden(
        min === 'owner'
          ? 'Only the garden owner can do this.'
          : 'Viewers can look at everything but cannot change records. Ask the owner for the grower role.',
      );
    }
    const { role, revision, alerts, gardenName, ...facts } = m;
    req.membership = { gardenId, role, garden: { id: gardenId, name: gardenName, ...facts }, revision: `${revision ?? 0}.${alerts ?? 0}` };
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

const GARDEN_ROLES: readonly Access[] = ['viewer', 'grower', 'owner'];

export function mountRoutes(router: Router, base: string, specs: RouteSpec[], table: RouteTableEntry[]) {
  for (const spec of specs) {
    const full = spec.path === '/' ? base : base + spec.path;
    if (full.includes(':gardenId') !== GARDEN_ROLES.includes(spec.access)) {
      throw new Error(`Route ${spec.method.toUpperCase()} ${full}: garden routes need a garden role and only they`);
    }
    // Creates in a garden take an Idempotency-Key: a double tap or a retry makes one record.
    const once = spec.method === 'post' && GARDEN_ROLES.includes(spec.access) && spec.idempotent !== false ? [idempotency((req) => req.app.locals.sequelize as Sequelize)] : [];
    router[spec.method](full, ...accessMiddleware(spec.access), ...(spec.before ?? []), ...once, spec.handler);
    table.push({ method: spec.method, path: full, access: spec.access });
  }
}
