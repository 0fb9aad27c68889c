import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, productionRoute, pid, idParam } from '../route-registry';
import { daySheetsQuerySchema, sheetQuerySchema } from '../../../shared/schemas/sheet';
import { SheetsService } from './sheets.service';
import { renderSheetPdf, renderSheetsPdf } from './sheets-pdf';

/** A name in plain letters, digits and dashes, for a file name. */
function slug(name: string, fallback: string): string {
  return name.normalize('NFKD').replace(/[^\w\s-]/g, '').trim().replace(/\s+/g, '-').toLowerCase().slice(0, 60) || fallback;
}

function sendPdf(res: import('express').Response, pdf: Buffer, file: string) {
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `attachment; filename="${file}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(pdf);
}

/**
 * The exposure sheet of a look, as JSON (for the printable page) and as a PDF, with `?boards=` to pick the
 * boards it lists; the sheets of several looks in one PDF for the day. Any member may read them.
 */
export function sheetsRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new SheetsService(ctx.ds, ctx.env.dataDir);
  const boardsOf = (q: unknown) => (q as { boards?: number[] }).boards;

  productionRoute(r, ctx, 'get', '/looks/:lookId/sheet', 'viewer', validate(sheetQuerySchema, 'query'), handle(async (req, res) => {
    res.json({ sheet: await svc.sheet(pid(req), idParam(req.params.lookId, 'Look'), boardsOf(req.query)) });
  }));
  productionRoute(r, ctx, 'get', '/looks/:lookId/sheet.pdf', 'viewer', validate(sheetQuerySchema, 'query'), handle(async (req, res) => {
    const sheet = await svc.sheet(pid(req), idParam(req.params.lookId, 'Look'), boardsOf(req.query));
    sendPdf(res, await renderSheetPdf(sheet), `exposure-sheet-${slug(sheet.look.name, 'look')}.pdf`);
  }));
  productionRoute(r, ctx, 'get', '/sheets.pdf', 'viewer', validate(daySheetsQuerySchema, 'query'), handle(async (req, res) => {
    const sheets = await svc.daySheets(pid(req), (req.query as unknown as { looks: number[] }).looks);
    sendPdf(res, await renderSheetsPdf(sheets), `exposure-sheets-${slug(sheets[0].production.name, 'production')}-${sheets.length}-looks.pdf`);
  }));
  return r;
}
