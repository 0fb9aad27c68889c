import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { AppContext } from '../../context';
import { plainMultipartOnly, validate, zodToInvalid } from '../../middleware/validate';
import { handle, productionRoute, pid, idParam, itemRoutes } from '../route-registry';
import { departmentSchema } from '../../../shared/schemas/roles';
import { MAX_IMPORT_BYTES, swatchCreateSchema, swatchImportFieldsSchema, swatchUpdateSchema } from '../../../shared/schemas/swatch';
import { AppError, InvalidError } from '../../errors';
import { SwatchesService } from './swatches.service';
import { ToneService } from '../tones/tone.service';

/** One spectrophotometer file in the multipart part `file` (kept in memory, at most MAX_IMPORT_BYTES), plus the form fields. */
const uploadMeasurements: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) return next(new InvalidError('Send the measurements as multipart/form-data, the file in a part named "file".', 'file'));
  const refused = plainMultipartOnly(req);
  if (refused) return next(refused);
  // file names as UTF-8, as browsers send them (busboy reads a filename parameter as latin1 otherwise)
  multer({ storage: multer.memoryStorage(), defParamCharset: 'utf8', limits: { fileSize: MAX_IMPORT_BYTES, files: 1, fields: 4, fieldSize: 1024, parts: 6 } }).single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'too_large', `The file is larger than the ${MAX_IMPORT_BYTES / 1024 / 1024} MB limit.`, 'file'));
      return next(new InvalidError(`The upload is not one measurement file in a part named "file" (${err.code.toLowerCase().replace(/_/g, ' ')}).`, 'file'));
    }
    next(err);
  });
};

/** The import's file and form fields, checked (400 naming the field). */
function importInput(req: Parameters<RequestHandler>[0]) {
  if (!req.file) throw new InvalidError('Choose a spectrophotometer file (CGATS.17 text, .ti3 or .sp) in the part named "file".', 'file');
  const fields = swatchImportFieldsSchema.safeParse(req.body ?? {});
  if (!fields.success) throw zodToInvalid(fields.error);
  return { file: req.file, fields: fields.data };
}

/** Swatches: viewers read; contributors add and edit their own department's; editors and owners any. */
export function swatchesRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new SwatchesService(ctx.ds, ctx.env.dataDir);
  const tones = new ToneService(ctx.ds, ctx.env.dataDir);

  productionRoute(r, ctx, 'get', '/swatches', 'viewer', handle(async (req, res) => {
    const d = departmentSchema.safeParse(req.query.department);
    res.json({ swatches: await svc.list(pid(req), { department: d.success ? d.data : undefined, spectra: req.query.spectra === '1' }) });
  }));
  productionRoute(r, ctx, 'post', '/swatches', 'contributor', validate(swatchCreateSchema), handle(async (req, res) => {
    res.status(201).json({ swatch: await svc.create(req.membership!, req.body) });
  }));
  productionRoute(r, ctx, 'post', '/swatches/import/preview', 'contributor', uploadMeasurements, handle(async (req, res) => {
    const { file, fields } = importInput(req);
    res.json({ preview: await svc.importPreview(req.membership!, file, fields) });
  }));
  productionRoute(r, ctx, 'post', '/swatches/import', 'contributor', uploadMeasurements, handle(async (req, res) => {
    const { file, fields } = importInput(req);
    res.status(201).json({ swatches: await svc.importFile(req.membership!, file, fields) });
  }));
  productionRoute(r, ctx, 'get', '/swatches/:swatchId/tones', 'viewer', handle(async (req, res) => {
    res.json(await tones.swatchTones(pid(req), idParam(req.params.swatchId, 'Swatch')));
  }));
  productionRoute(r, ctx, 'post', '/swatches/:swatchId/duplicate', 'contributor', handle(async (req, res) => {
    res.status(201).json({ swatch: await svc.duplicate(req.membership!, idParam(req.params.swatchId, 'Swatch')) });
  }));
  itemRoutes(r, ctx, { plural: 'swatches', param: 'swatchId', key: 'swatch', what: 'Swatch', read: 'viewer', write: 'contributor', updateSchema: swatchUpdateSchema }, svc);
  return r;
}
