import { Router } from 'express';
import type { AppContext } from '../../context';
import { MailMessage } from '../../db/entities/mail-message.entity';
import { ForbiddenError, NotFoundError } from '../../errors';
import { requireAuth } from '../../middleware/require-role';
import { handle } from '../route-registry';

/** The fake outbox, for the site admin, in demo mode only. */
export function outboxRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/admin/outbox', requireAuth, handle(async (req, res) => {
    if (!ctx.env.demo) throw new NotFoundError('Outbox');
    if (!req.user!.isAdmin) throw new ForbiddenError('The outbox is for the site admin.');
    const messages = await ctx.ds.getRepository(MailMessage).find({ order: { id: 'DESC' }, take: 200 });
    res.json({ messages });
  }));
  return r;
}
