// `npm run db:backup [-- <file or folder>]`: a pg_dump of Ballast's database in PostgreSQL's custom format
// (compressed; restored with `npm run db:restore -- <file>`). The database is the one DATABASE_URL names, else
// the cluster `npm start` keeps in .data/pg (its application role's credentials are in app-credentials.json).
// Plain Node, no TypeScript, so that it runs on a server with nothing but Node and PostgreSQL's client tools.
// The password goes to pg_dump through PGPASSWORD, never on its command line (where `ps` would show it).
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { findPgBin } from './lib/postgres.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

/** Where `npm start` keeps its cluster: .data/pg, or a folder under /var/lib/ballast when the project folder is not reachable by the postgres user (see lib/postgres.mjs). */
function startClusterDir() {
  const dir = join(root, '.data', 'pg');
  if (existsSync(join(dir, 'app-credentials.json'))) return dir;
  const key = createHash('sha256').update(dir).digest('hex').slice(0, 12);
  const moved = join('/var/lib/ballast', key, 'pg');
  return existsSync(join(moved, 'app-credentials.json')) ? moved : null;
}

/**
 * The connection to use, as libpq environment variables: from `--url`, DATABASE_URL, or the `npm start`
 * cluster's credentials file and its live port (postmaster.pid; else BALLAST_PG_PORT or 54329).
 */
export function connectionEnv(explicitUrl) {
  const url = explicitUrl ?? process.env.DATABASE_URL;
  if (url) {
    const u = new URL(url);
    if (!/^postgres(ql)?:$/.test(u.protocol)) throw new Error(`The database URL must start with postgres:// (got ${u.protocol}//).`);
    return {
      PGHOST: decodeURIComponent(u.hostname) || '127.0.0.1',
      PGPORT: u.port || '5432',
      PGUSER: decodeURIComponent(u.username),
      PGPASSWORD: decodeURIComponent(u.password),
      PGDATABASE: decodeURIComponent(u.pathname.replace(/^\//, '')),
      ...(u.searchParams.get('sslmode') ? { PGSSLMODE: u.searchParams.get('sslmode') } : {}),
    };
  }
  const dir = startClusterDir();
  if (!dir) throw new Error('No database to use: set DATABASE_URL, or run `npm start` once so that .data/pg exists.');
  const cred = JSON.parse(readFileSync(join(dir, 'app-credentials.json'), 'utf8'));
  let port = process.env.BALLAST_PG_PORT ?? '54329';
  try {
    const live = readFileSync(join(dir, 'data', 'postmaster.pid'), 'utf8').split('\n')[3];
    if (/^\d+$/.test(live ?? '')) port = live;
  } catch {
    // not running: the connection attempt below says so
  }
  return { PGHOST: '127.0.0.1', PGPORT: String(port), PGUSER: cred.user, PGPASSWORD: cred.password, PGDATABASE: cred.database };
}

/** A client tool (pg_dump, pg_restore, psql) from the newest installed server, else from PATH. */
export function pgTool(name) {
  const bin = findPgBin();
  return bin && existsSync(join(bin, name)) ? join(bin, name) : name;
}

/** Options and one positional argument, e.g. `--url postgres://… file.dump`. */
export function parseArgs(argv, flags = []) {
  const out = { positional: [], flags: new Set() };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--url') out.url = argv[++i];
    else if (a.startsWith('--url=')) out.url = a.slice(6);
    else if (flags.includes(a)) out.flags.add(a);
    else if (a === '--help' || a === '-h') out.help = true;
    else if (a.startsWith('--')) throw new Error(`Unknown option ${a}.`);
    else out.positional.push(a);
  }
  return out;
}

function timestamp(d = new Date()) {
  const p = (n) => String(n).padStart(2, '0');
  return `${d.getFullYear()}${p(d.getMonth() + 1)}${p(d.getDate())}-${p(d.getHours())}${p(d.getMinutes())}${p(d.getSeconds())}`;
}

/** Writes the dump and returns its path. Throws with pg_dump's own message when it fails. */
export function backup({ target, url } = {}) {
  const env = connectionEnv(url);
  let file;
  const name = `ballast-${env.PGDATABASE}-${timestamp()}.dump`;
  if (!target) file = join(root, '.data', 'backups', name);
  else if (existsSync(target) && statSync(target).isDirectory()) file = join(resolve(target), name);
  else if (target.endsWith('/')) file = join(resolve(target), name);
  else file = resolve(target);
  mkdirSync(dirname(file), { recursive: true, mode: 0o700 });
  // Written under a temporary name and renamed at the end: a failed or interrupted dump never looks complete.
  const partial = `${file}.partial`;
  const r = spawnSync(pgTool('pg_dump'), ['--format=custom', '--compress=6', '--no-owner', '--no-privileges', `--file=${partial}`], {
    env: { ...process.env, ...env },
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  if (r.error || r.status !== 0) {
    rmSync(partial, { force: true });
    const why = r.error ? r.error.message : (r.stderr || r.stdout).trim();
    throw new Error(`pg_dump of ${env.PGDATABASE} on ${env.PGHOST}:${env.PGPORT} failed: ${why}`);
  }
  renameSync(partial, file);
  return file;
}

function main() {
  let args;
  try {
    args = parseArgs(process.argv.slice(2));
  } catch (err) {
    console.error(err.message);
    process.exit(2);
  }
  if (args.help) {
    console.log('Usage: npm run db:backup [-- [--url postgres://…] [file.dump | folder/]]\nWithout a path the dump goes to .data/backups/ballast-<database>-<date>-<time>.dump.');
    return;
  }
  try {
    const file = backup({ target: args.positional[0], url: args.url });
    const kb = Math.ceil(statSync(file).size / 1024);
    console.log(`Backup written: ${file} (${kb} kB). Restore it with: npm run db:restore -- ${file}`);
  } catch (err) {
    console.error(err.message);
    process.exit(1);
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) main();
