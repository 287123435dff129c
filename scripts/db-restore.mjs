// `npm run db:restore -- <file.dump> [--clean]`: loads a dump made by `npm run db:backup` into the database
// DATABASE_URL names (else the `npm start` cluster). Into an empty database it restores as is; a database that
// already has tables is refused unless --clean is given, which drops the dump's tables first (the current data
// in them is lost). Runs in one transaction: on any error nothing is changed. Stop the app servers first.
import { spawnSync } from 'node:child_process';
import { existsSync, openSync, readSync, closeSync } from 'node:fs';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { connectionEnv, parseArgs, pgTool } from './db-backup.mjs';

function run(tool, args, env) {
  const r = spawnSync(pgTool(tool), args, { env: { ...process.env, ...env }, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  if (r.error) throw new Error(`${tool} could not be started: ${r.error.message}`);
  return r;
}

/** Number of tables and functions (the migrations' triggers) in the public schema (0: an empty database). */
function tableCount(env) {
  const sql = "select (select count(*) from information_schema.tables where table_schema = 'public') + (select count(*) from pg_proc p join pg_namespace n on n.oid = p.pronamespace where n.nspname = 'public')";
  const r = run('psql', ['-X', '-qAt', '-v', 'ON_ERROR_STOP=1', '-c', sql], env);
  if (r.status !== 0) throw new Error(`Cannot reach ${env.PGDATABASE} on ${env.PGHOST}:${env.PGPORT}: ${(r.stderr || r.stdout).trim()}`);
  return Number(r.stdout.trim());
}

export function restore({ file, url, clean = false }) {
  const path = resolve(file);
  if (!existsSync(path)) throw new Error(`No such backup file: ${path}`);
  const head = Buffer.alloc(5);
  const fd = openSync(path, 'r');
  readSync(fd, head, 0, 5, 0);
  closeSync(fd);
  if (head.toString('latin1') !== 'PGDMP') throw new Error(`${path} is not a PostgreSQL custom-format dump (made by npm run db:backup).`);
  const env = connectionEnv(url);
  const existing = tableCount(env);
  if (existing > 0 && !clean) {
    throw new Error(`The database ${env.PGDATABASE} already has ${existing} tables and functions. Restore into an empty database, or pass --clean to replace them (their current data is lost).`);
  }
  const args = ['--no-owner', '--no-privileges', '--single-transaction', '--exit-on-error', `--dbname=${env.PGDATABASE}`];
  if (clean && existing > 0) args.push('--clean', '--if-exists');
  const r = run('pg_restore', [...args, path], env);
  if (r.status !== 0) throw new Error(`pg_restore failed; nothing was changed: ${(r.stderr || r.stdout).trim()}`);
  return { database: env.PGDATABASE, tablesBefore: existing, tablesAfter: tableCount(env) };
}

function main() {
  let args;
  try {
    args = parseArgs(process.argv.slice(2), ['--clean']);
  } catch (err) {
    console.error(err.message);
    process.exit(2);
  }
  if (args.help || args.positional.length !== 1) {
    console.log('Usage: npm run db:restore -- [--url postgres://…] [--clean] <file.dump>');
    process.exit(args.help ? 0 : 2);
  }
  try {
    const out = restore({ file: args.positional[0], url: args.url, clean: args.flags.has('--clean') });
    console.log(`Restored ${args.positional[0]} into ${out.database} (${out.tablesAfter} tables and functions).`);
  } catch (err) {
    console.error(err.message);
    process.exit(1);
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) main();
