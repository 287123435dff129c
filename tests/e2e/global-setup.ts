import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import type { Server } from 'node:http';
import { pino } from 'pino';
import type { TestProject } from 'vitest/node';
import { createDb } from '../../server/db/knex.ts';
import { migrateLatest } from '../../server/db/migrate.ts';
import { seed } from '../../seeds/01_demo.ts';
import { loadConfig } from '../../server/config/env.ts';
import { openDeps } from '../../server/deps.ts';
import { createApp } from '../../server/app.ts';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

/** Serves the built client and the API from one process, as `npm start` does, on a free port. */
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const { register } = await import('tsx/esm/api');
  register();
  let stopDb: (() => void) | undefined;
  if (!process.env.DATABASE_URL) {
    // @ts-expect-error plain JS module without types
    const { startCluster } = await import('../../scripts/lib/postgres.mjs');
    const cluster = await startCluster({ persistent: false, log: () => undefined });
    process.env.DATABASE_URL = cluster.url;
    stopDb = () => cluster.stop({ remove: true });
  }
  const db = createDb(process.env.DATABASE_URL!, 2);
  await migrateLatest(db);
  await seed(db);
  await db.destroy();

  if (!existsSync('dist/client/index.html')) {
    const r = spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], { stdio: 'inherit' });
    if (r.status !== 0) throw new Error('vite build failed');
  }
  // A free port first, so that links in e-mails (APP_URL) name the address the browser uses.
  // @ts-expect-error plain JS module without types
  const { freePort } = await import('../../scripts/lib/postgres.mjs');
  const port: number = await freePort();
  const config = loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', PORT: String(port), CLIENT_DIST: 'dist/client' });
  const deps = await openDeps(config, pino({ level: 'silent' }));
  const app = createApp(deps);
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  project.provide('baseUrl', `http://127.0.0.1:${port}`);
  return async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeAllConnections();
    await deps.close();
    stopDb?.();
  };
}
