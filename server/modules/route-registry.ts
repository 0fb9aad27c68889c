import type { RequestHandler, Router } from 'express';
import type { ZodType } from 'zod';
import type { Membership } from '../db/entities/membership.entity';
import { validate } from '../middleware/validate';
import type { AppContext } from '../context';
import { requireAuth, requireRole } from '../middleware/require-role';
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

/** A production item's service as `itemRoutes` drives it. */
export interface ItemService<V> {
  get(productionId: number, id: number): Promise<V>;
  update(m: Membership, id: number, input: never): Promise<V>;
  remove(m: Membership, id: number): Promise<void>;
}

/**
 * The three routes every production item has, under `/<plural>/:<param>`: GET (answers `{ [key]: view }`,
 * for `read`), PATCH checked by `updateSchema` and DELETE (204), both for `write`; a bad id is a 404 for `what`.
 */
export function itemRoutes<V>(
  r: Router,
  ctx: AppContext,
  spec: { plural: string; param: string; key: string; what: string; read: Role; write: Role; updateSchema: ZodType },
  svc: ItemService<V>,
): void {
  const path = `/${spec.plural}/:${spec.param}`;
  const id = (req: { params: Record<string, string | string[] | undefined> }) => idParam(req.params[spec.param], spec.what);
  productionRoute(r, ctx, 'get', path, spec.read, handle(async (req, res) => {
    res.json({ [spec.key]: await svc.get(pid(req), id(req)) });
  }));
  productionRoute(r, ctx, 'patch', path, spec.write, validate(spec.updateSchema), handle(async (req, res) => {
    res.json({ [spec.key]: await svc.update(req.membership!, id(req), req.body as never) });
  }));
  productionRoute(r, ctx, 'delete', path, spec.write, handle(async (req, res) => {
    await svc.remove(req.membership!, id(req));
    res.status(204).end();
  }));
}

/**
 * A signed-in computation that answers a JSON body checked by `schema` (the engine's endpoints: simulate,
 * shade, exposure, light plan): POST `path`, 401 without a session, 400 naming the field, then `run`.
 */
export function computeRoute<T>(r: Router, path: string, schema: ZodType, run: (body: T) => unknown): void {
  r.post(path, requireAuth, validate(schema), handle(async (req, res) => {
    res.json(await run(req.body as T));
  }));
}
