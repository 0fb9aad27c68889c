import type { Request, RequestHandler } from 'express';
import type { AppContext } from '../context';
import { Membership } from '../db/entities/membership.entity';
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
          : await ctx.ds.getRepository(Membership).findOne({
              where: { production: { id: productionId }, user: { id: req.user.id } },
              relations: { production: true, user: true },
            });
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
