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

/** body-parser and router errors that carry a 4xx status meant for the client (unsupported charset, bad encoding, an undecodable path). */
function isClientHttpError(err: unknown): err is { status: number; message: string; expose?: boolean } {
  const e = err as { status?: unknown; expose?: unknown };
  return !!e && typeof e.status === 'number' && e.status >= 400 && e.status < 500 && e.expose !== false;
}

function fromClientHttpError(err: { status: number; message: string; type?: string }): AppError {
  if (err.status === 413) return new AppError('too_large', `The request is too large: ${err.message}.`);
  if (err.status === 415) return new AppError('unsupported_type', `The request's content type or encoding is not accepted: ${err.message}.`);
  return invalid(`The request could not be read: ${err.message}.`);
}

/** PostgreSQL's data exceptions (class 22) and integrity violations (class 23). */
function isPgDataError(err: unknown): err is { code: string; message: string; constraint?: string; column?: string } {
  const e = err as { code?: unknown; severity?: unknown };
  return !!e && typeof e.code === 'string' && /^2[23][0-9A-Z]{3}$/.test(e.code) && typeof e.severity === 'string';
}

function fromPgDataError(err: { code: string; message: string; constraint?: string; column?: string }): AppError {
  const where = err.column ? ` (field ${err.column})` : err.constraint ? ` (rule ${err.constraint})` : '';
  if (err.code === '23505') return new AppError('conflict', `This would duplicate an existing record${where}.`, { code: 'duplicate' });
  if (err.code === '23503') return new AppError('conflict', `This refers to a record that does not exist, or is still referred to by another${where}.`, { code: 'reference' });
  if (err.code.startsWith('23')) return invalid(`A value breaks a rule of the stored data${where}: ${err.message}.`, undefined, 'constraint');
  return invalid(`A value in the request cannot be stored${where}: ${err.message}.`, undefined, 'value_not_storable');
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let appErr: AppError;
  if (err instanceof AppError) appErr = err;
  else if (err instanceof ZodError) appErr = invalid('Some fields are not valid.', zodIssues(err));
  else if (err?.type === 'entity.too.large') appErr = new AppError('too_large', `The request body is larger than the limit of ${err.limit} bytes.`);
  else if (err?.type === 'entity.parse.failed') appErr = invalid('The request body is not valid JSON.');
  else if (err?.code === 'EBADCSRFTOKEN' || err?.message === 'invalid csrf token') appErr = new AppError('csrf', 'The form expired or the request lacks its security token. Reload and try again.');
  else if (isClientHttpError(err)) appErr = fromClientHttpError(err);
  else if (isDatabaseUnavailable(err)) {
    appErr = new AppError('unavailable', 'The database is not reachable right now. Try again in a moment.');
    res.setHeader('Retry-After', '5');
  } else if (isPgDataError(err)) {
    // A value got past validation that the database refuses: the request is at fault, not the server.
    // Logged as a warning, because the route's schema should have caught it.
    req.log?.warn({ err }, 'database refused a value');
    appErr = fromPgDataError(err);
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
