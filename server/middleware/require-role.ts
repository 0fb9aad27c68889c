import type { RequestHandler } from 'express';
import type { AppContext } from '../context';
import { Membership } from '../db/entities/membership.entity';
import { ForbiddenError, NotFoundError, UnauthenticatedError } from '../errors';
import type { Role } from '../../shared/schemas/roles';
import { roleAtLeast } from '../../shared/policy/department';

/** 401 without a session. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new UnauthenticatedError());
  next();
};

/**
 * The one role check for every production route (`/api/productions/:productionId/...`).
 * No session → 401; no such production, or not a member → 404 (a production's existence is not revealed);
 * a member whose role is below `need` → 403. Sets `req.membership` (with `production` and `user` loaded).
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
      if (!membership) throw new NotFoundError('Production');
      req.membership = membership;
      if (!roleAtLeast(membership.role, need)) throw new ForbiddenError(`This needs the ${need} role or above; you are ${membership.role}.`);
      next();
    } catch (err) {
      next(err);
    }
  };
}
