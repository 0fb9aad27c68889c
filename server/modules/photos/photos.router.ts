import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import crypto from 'node:crypto';
import path from 'node:path';
import type { AppContext } from '../../context';
import { plainMultipartOnly, validate, zodToInvalid } from '../../middleware/validate';
import { AppError, InvalidError } from '../../errors';
import { handle, productionRoute, pid, idParam } from '../route-registry';
import { MAX_PHOTO_BYTES, MAX_PHOTO_PIXELS, photoLookRequestSchema, uncertaintyRequestSchema, photoUpdateSchema, photoUploadFieldsSchema, renderRequestSchema } from '../../../shared/schemas/photo';
import { DEFAULT_QUOTA_BYTES, PhotosService } from './photos.service';
import { attachmentHeader, originalDownloadName } from './photo-names';
import { removeQuietly } from './photo-storage';

const services = new WeakMap<AppContext, PhotosService>();

/** The photos service of an app (one per app: it owns the render queue and the sweep). Tests reach its limits here. */
export function photosService(ctx: AppContext): PhotosService {
  let s = services.get(ctx);
  if (!s) {
    const limits = { maxBytes: MAX_PHOTO_BYTES, maxPixels: MAX_PHOTO_PIXELS, quotaBytes: ctx.env.productionQuotaBytes ?? DEFAULT_QUOTA_BYTES };
    services.set(ctx, (s = new PhotosService(ctx.ds, ctx.env.dataDir, limits)));
  }
  return s;
}

/** Stops the photos service of an app, if it started one (its periodic sweep; waits for a running render). The app's close() calls it. */
export async function closePhotos(ctx: AppContext): Promise<void> {
  await services.get(ctx)?.close();
}

const mb = (n: number) => (n >= 1024 * 1024 ? `${Math.round(n / 1024 / 1024)} MB` : `${Math.round(n / 1024)} kB`);

/**
 * multer with the current limits: one file part named `file`, to disk under uploads/.incoming, random
 * names; file names decoded as UTF-8 (busboy's default for a `filename` parameter is latin1, which garbles
 * `Gâteau — costume.jpg`; browsers send UTF-8 there, per the HTML standard's multipart/form-data). Every
 * incoming file it starts is removed when the upload fails, whatever failed (multer's own clean-up, and
 * here once more when the request ends without multer answering, e.g. a client gone mid-transfer).
 */
function uploadOne(svc: PhotosService): RequestHandler {
  return (req, res, next) => {
    const refused = plainMultipartOnly(req);
    if (refused) return next(refused);
    const started: string[] = [];
    let settled = false;
    res.once('close', () => {
      if (!settled) for (const p of started) removeQuietly(p);
    });
    const upload = multer({
      storage: multer.diskStorage({
        destination: svc.storage.incomingDir,
        filename: (_req, _file, cb) => {
          const name = `${crypto.randomBytes(16).toString('hex')}.upload`;
          started.push(path.join(svc.storage.incomingDir, name));
          cb(null, name);
        },
      }),
      defParamCharset: 'utf8',
      limits: { fileSize: svc.limits.maxBytes, files: 1, fields: 4, fieldSize: 8 * 1024, parts: 6 },
    }).single('file');
    upload(req, res, (err: unknown) => {
      settled = true;
      if (!err) return next();
      for (const p of started) removeQuietly(p);
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'too_large', `The file is larger than the ${mb(svc.limits.maxBytes)} limit.`, 'file'));
        if (err.code === 'LIMIT_FIELD_VALUE') return next(new InvalidError(`${err.field ?? 'A field'}: the text is longer than ${mb(8 * 1024)}.`, err.field));
        return next(new InvalidError(`The upload is not one image in a part named "file" (${err.code.toLowerCase().replace(/_/g, ' ')}).`, 'file'));
      }
      next(err);
    });
  };
}

/**
 * Photos under /api/productions/:productionId: viewers list, view, download and render them;
 * contributors upload, and rename or delete their own department's (editors and owners any).
 */
