import { randomUUID } from 'node:crypto';
import { rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import multer from 'multer';
import type { RequestHandler } from 'express';
import { can, declareUpload, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { AppError } from '../../http/errors.ts';
import type { AppDeps } from '../../app.ts';
import { formatBytes } from '../machine/upload.ts';
import { ARCHIVE_LIMITS } from './archive-format.ts';
import { archiveName, restoreArchive, writeArchive } from './archive.service.ts';

const ARCHIVE_UPLOAD = { field: 'archive', maxBytes: ARCHIVE_LIMITS.uploadBytes, extensions: ['.tar.gz', '.tgz'] };

/**
 * The uploaded archive goes to a temporary file (it is read twice, and may be larger than is wise to hold in
 * memory), under a name of our own: the name the browser sends is never used as a path. Removed after the
 * restore, whatever its outcome (multer removes it itself when the upload is refused).
 */
function archiveUpload(): RequestHandler {
  const upload = multer({
    storage: multer.diskStorage({ destination: tmpdir(), filename: (_req, _file, cb) => cb(null, `ballast-restore-${randomUUID()}.upload`) }),
    limits: { fileSize: ARCHIVE_UPLOAD.maxBytes, files: 1, fields: 5, fieldSize: 1024 },
    fileFilter(_req, file, cb) {
      const name = file.originalname.toLowerCase();
      if (ARCHIVE_UPLOAD.extensions.some((ext) => name.endsWith(ext))) cb(null, true);
      else cb(new AppError('unsupported_type', `"${file.originalname.slice(0, 200)}" is not a production archive; only ${ARCHIVE_UPLOAD.extensions.join(', ')} files made by Ballast's archive download are accepted.`));
    },
  }).single(ARCHIVE_UPLOAD.field);
  const handler: RequestHandler = (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof AppError) return next(err);
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError('too_large', `The archive is larger than the limit of ${formatBytes(ARCHIVE_UPLOAD.maxBytes)} for an upload.`));
        if (err.code === 'LIMIT_UNEXPECTED_FILE') return next(new AppError('invalid', `Send the archive in the form field "${ARCHIVE_UPLOAD.field}" (one file only).`));
        return next(new AppError('invalid', `The upload was refused: ${err.message}.`));
      }
      next(err);
    });
  };
  return declareUpload(handler, ARCHIVE_UPLOAD);
}

/** Export a whole production as one archive file, and restore one into this installation (administrators). */
export function archiveRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  return [
    route({
      method: 'get',
      path: '/productions/:productionId/archive',
      access: can('production.archive'),
      async handler(req, res) {
        const productionId = uuidParam(req, 'productionId');
        const { fileName } = await archiveName(db, productionId);
        res.status(200);
        res.setHeader('Content-Type', 'application/gzip');
        res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
        res.setHeader('Cache-Control', 'no-store');
        const started = Date.now();
        try {
          const figures = await writeArchive(db, productionId, res);
          req.log?.info({ productionId, ...figures, ms: Date.now() - started }, 'production archive written');
        } catch (err) {
          // Once bytes have gone out there is no error answer to give: the cut-short download fails its checks.
          if (!res.headersSent) throw err;
          req.log?.error({ err, productionId }, 'production archive cut short');
          res.destroy();
        }
      },
    }),
    route({
      method: 'post',
      path: '/archive/restore',
      access: can('production.archive'),
      before: [archiveUpload()],
      async handler(req, res) {
        const file = req.file;
        if (!file) throw new AppError('invalid', `Choose a production archive (${ARCHIVE_UPLOAD.extensions.join(' or ')}) to restore.`, { issues: [{ path: ARCHIVE_UPLOAD.field, message: 'Choose an archive file.' }] });
        try {
          const result = await restoreArchive(db, file.path);
          req.log?.info({ productionId: result.production.id, tables: result.tables.length, files: result.files }, 'production archive restored');
          res.status(201).json(result);
        } finally {
          await rm(file.path, { force: true });
        }
      },
    }),
  ];
}
