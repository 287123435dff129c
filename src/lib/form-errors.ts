import type { z } from 'zod';
import { ApiError, errorMessage } from './api.ts';

/** Field path (dotted, e.g. `membership.role`) → the first message about that field. */
export type FieldErrors = Record<string, string>;

/** First message per field from a failed zod parse of a form. */
export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.');
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}

/** First message per field from a 400 the server sent back (its `issues`), if any. */
export function apiFieldErrors(error: unknown): FieldErrors {
  const out: FieldErrors = {};
  if (!(error instanceof ApiError)) return out;
  for (const issue of error.issues) {
    // Servers may prefix paths with `body.`; the form only knows its own field names.
    const key = issue.path.replace(/^body\./, '');
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}

/**
 * Validates form values with a schema; on failure returns the field errors instead of throwing.
 */
export function validate<S extends z.ZodType>(
  schema: S,
  values: unknown,
): { ok: true; data: z.output<S> } | { ok: false; errors: FieldErrors } {
  const result = schema.safeParse(values);
  return result.success ? { ok: true, data: result.data } : { ok: false, errors: zodFieldErrors(result.error) };
}

/**
 * The message to show above a form for a failed submit, or null when every problem is already
 * shown next to one of the form's own `fields`.
 */
export function formLevelError(error: unknown, fields: readonly string[]): string | null {
  if (!error) return null;
  if (error instanceof ApiError && error.issues.length > 0) {
    const placed = apiFieldErrors(error);
    if (Object.keys(placed).every((key) => fields.includes(key))) return null;
  }
  return errorMessage(error);
}

/** The error for `field` or for any part of it (e.g. `venueIds.2` counts for `venueIds`). */
export function fieldError(errors: FieldErrors, field: string): string | undefined {
  if (errors[field]) return errors[field];
  const key = Object.keys(errors).find((k) => k.startsWith(`${field}.`));
  return key ? errors[key] : undefined;
}
