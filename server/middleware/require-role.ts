import type { Request, RequestHandler } from 'express';
import type { AppContext } from '../context';
import type { DataSource } from 'typeorm';
import { Membership } from '../db/entities/membership.entity';
import { Production } from '../db/entities/production.entity';
import { User } from '../db/entities/user.entity';
import { shallowCopy, tableCache, type TableCache } from '../services/cache';
import { ForbiddenError, NotFoundError, UnauthenticatedError } from '../errors';
import { logEvent } from '../services/log';
import type { Role } from '../../shared/schemas/roles';
import { roleAtLeast } from '../../shared/policy/department';

/** 401 without a session. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new UnauthenticatedError());
  next();
};

/**
 * A refused production request, for the operator (OWASP ASVS 4.0.3 §7.2.2: failed access control decisions
 * are logged): who, which production, the role needed and the one held (null: not a member), where from.
 */
function logRefusal(req: Request, productionId: number, need: Role, role: Role | null): void {
  logEvent('role-refused', {
    userId: req.user?.id ?? null,
    productionId,
    need,
    role,
    reason: role ? 'role' : 'not-a-member',
    method: req.method,
    path: req.originalUrl.split('?')[0],
    ip: req.ip,
  }, 'warn');
}

/** How many (production, user) memberships are kept, and for how long at most (writes empty it at once). */
const MEMBERSHIPS_KEPT = 1000;
const MEMBERSHIP_TTL_MS = 30_000;
const membershipCaches = new WeakMap<DataSource, TableCache<string, Membership>>();

/**
 * The membership of a user in a production, with `production` and `user`, or null. Kept per app
 * (services/cache.ts) and emptied by any write to memberships, productions or users, so a role changed, a
 * member removed or a production deleted is seen by the very next request; each caller gets its own copy.
 */
export async function findMembership(ds: DataSource, productionId: number, userId: number): Promise<Membership | null> {
  let cache = membershipCaches.get(ds);
  if (!cache) membershipCaches.set(ds, (cache = tableCache<string, Membership>(ds, [Membership, Production, User], { max: MEMBERSHIPS_KEPT, ttlMs: MEMBERSHIP_TTL_MS })));
  const m = await cache.get(`${productionId}:${userId}`, () =>
    ds.getRepository(Membership).findOne({
      where: { production: { id: productionId }, user: { id: userId } },
      relations: { production: true, user: true },
    }),
  );
  if (!m) return null;
  const copy = shallowCopy(m);
  copy.production = shallowCopy(m.production);
  copy.user = shallowCopy(m.user);
  return copy;
}

/**
 * The one role check for every production route (`/api/productions/:productionId/...`).
 * No session → 401; no such production, or not a member → 404 (a production's existence is not revealed);
 * a member whose role is below `need` → 403. Sets `req.membership` (with `production` and `user` loaded).
 * Refusals of a signed-in user (404 as a non-member, 403) are logged for the operator as 'role-refused'.
 */
export function requireRole(ctx: AppContext, need: Role): RequestHandler {
  return async (req, _res, next) => {
    try {
      if (!req.user) throw new UnauthenticatedError();
      const productionId = Number(req.params.productionId);
      if (!Number.isInteger(productionId) || productionId <= 0) throw new NotFoundError('Production');
      const membership =
        req.membership && req.membership.production.id === productionId
          ? req.membership
          : await findMembership(ctx.ds, productionId, req.user.id);
      if (!membership) {
        logRefusal(req, productionId, need, null);
        throw new NotFoundError('Production');
      }
      req.membership = membership;
      if (!roleAtLeast(membership.role, need)) {
        logRefusal(req, productionId, need, membership.role);
        throw new ForbiddenError(`This needs the ${need} role or above; you are ${membership.role}.`);
      }
      next();
    } catch (err) {
      next(err);
    }
  };
}
