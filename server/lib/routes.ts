import type { Request, RequestHandler, Router } from 'express';
import type { Role } from '#shared/schemas/gardens';
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

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      membership?: { gardenId: number; role: Role };
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
    const m = await Membership.findOne({ where: { userId: user.id, gardenId }, attributes: ['role'] });
    if (!m) throw AppError.notFound('That garden');
    if (rank[m.role] < rank[min]) {
      throw AppError.forbidden(
        min === 'owner'
          ? 'Only the garden owner can do this.'
          : 'Viewers can look at everything but cannot change records. Ask the owner for the grower role.',
      );
    }
    req.membership = { gardenId, role: m.role };
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
