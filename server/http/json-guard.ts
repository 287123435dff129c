import type { RequestHandler } from 'express';
import { AppError } from './errors.ts';

/** Deeper than any Ballast request needs (the deepest contract nests about 6 levels). */
export const MAX_JSON_DEPTH = 32;

/** Keys that could reach an object's prototype when a body is merged or assigned somewhere. */
const PROTOTYPE_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/**
 * Refuses JSON bodies that no form sends, before any route sees them: nesting deeper than MAX_JSON_DEPTH,
 * keys that reach an object's prototype (`__proto__`, `constructor`, `prototype`), and text with a NUL
 * character (PostgreSQL cannot store it, and it cuts strings short in C libraries). Each refusal is a 400
 * naming where in the body the problem is.
 *
 * zod's object schemas drop unknown keys, so these would mostly be harmless; refusing them here keeps that
 * true for every route, including ones that read `req.body` before or without a schema. The walk uses an
 * explicit stack, so a hostile depth cannot overflow the call stack.
 */
export const jsonGuard: RequestHandler = (req, _res, next) => {
  const body: unknown = req.body;
  if (body === null || typeof body !== 'object') {
    next();
    return;
  }
  const stack: { value: unknown; path: string; depth: number }[] = [{ value: body, path: '', depth: 1 }];
  while (stack.length) {
    const { value, path, depth } = stack.pop()!;
    if (typeof value === 'string') {
      if (value.includes('\u0000')) {
        next(refuse(path, 'contains a NUL character (\\u0000), which text may not hold.'));
        return;
      }
      continue;
    }
    if (value === null || typeof value !== 'object') continue;
    if (depth > MAX_JSON_DEPTH) {
      next(refuse(path, `is nested deeper than the limit of ${MAX_JSON_DEPTH} levels.`));
      return;
    }
    const entries: [string, unknown][] = Array.isArray(value) ? value.map((v, i) => [String(i), v]) : Object.entries(value);
    for (const [key, child] of entries) {
      const childPath = path ? `${path}.${key}` : key;
      if (!Array.isArray(value) && PROTOTYPE_KEYS.has(key)) {
        next(refuse(childPath, `uses the reserved key "${key}", which is not accepted in any request.`));
        return;
      }
      if (key.includes('\u0000')) {
        next(refuse(childPath, 'has a key with a NUL character (\\u0000).'));
        return;
      }
      stack.push({ value: child, path: childPath, depth: depth + 1 });
    }
  }
  next();
};

function refuse(path: string, problem: string): AppError {
  const where = path || '(body)';
  return new AppError('invalid', `The request body is not accepted: ${where} ${problem}`, { code: 'body_refused', issues: [{ path: where, message: problem }] });
}
