import { Router } from 'express';
import type { AppContext } from '../../context';
import { handle, productionRoute, pid, idParam } from '../route-registry';
import { SheetsService } from './sheets.service';
import { renderSheetPdf } from './sheet-pdf';

/** A file name for the download: the look's name in plain letters, digits and dashes. */
function fileName(look: string): string {
  const slug = look.normalize('NFKD').replace(/[^\w\s-]/g, '').trim().replace(/\s+/g, '-').toLowerCase().slice(0, 60);
  return `exposure-sheet-${slug || 'look'}.pdf`;
}

/** The exposure sheet of a look, as JSON (for the printable page) and as a PDF; any member may read it. */
export function sheetsRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new SheetsService(ctx.ds, ctx.env.dataDir);

  productionRoute(r, ctx, 'get', '/looks/:lookId/sheet', 'viewer', handle(async (req, res) => {
    res.json({ sheet: await svc.sheet(pid(req), idParam(req.params.lookId, 'Look')) });
  }));
  productionRoute(r, ctx, 'get', '/looks/:lookId/sheet.pdf', 'viewer', handle(async (req, res) => {
    const sheet = await svc.sheet(pid(req), idParam(req.params.lookId, 'Look'));
    const pdf = await renderSheetPdf(sheet);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(sheet.look.name)}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  }));
  return r;
}
