import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';

/**
 * Errors by meaning. Services throw these; only the error middleware turns them into HTTP
 * status codes, so services stay free of HTTP.
 */
export type ErrorKind = 'invalid' | 'unauthenticated' | 'forbidden' | 'csrf' | 'not_found' | 'conflict' | 'rate_limited' | 'too_large' | 'unsupported_type' | 'unavailable';

const STATUS: Record<ErrorKind, number> = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  csrf: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_type: 415,
  rate_limited: 429,
  unavailable: 503,
};

export interface FieldIssue {
  path: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    readonly kind: ErrorKind,
    message: string,
    readonly details: { issues?: FieldIssue[]; current?: unknown; code?: string; retryAfterSeconds?: number } = {},
  ) {
    super(message);
  }
}

export const notFound = (what: string) => new AppError('not_found', `${what} was not found.`);
export const forbidden = (reason: string) => new AppError('forbidden', reason);
export const invalid = (message: string, issues?: FieldIssue[], code?: string) => new AppError('invalid', message, { issues, code });
/** A save against a stale version: the current record goes back so the client can reload or merge. */
export const conflict = (current: unknown) =>
  new AppError('conflict', 'Someone else saved this in the meantime. Reload to see their version, or keep yours and save again.', { current });

export function zodIssues(err: ZodError, prefix?: string): FieldIssue[] {
  return err.issues.map((i) => ({
    path: [prefix, ...i.path.map(String)].filter(Boolean).join('.') || '(body)',
    message: i.message,
  }));
}

/** Connection-level database failures: answered with 503 rather than a crash or a hang. */
function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: string; message?: string; name?: string };
  if (!e) return false;
  if (['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03', '08000', '08003', '08006', '08001', '08004'].includes(e.code ?? '')) return true;
  return /Knex: Timeout acquiring a connection|Connection terminated|connection timeout|the database system is (starting|shutting) up/i.test(e.message ?? '');
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let appErr: AppError;
  if (err instanceof AppError) appErr = err;
  else if (err instanceof ZodError) appErr = invalid('Some fields are not valid.', zodIssues(err));
  else if (err?.type === 'entity.too.large') appErr = new AppError('too_large', `The request body is larger than the limit of ${err.limit} bytes.`);
  else if (err?.type === 'entity.parse.failed') appErr = invalid('The request body is not valid JSON.');
  else if (err?.code === 'EBADCSRFTOKEN' || err?.message === 'invalid csrf token') appErr = new AppError('csrf', 'The form expired or the request lacks its security token. Reload and try again.');
  else if (isDatabaseUnavailable(err)) {
    appErr = new AppError('unavailable', 'The database is not reachable right now. Try again in a moment.');
    res.setHeader('Retry-After', '5');
  } else {
    req.log?.error({ err }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side. It has been logged.' } });
    return;
  }
  if (appErr.details.retryAfterSeconds) res.setHeader('Retry-After', String(appErr.details.retryAfterSeconds));
  res.status(STATUS[appErr.kind]).json({
    error: {
      code: appErr.details.code ?? appErr.kind,
      message: appErr.message,
      ...(appErr.details.issues ? { issues: appErr.details.issues } : {}),
      ...(appErr.details.current !== undefined ? { current: appErr.details.current } : {}),
    },
  });
};
