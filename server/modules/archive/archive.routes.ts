import { rm } from 'node:fs/promises';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import type { AppDeps } from '../../app.ts';
import { requireFile, singleUpload, type UploadRule } from '../machine/upload.ts';
import { ARCHIVE_LIMITS } from './archive-format.ts';
import { archiveName, restoreArchive, writeArchive } from './archive.service.ts';

/**
 * The uploaded archive goes to a temporary file: it is read twice, and may be larger than is wise to hold in
 * memory. Removed after the restore, whatever its outcome.
 */
const ARCHIVE_UPLOAD: UploadRule = { field: 'archive', maxBytes: ARCHIVE_LIMITS.uploadBytes, extensions: ['.tar.gz', '.tgz'], label: "a production archive made by Ballast's archive download" };

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
      before: [singleUpload(ARCHIVE_UPLOAD, { toDisk: true })],
      async handler(req, res) {
        const file = requireFile(req.file, ARCHIVE_UPLOAD);
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
