import type { RequestHandler, Router } from 'express';
import type { AppContext } from '../context';
import { requireRole } from '../middleware/require-role';
import { NotFoundError } from '../errors';
import type { Role } from '../../shared/schemas/roles';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
export interface ProductionRoute {
  method: Method;
  /** full path, e.g. /api/productions/:productionId/members/:memberId */
  path: string;
  role: Role;
}

/** Every production route, as registered; the role-matrix test walks this list, so none can be left out. */
export const productionRoutes: ProductionRoute[] = [];

/**
 * Registers a route under /api/productions/:productionId with the one role check in front of it.
 * `subPath` is relative to the production, e.g. '/members/:memberId' ('' for the production itself).
 */
export function productionRoute(
  r: Router,
  ctx: AppContext,
  method: Method,
  subPath: string,
  role: Role,
  ...handlers: RequestHandler[]
): void {
  const path = `/productions/:productionId${subPath}`;
  const full = `/api${path}`;
  if (!productionRoutes.some((x) => x.method === method && x.path === full)) productionRoutes.push({ method, path: full, role });
  r[method](path, requireRole(ctx, role), ...handlers);
}

/** Wraps an async handler so a rejected promise reaches the error middleware. */
export function handle(fn: (...a: Parameters<RequestHandler>) => Promise<unknown>): RequestHandler {
  return (req, res, next) => {
    fn(req, res, next).catch(next);
  };
}

/** The production of a request that passed requireRole. */
export function pid(req: { membership?: { production: { id: number } } }): number {
  return req.membership!.production.id;
}

/** A positive integer id from a path parameter; anything else is a 404 for `what`. */
export function idParam(v: unknown, what: string): number {
  const n = Number(v);
  if (!Number.isInteger(n) || n <= 0) throw new NotFoundError(what);
  return n;
}
