import { Router, type Response } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, productionRoute, pid, idParam, itemRoutes } from '../route-registry';
import { boardCreateSchema, boardTonesQuerySchema, boardUpdateSchema } from '../../../shared/schemas/board';
import { BoardsService } from './boards.service';
import { ToneService } from '../tones/tone.service';
import { zodToInvalid } from '../../middleware/validate';

/**
 * JSON text sent as res.json would send its object, but without Express's ETag: that hashes the whole body
 * (megabytes for a large board) on every request, and a board's tones carry their compute time, so two
 * answers never share a tag and a 304 never comes. The tones are computed per request either way (their
 * text mostly written by the compute threads, tone.service.ts `boardTonesJson`).
 */
function sendWithoutEtag(res: Response, json: string): void {
  res.type('application/json').end(json);
}

/** Boards: viewers read; contributors create and edit their own department's; editors and owners any. */
export function boardsRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new BoardsService(ctx.ds);
  const tones = new ToneService(ctx.ds, ctx.env.dataDir);

  productionRoute(r, ctx, 'get', '/boards', 'viewer', handle(async (req, res) => void res.json({ boards: await svc.list(pid(req)) })));
  productionRoute(r, ctx, 'post', '/boards', 'contributor', validate(boardCreateSchema), handle(async (req, res) => {
    res.status(201).json({ board: await svc.create(req.membership!, req.body) });
  }));
  productionRoute(r, ctx, 'get', '/boards/:boardId/tones', 'viewer', handle(async (req, res) => {
    const q = boardTonesQuerySchema.safeParse(req.query);
    if (!q.success) throw zodToInvalid(q.error);
    sendWithoutEtag(res, await tones.boardTonesJson(pid(req), idParam(req.params.boardId, 'Board'), q.data));
  }));
  itemRoutes(r, ctx, { plural: 'boards', param: 'boardId', key: 'board', what: 'Board', read: 'viewer', write: 'contributor', updateSchema: boardUpdateSchema }, svc);
  return r;
}
