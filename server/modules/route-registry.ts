import type { RequestHandler, Router } from 'express';
import type { ZodType } from 'zod';
import type { Membership } from '../db/entities/membership.entity';
import { validate } from '../middleware/validate';
import type { AppContext } from '../context';
import { requireAuth, requireRole } from '../middleware/require-role';
import { NotFoundError } from '../errors';
import { endFairUse, fairUse, type FairUseLimiter } from '../middleware/fair-use';
import { JsonText } from '../services/compute-pool';
import type { Role } from '../../shared/schemas/roles';
import { logEvent } from '../services/log';
import { activityDecision, type ActivityDecision } from '../services/activity/activity-routes';
import { recordActivity } from '../services/activity/activity-recorder';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
export interface ProductionRoute {
  method: Method;
  /** full path, e.g. /api/productions/:productionId/members/:memberId */
  path: string;
  role: Role;
  /**
   * What the route writes in the production's activity log (server/services/activity/activity-routes.ts):
   * false for reads and computations; undefined for a write nobody decided on (a test fails on it).
   */
  activity: ActivityDecision | undefined;
}

/** Every production route, as registered; the role-matrix test walks this list, so none can be left out. */
export const productionRoutes: ProductionRoute[] = [];

/**
 * Registers a route under /api/productions/:productionId with the one role check in front of it.
 * `subPath` is relative to the production, e.g. '/members/:memberId' ('' for the production itself).
 * Every write is recorded in the production's activity log as its line of ACTIVITY_ROUTES says
 * (server/services/activity/activity-routes.ts): a new POST/PATCH/DELETE needs a line there.
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
  const activity = activityDecision(method, subPath);
  if (!productionRoutes.some((x) => x.method === method && x.path === full)) {
    productionRoutes.push({ method, path: full, role, activity });
    if (activity === undefined) logEvent('activity-undecided', { method, path: full }, 'warn');
  }
  r[method](path, requireRole(ctx, role), recordActivity(ctx, { subPath, role, activity }), ...handlers);
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

/** A heavy computation's fair use: the limiter (ctx.fairUse) and the work a body asks for (default 1). */
export interface ComputeRouteOptions<T> {
  fairUse?: { limiter: FairUseLimiter; work?: (body: T) => number };
}

/**
 * A signed-in computation that answers a JSON body checked by `schema` (the engine's endpoints: simulate,
 * shade, exposure, light plan): POST `path`, 401 without a session, 400 naming the field, then `run`.
 * A heavy one passes `fairUse` (middleware/fair-use.ts: 429 past the user's limits; the grant is held until
 * `run` settles). `run` may answer JsonText (JSON serialised in a compute thread), sent as it is; a
 * RetryLaterError (compute queue full) gets its Retry-After from the error middleware.
 */
export function computeRoute<T>(r: Router, path: string, schema: ZodType, run: (body: T) => unknown, opts: ComputeRouteOptions<T> = {}): void {
  const limit = opts.fairUse ? [fairUse(opts.fairUse.limiter, opts.fairUse.work as ((body: unknown) => number) | undefined)] : [];
  r.post(path, requireAuth, validate(schema), ...limit, handle(async (req, res) => {
    try {
      const out = await run(req.body as T);
      if (out instanceof JsonText) res.type('application/json').send(out.text);
      else res.json(out);
    } finally {
      endFairUse(res);
    }
  }));
}
