import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { ZodType } from 'zod';
import { isCompanyAction, roleMay, membershipFor, type Action, type Actor } from '../../src/domain/policy/index.ts';
import type { UnitSystem } from '../../src/domain/units.ts';
import { AppError, forbidden, invalid, zodIssues } from './errors.ts';

/**
 * Every API route is declared with its access rule, and mounted through `mountRoutes`, which
 * records it in `routeTable`. Tests walk that table, so a new route cannot be left out of the
 * role and sign-in checks.
 */
export type Access =
  /** No sign-in needed. Exactly: sign-in, CSRF token, health, invitations, password reset. */
  | { kind: 'public' }
  /** Any signed-in person (own account). */
  | { kind: 'signed-in' }
  /** A policy action; production-scoped actions need `:productionId` in the path. */
  | { kind: 'action'; action: Action };

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteDef {
  method: Method;
  path: string;
  access: Access;
  body?: ZodType;
  query?: ZodType;
  /** Extra middleware before the handler (e.g. file uploads), after access checks. */
  before?: RequestHandler[];
  /**
   * The file this route takes, if any. Optional: an upload middleware in `before` marked with
   * `declareUpload` is found without it. Tests use it to throw hostile files at every upload.
   */
  upload?: UploadInfo;
  handler: (req: Request, res: Response) => unknown;
}

/** What an upload route accepts: the multipart form field, the size limit and the file name endings. */
export interface UploadInfo {
  field: string;
  maxBytes: number;
  /** Lower-case endings with the dot, e.g. ['.stl']. */
  extensions: string[];
}

/** Where `declareUpload` keeps an upload middleware's rule. */
const UPLOAD_INFO = Symbol.for('ballast.uploadInfo');

/** Marks an upload middleware with what it accepts, so the route table knows the route takes a file. */
export function declareUpload<T extends RequestHandler>(middleware: T, info: UploadInfo): T {
  return Object.assign(middleware, { [UPLOAD_INFO]: { field: info.field, maxBytes: info.maxBytes, extensions: [...info.extensions] } });
}

function uploadOf(def: RouteDef): UploadInfo | undefined {
  if (def.upload) return def.upload;
  for (const mw of def.before ?? []) {
    const info = (mw as unknown as Record<symbol, UploadInfo | undefined>)[UPLOAD_INFO];
    if (info) return info;
  }
  return undefined;
}

export interface MountedRoute {
  method: Method;
  path: string;
  access: Access;
  /** The body schema, when the route declares one (tests generate valid and hostile bodies from it). */
  body?: ZodType;
  /** The query schema, when the route declares one. */
  query?: ZodType;
  /** The file the route takes, when it takes one. */
  upload?: UploadInfo;
}

export const routeTable: MountedRoute[] = [];

/** An answer already serialized as JSON (a cached view), sent as it is instead of through res.json. */
export class JsonText {
  constructor(readonly text: string) {}
}

export function route(def: RouteDef): RouteDef {
  return def;
}

export const PUBLIC: Access = { kind: 'public' };
export const SIGNED_IN: Access = { kind: 'signed-in' };
export const can = (action: Action): Access => ({ kind: 'action', action });

declare module 'express-serve-static-core' {
  interface Request {
    actor?: Actor;
    /** The signed-in person's units (read with the actor), for figures written out in words. */
    units?: UnitSystem;
  }
}

export function mountRoutes(router: Router, base: string, defs: RouteDef[], csrfProtection: RequestHandler): void {
  for (const def of defs) {
    const chain: RequestHandler[] = [];
    if (def.access.kind !== 'public') chain.push(requireSignIn);
    if (def.method !== 'get') chain.push(csrfProtection);
    if (def.access.kind === 'action') chain.push(authorize(def.access.action));
    if (def.query) chain.push(validate('query', def.query));
    if (def.before) chain.push(...def.before);
    if (def.body) chain.push(validate('body', def.body));
    chain.push(async (req, res, next) => {
      try {
        const out = await def.handler(req, res);
        if (!res.headersSent) {
          if (out === undefined) res.status(204).end();
          else if (out instanceof JsonText) res.type('application/json').send(out.text);
          else res.json(out);
        }
      } catch (err) {
        next(err);
      }
    });
    router[def.method](def.path, ...chain);
    const path = base + def.path;
    if (!routeTable.some((r) => r.method === def.method && r.path === path)) {
      const upload = uploadOf(def);
      routeTable.push({ method: def.method, path, access: def.access, ...(def.body ? { body: def.body } : {}), ...(def.query ? { query: def.query } : {}), ...(upload ? { upload } : {}) });
    }
  }
}

const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.actor) next(new AppError('unauthenticated', 'Sign in to continue.'));
  else next();
};

/**
 * Coarse check by role, before any row is read: the person is a member of the production in the
 * path and their role may take this action at all. Services make the fine checks (venue scope,
 * authorship) with the same policy module once the rows are loaded.
 */
function authorize(action: Action): RequestHandler {
  return (req, _res, next) => {
    const actor = req.actor!;
    const productionId = req.params.productionId as string | undefined;
    if (isCompanyAction(action) || !productionId) {
      next(roleMay(null, actor.isAdmin, action) ? undefined : forbidden('Only an administrator may do this.'));
      return;
    }
    const m = membershipFor(actor, productionId);
    if (!m) {
      // Not telling whether the production exists: the same answer as for a stranger's id.
      next(forbidden('You are not a member of this production.'));
      return;
    }
    next(roleMay(m.role, actor.isAdmin, action) ? undefined : forbidden(`The ${m.role} role may not do this.`));
  };
}

function validate(where: 'body' | 'query', schema: ZodType): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    const parsed = schema.safeParse(where === 'body' ? (req.body ?? {}) : req.query);
    if (!parsed.success) {
      next(invalid(where === 'body' ? 'Some fields are not valid.' : 'Some query parameters are not valid.', zodIssues(parsed.error)));
      return;
    }
    if (where === 'body') req.body = parsed.data;
    else Object.defineProperty(req, 'query', { value: parsed.data, writable: true });
    next();
  };
}

/** Reads a uuid path parameter, answering 404 for anything that is not one. */
export function uuidParam(req: Request, name: string): string {
  const v = req.params[name];
  if (typeof v !== 'string' || !/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v)) {
    throw new AppError('not_found', `No ${name.replace(/Id$/, '')} with that id.`);
  }
  return v;
}