export function photosRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = photosService(ctx);
  const photoId = (req: { params: object }) => idParam((req.params as Record<string, string>).photoId, 'Photo');

  productionRoute(r, ctx, 'get', '/photos', 'viewer', handle(async (req, res) => void res.json({ photos: await svc.list(pid(req)) })));
  productionRoute(r, ctx, 'post', '/photos', 'contributor', uploadOne(svc), handle(async (req, res) => {
    const file = req.file;
    try {
      if (!file) throw new InvalidError('Choose an image file to upload (a JPEG, PNG, TIFF or WebP).', 'file');
      const fields = photoUploadFieldsSchema.safeParse(req.body ?? {});
      if (!fields.success) throw zodToInvalid(fields.error);
      res.status(201).json({ photo: await svc.create(req.membership!, file, fields.data) });
    } finally {
      // a refused upload leaves nothing: the incoming file goes whatever happened (create moved it when it kept it)
      if (file) removeQuietly(file.path);
    }
  }));
  productionRoute(r, ctx, 'get', '/photos/:photoId', 'viewer', handle(async (req, res) => void res.json({ photo: await svc.get(pid(req), photoId(req)) })));
  productionRoute(r, ctx, 'patch', '/photos/:photoId', 'contributor', validate(photoUpdateSchema), handle(async (req, res) => {
    res.json({ photo: await svc.update(req.membership!, photoId(req), req.body) });
  }));
  productionRoute(r, ctx, 'delete', '/photos/:photoId', 'contributor', handle(async (req, res) => {
    await svc.remove(req.membership!, photoId(req));
    res.status(204).end();
  }));
  for (const which of ['preview', 'thumb', 'original'] as const) {
    productionRoute(r, ctx, 'get', `/photos/:photoId/${which}`, 'viewer', handle(async (req, res) => {
      const f = await svc.file(pid(req), photoId(req), which);
      res.setHeader('Cache-Control', 'private, max-age=86400, immutable');
      // the browser keeps to the declared type (a crafted file is never run as a page or script)
      res.setHeader('X-Content-Type-Options', 'nosniff');
      if (which === 'original') res.setHeader('Content-Disposition', attachmentHeader(originalDownloadName(f.photo)));
      res.type(f.type).sendFile(f.path);
    }));
  }
  productionRoute(r, ctx, 'post', '/photos/:photoId/renders', 'viewer', validate(renderRequestSchema), handle(async (req, res) => {
    const s = await svc.startRender(pid(req), photoId(req), req.body);
    res.status(s.status === 'done' ? 200 : 202).json({ render: s });
  }));
  productionRoute(r, ctx, 'get', '/photos/:photoId/renders/:renderKey', 'viewer', handle(async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ render: await svc.renderStatus(pid(req), photoId(req), String(req.params.renderKey)) });
  }));
  productionRoute(r, ctx, 'get', '/photos/:photoId/renders/:renderKey/file', 'viewer', handle(async (req, res) => {
    const look = req.query.look;
    if (look !== undefined && (typeof look !== 'string' || !/^[1-9]\d{0,9}$/.test(look))) throw new InvalidError('look: give the id of a saved look (a whole number).', 'look');
    const f = await svc.renderFile(pid(req), photoId(req), String(req.params.renderKey), look === undefined ? undefined : Number(look));
    res.setHeader('Cache-Control', 'private, max-age=86400, immutable');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Disposition', attachmentHeader(f.downloadName));
    res.type(f.type).sendFile(f.path);
  }));
  productionRoute(r, ctx, 'post', '/photo-uncertainty', 'viewer', validate(uncertaintyRequestSchema), handle(async (req, res) => {
    const s = await svc.startUncertainty(pid(req), req.body);
    res.status(s.status === 'done' ? 200 : 202).json({ uncertainty: s });
  }));
  productionRoute(r, ctx, 'get', '/photo-uncertainty/:key', 'viewer', handle(async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ uncertainty: svc.uncertaintyStatus(pid(req), String(req.params.key)) });
  }));
  productionRoute(r, ctx, 'post', '/photo-looks', 'viewer', validate(photoLookRequestSchema), handle(async (req, res) => {
    res.json({ look: await svc.photoLook(pid(req), req.body) });
  }));
  return r;
}
