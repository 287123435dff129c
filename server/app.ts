import express, { Router, type RequestHandler } from 'express';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { csrfSync } from 'csrf-sync';
import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Knex } from 'knex';
import type pg from 'pg';
import type { Logger } from 'pino';
import type { Config } from './config/env.ts';
import type { Mailer } from './mail/mailer.ts';
import { AppError, errorHandler } from './http/errors.ts';
import { mountRoutes, type RouteDef } from './http/routes.ts';
import { jsonGuard } from './http/json-guard.ts';
import { createPassport, loadActor } from './modules/auth/passport.ts';
import { createSignInLimiter, type SignInLimiter } from './modules/auth/sign-in-limiter.ts';
import { throttleTouch } from './modules/auth/session-touch.ts';
import { authRoutes } from './modules/auth/auth.routes.ts';
import { healthRoutes } from './modules/health/health.routes.ts';
import { productionRoutes } from './modules/productions/productions.routes.ts';
import { adminRoutes } from './modules/admin/admin.routes.ts';
import { invitationRoutes } from './modules/invitations/invitations.routes.ts';
import { machineRoutes } from './modules/machine/machine.routes.ts';
import { venueRoutes } from './modules/venues/venues.routes.ts';
import { tourRoutes } from './modules/tour/tour.routes.ts';
import { liftingRoutes } from './modules/lifting/lifting.routes.ts';
import { crateRoutes } from './modules/crates/crates.routes.ts';
import { loadRoutes } from './modules/loads/loads.routes.ts';
import { splitRoutes } from './modules/split/split.routes.ts';
import { impactRoutes } from './modules/impact/impact.routes.ts';
import { documentRoutes } from './modules/documents/documents.routes.ts';
import { archiveRoutes } from './modules/archive/archive.routes.ts';

export interface AppDeps {
  config: Config;
  db: Knex;
  /** pg pool for the session store (connect-pg-simple takes a pg pool, not knex). */
  sessionPool: pg.Pool;
  mailer: Mailer;
  log: Logger;
  csrf: ReturnType<typeof csrfSync>;
  signInLimiter: SignInLimiter;
  sessionCookieName: string;
  passport: ReturnType<typeof createPassport>;
}

export type BaseDeps = Pick<AppDeps, 'config' | 'db' | 'sessionPool' | 'mailer' | 'log'>;

/** Every module's routes under their base path. Tests read the same list through routeTable. */
function modules(deps: AppDeps): [string, RouteDef[]][] {
  return [
    ['/api', healthRoutes(deps)],
    ['/api/auth', authRoutes(deps)],
    ['/api/invitations', invitationRoutes(deps)],
    ['/api/productions', productionRoutes(deps)],
    ['/api/admin', adminRoutes(deps)],
    ['/api/productions/:productionId/machine', machineRoutes(deps)],
    ['/api/productions/:productionId/venues', venueRoutes(deps)],
    ['/api/productions/:productionId/tour', tourRoutes(deps)],
    ['/api/productions/:productionId/lifting', liftingRoutes(deps)],
    ['/api/productions/:productionId/crates', crateRoutes(deps)],
    ['/api/productions/:productionId/loads', loadRoutes(deps)],
    ['/api/productions/:productionId/split', splitRoutes(deps)],
    ['/api/productions/:productionId/impact', impactRoutes(deps)],
    ['/api/productions/:productionId/documents', documentRoutes(deps)],
    ['/api', archiveRoutes(deps)],
  ];
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(base: BaseDeps): express.Express {
  const { config, log } = base;
  const csrf = csrfSync({ getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined });
  const deps: AppDeps = {
    ...base,
    csrf,
    signInLimiter: createSignInLimiter(base.db, {
      perAccount: config.SIGNIN_MAX_PER_ACCOUNT,
      perAddress: config.SIGNIN_MAX_PER_ADDRESS,
      windowSeconds: config.SIGNIN_WINDOW_SECONDS,
    }),
    sessionCookieName: 'ballast.sid',
    passport: createPassport({ db: base.db, mailer: base.mailer, appUrl: config.APP_URL, log }),
  };

  const app = express();
  app.disable('x-powered-by');
  if (config.TRUST_PROXY) app.set('trust proxy', parseTrustProxy(config.TRUST_PROXY));

  app.use(
    pinoHttp({
      logger: log,
      genReqId: (req, res) => {
        const given = req.headers['x-request-id'];
        const id = typeof given === 'string' && /^[\w-]{1,64}$/.test(given) ? given : randomUUID();
        res.setHeader('x-request-id', id);
        return id;
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // Log what helps to trace a request, never cookies, tokens or bodies.
      serializers: {
        req: (req: { id: string; method: string; url: string; remoteAddress?: string }) => ({ id: req.id, method: req.method, url: req.url, remoteAddress: req.remoteAddress }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // three.js compiles shaders; WebGL needs no eval. Everything is served from this origin.
          'img-src': ["'self'", 'data:', 'blob:'],
          'worker-src': ["'self'", 'blob:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': config.NODE_ENV === 'production' && config.APP_URL.startsWith('https') ? [] : null,
        },
      },
    }),
  );
  app.use(express.json({ limit: '1mb' }));
  app.use(jsonGuard);

  const PgStore = connectPgSimple(session);
  app.use(
    '/api',
    session({
      name: deps.sessionCookieName,
      // The stored expiry moves forward at most once a minute per session (session-touch.ts).
      store: throttleTouch(new PgStore({ pool: base.sessionPool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60, errorLog: (...args: unknown[]) => log.warn({ detail: args.map(String) }, 'session store error') }), 60_000),
      secret: config.SESSION_SECRET,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: 12 * 60 * 60 * 1000 },
    }),
  );
  app.use('/api', deps.passport.initialize(), deps.passport.session(), loadActor(base.db));

  for (const [path, defs] of modules(deps)) {
    const router = Router({ mergeParams: true });
    mountRoutes(router, path, defs, csrf.csrfSynchronisedProtection as RequestHandler);
    app.use(path, router);
  }
  app.use('/api', (req, _res, next) => next(new AppError('not_found', `No API route ${req.method} ${req.originalUrl}.`)));

  if (config.CLIENT_DIST) {
    const dist = resolve(config.CLIENT_DIST);
    if (!existsSync(join(dist, 'index.html'))) throw new Error(`CLIENT_DIST ${dist} has no index.html: run npm run build first.`);
    app.use(express.static(dist, { index: false, maxAge: '1h', setHeaders: (res, p) => p.includes('/assets/') && res.setHeader('Cache-Control', 'public, max-age=31536000, immutable') }));
    // Client-side routes: everything else gets the app's page.
    app.get('/{*splat}', (_req, res) => res.sendFile(join(dist, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}

function parseTrustProxy(v: string): boolean | number | string {
  if (v === 'true') return true;
  if (v === 'false') return false;
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}
