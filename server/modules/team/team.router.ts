import { Router } from 'express';
import rateLimit from 'express-rate-limit';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { AppError } from '../../errors';
import { IGNORED_FORWARDED_FOR } from '../auth/auth.router';
import { activityRecorder } from '../../services/activity/activity-recorder';
import { acceptInvitationSchema, invitationCreateSchema, membershipUpdateSchema } from '../../../shared/schemas/auth';
import { handle, productionRoute, pid, idParam } from '../route-registry';
import { TeamService } from './team.service';
import { logIn } from '../auth/auth.router';
import { publicUser } from '../auth/auth.service';

export function teamRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new TeamService(ctx.ds, ctx.mail, ctx.env.publicUrl);

  productionRoute(r, ctx, 'get', '/members', 'viewer', handle(async (req, res) => void res.json({ members: await svc.members(pid(req)) })));
  productionRoute(
    r, ctx, 'patch', '/members/:memberId', 'owner', validate(membershipUpdateSchema),
    handle(async (req, res) => void res.json({ member: await svc.updateMember(pid(req), idParam(req.params.memberId, 'Member'), req.body) })),
  );
  productionRoute(r, ctx, 'delete', '/members/:memberId', 'owner', handle(async (req, res) => {
    await svc.removeMember(pid(req), idParam(req.params.memberId, 'Member'));
    res.status(204).end();
  }));
  productionRoute(r, ctx, 'get', '/invitations', 'owner', handle(async (req, res) => void res.json({ invitations: await svc.invitations(pid(req)) })));
  productionRoute(
    r, ctx, 'post', '/invitations', 'owner', validate(invitationCreateSchema),
    handle(async (req, res) => void res.status(201).json({ invitation: await svc.invite(req.membership!, req.body) })),
  );
  productionRoute(r, ctx, 'delete', '/invitations/:invitationId', 'owner', handle(async (req, res) => {
    await svc.revoke(pid(req), idParam(req.params.invitationId, 'Invitation'));
    res.status(204).end();
  }));

  // public: the invitation link itself
  const limiter = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: ctx.env.authRateLimit,
    validate: IGNORED_FORWARDED_FOR,
    handler: (_q, _s, next) => next(new AppError(429, 'rate_limited', 'Too many attempts; wait a few minutes and try again.')),
  });
  r.get('/invitations/:token', limiter, handle(async (req, res) => void res.json({ invitation: await svc.describe(String(req.params.token)) })));
  r.post('/invitations/:token/accept', limiter, validate(acceptInvitationSchema), handle(async (req, res) => {
    const { user, productionId } = await svc.accept(String(req.params.token), req.body);
    // a member joined: outside productionRoute (the person is not a member until now), so recorded here
    void activityRecorder(ctx.ds).record({ productionId, actorId: user.id, actorName: user.name, action: 'created', kind: 'member', itemId: null, itemName: user.name, detail: 'accepted an invitation' });
    const csrfToken = await logIn(req, user);
    res.json({ user: publicUser(user), productionId, csrfToken });
  }));
  return r;
}
