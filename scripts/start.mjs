// `npm start`: installs what is missing, starts PostgreSQL on loopback (unless DATABASE_URL is set),
// migrates, seeds the demo data into an empty database, builds the client and serves everything
// from one Express process. `npm run dev` does the same with Vite's dev server and hot reload.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureNodeModules } from './lib/setup.mjs';
import { startCluster } from './lib/postgres.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const dev = process.argv.includes('--dev');
const log = (m) => console.log(`[ballast] ${m}`);

ensureNodeModules(root, log);

const dataDir = join(root, '.data');
mkdirSync(dataDir, { recursive: true });

let cluster;
let databaseUrl = process.env.DATABASE_URL;
if (databaseUrl) {
  log('DATABASE_URL is set: using that PostgreSQL server, starting none.');
} else {
  cluster = await startCluster({ dataDir: join(dataDir, 'pg'), port: Number(process.env.BALLAST_PG_PORT ?? 54329), persistent: true, log });
  databaseUrl = cluster.url;
  log(`PostgreSQL is listening on 127.0.0.1:${cluster.port} (data in ${cluster.pgdata}).`);
}

// One session secret per installation, kept out of git, so sessions survive restarts.
const secretFile = join(dataDir, 'session-secret');
if (!process.env.SESSION_SECRET && !existsSync(secretFile)) writeFileSync(secretFile, randomBytes(32).toString('hex'), { mode: 0o600 });
const env = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  SESSION_SECRET: process.env.SESSION_SECRET ?? readFileSync(secretFile, 'utf8').trim(),
  PORT: process.env.PORT ?? '3000',
};

const node = process.execPath;
const step = (what, args) => {
  log(what);
  const r = spawnSync(node, args, { cwd: root, env, stdio: 'inherit' });
  if (r.status !== 0) {
    cluster?.stop();
    process.exit(r.status ?? 1);
  }
};
// BALLAST_DEMO=false keeps the demo scenario out of a real installation's empty database.
const seedDemo = process.env.BALLAST_DEMO !== 'false';
step(seedDemo ? 'Migrating and seeding the demo data (only into an empty database)…' : 'Migrating…', ['--import', 'tsx', 'scripts/migrate-and-seed.ts', ...(seedDemo ? ['--seed'] : [])]);

const children = [];
if (dev) {
  children.push(spawn(node, ['--import', 'tsx', '--watch', 'server/index.ts'], { cwd: root, env: { ...env, BALLAST_MIGRATE_ON_START: 'false' }, stdio: 'inherit' }));
  children.push(spawn(node, [join(root, 'node_modules/vite/bin/vite.js'), '--host', '127.0.0.1'], { cwd: root, env, stdio: 'inherit' }));
  log('Development: open http://127.0.0.1:5173 (Vite, hot reload); the API runs on port ' + env.PORT + '.');
} else {
  step('Building the client…', [join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn']);
  children.push(spawn(node, ['--import', 'tsx', 'server/index.ts'], { cwd: root, env: { ...env, CLIENT_DIST: join(root, 'dist/client'), BALLAST_MIGRATE_ON_START: 'false' }, stdio: 'inherit' }));
  log(`Open ${env.APP_URL ?? `http://127.0.0.1:${env.PORT}`} and sign in with a demo account from the README. Ctrl-C stops everything.`);
}

let stopping = false;
const stopAll = (signal) => {
  if (stopping) return;
  stopping = true;
  for (const c of children) if (c.exitCode === null) c.kill(signal);
};
process.on('SIGINT', () => stopAll('SIGINT'));
process.on('SIGTERM', () => stopAll('SIGTERM'));

await Promise.all(children.map((c) => new Promise((resolve) => c.on('exit', resolve))));
if (cluster) {
  log('Stopping PostgreSQL…');
  cluster.stop({ remove: false });
}
log('Stopped.');
