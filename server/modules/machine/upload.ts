import { randomUUID } from 'node:crypto';
import { tmpdir } from 'node:os';
import multer from 'multer';
import type { RequestHandler } from 'express';
import { AppError } from '../../http/errors.ts';
import { declareUpload } from '../../http/routes.ts';

/**
 * One file from a multipart form, held in memory (the machine tables keep uploads in the database, so
 * nothing is left on disk), or with `toDisk` in a temporary file under a name of our own (the name the
 * browser sends is never used as a path; the route removes the file, multer does when it refuses the
 * upload). The limit and the accepted types are named in every refusal.
 */
export interface UploadRule {
  /** Form field of the file. */
  field: string;
  maxBytes: number;
  /** Lower-case extensions with the dot, e.g. ['.stl']. */
  extensions: string[];
  /** What the person should send, e.g. "an STL file (.stl)". */
  label: string;
}

export function formatBytes(n: number): string {
  return n >= 1024 * 1024 ? `${Math.round((n / 1024 / 1024) * 10) / 10} MB` : `${Math.round(n / 1024)} kB`;
}

export function singleUpload(rule: UploadRule, opts: { toDisk?: boolean } = {}): RequestHandler {
  const upload = multer({
    storage: opts.toDisk ? multer.diskStorage({ destination: tmpdir(), filename: (_req, _file, cb) => cb(null, `ballast-upload-${randomUUID()}.upload`) }) : multer.memoryStorage(),
    limits: { fileSize: rule.maxBytes, files: 1, fields: 20, fieldSize: 64 * 1024 },
    fileFilter(_req, file, cb) {
      const name = file.originalname.toLowerCase();
      if (rule.extensions.some((ext) => name.endsWith(ext))) cb(null, true);
      else cb(new AppError('unsupported_type', `"${file.originalname.slice(0, 200)}" is not ${rule.label}; only ${rule.extensions.join(', ')} files are accepted.`));
    },
  }).single(rule.field);
  const handler: RequestHandler = (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof AppError) return next(err);
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError('too_large', `The file is larger than the limit of ${formatBytes(rule.maxBytes)} for ${rule.label}.`));
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE') return next(new AppError('invalid', `Send the file in the form field "${rule.field}" (one file only).`));
        return next(new AppError('invalid', `The upload was refused: ${err.message}.`));
      }
      next(err);
    });
  };
  // Marked for the route table, so tests find every upload route without a list kept by hand.
  return declareUpload(handler, rule);
}

/** The uploaded file, or a 400 naming the field. */
export function requireFile(file: Express.Multer.File | undefined, rule: UploadRule): Express.Multer.File {
  if (!file) throw new AppError('invalid', `Choose ${rule.label} to upload.`, { issues: [{ path: rule.field, message: `Choose ${rule.label}.` }] });
  return file;
}
