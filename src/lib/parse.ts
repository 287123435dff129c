import type { z } from 'zod';
import { ApiError } from './api.ts';

/**
 * Checks a server answer against its contract schema (src/domain/contracts), so a drift
 * between server and client shows up as a clear error naming the field, not as `undefined`
 * deep inside a screen.
 */
export function parseResponse<S extends z.ZodType>(schema: S, data: unknown, what: string): z.output<S> {
  const result = schema.safeParse(data);
  if (result.success) return result.data;
  const first = result.error.issues[0];
  const where = first?.path.map(String).join('.') || 'body';
  throw new ApiError(500, 'bad_response', `The server's answer for ${what} was not understood (${where}: ${first?.message ?? 'invalid'}).`);
}
