import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createDb } from '../../server/db/knex.ts';
import { migrateLatest } from '../../server/db/migrate.ts';
import { seed } from '../../seeds/01_demo.ts';

/**
 * Helpers of the reliability tests (database faults, scale-out, backup, shutdown): a PostgreSQL cluster of a
 * test's own that it may stop and start, and app processes that are always killed at the end.
 */

interface StartedCluster {
  url: string;
  port: number;
  pgdata: string;
  dataDir: string;
  bin: string;
  ids: { uid?: number; gid?: number };
  opts: string[];
  stop(o?: { remove?: boolean }): void;
}

export interface OwnCluster {
  url: string;
  port: number;
  bin: string;
  ids: { uid?: number; gid?: number };
  /** Stops the server: 'fast' (clients disconnected, clean shutdown) or 'immediate' (as after a crash). */
  stopServer(mode: 'fast' | 'immediate'): void;
  /** Starts it again on the same port and data (crash recovery replays the WAL after 'immediate'). */
  startServer(): void;
  /** Stops the server and removes every file of the cluster. */
  dispose(): void;
}

/**
 * A cluster of the test's own in a fresh temporary folder. `durable` keeps fsync, synchronous commit and
 * full-page writes on (no shortcuts), as a real installation runs; the folder is removed by dispose().
 */
export async function startOwnCluster(opts: { durable: boolean; migrateAndSeed?: boolean }): Promise<OwnCluster> {
  // @ts-expect-error plain JS module without types
  const { startCluster } = await import('../../scripts/lib/postgres.mjs');
  const dir = mkdtempSync(join(tmpdir(), 'ballast-reltest-'));
  let c: StartedCluster;
  try {
    c = (await startCluster({ persistent: opts.durable, dataDir: dir, log: () => undefined })) as StartedCluster;
  } catch (err) {
    rmSync(dir, { recursive: true, force: true });
    throw err;
  }
  const pgCtl = (args: string[]) => {
    const r = spawnSync(join(c.bin, 'pg_ctl'), ['-D', c.pgdata, ...args], { ...c.ids, encoding: 'utf8', env: { PATH: process.env.PATH, LANG: 'C', LC_ALL: 'C' } });
    if (r.status !== 0) throw new Error(`pg_ctl ${args.join(' ')} failed: ${r.stderr || r.stdout}`);
  };
  const cluster: OwnCluster = {
    url: c.url,
    port: c.port,
    bin: c.bin,
    ids: c.ids,
    stopServer: (mode) => pgCtl(['-m', mode, '-w', '-t', '60', 'stop']),
    startServer: () => pgCtl(['-l', join(c.dataDir, 'server.log'), '-w', '-t', '60', '-o', c.opts.join(' '), 'start']),
    dispose() {
      try {
        c.stop({ remove: true });
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
  if (opts.migrateAndSeed !== false) {
    // knex loads the migrations with import(); inside a test worker that needs tsx's loader.
    const { register } = await import('tsx/esm/api');
    register();
    const db = createDb(c.url, 2);
    try {
      await migrateLatest(db);
      await seed(db);
    } catch (err) {
      cluster.dispose();
      throw err;
    } finally {
      await db.destroy();
    }
  }
  return cluster;
}

/** A free TCP port on loopback. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

/** A parsed JSON answer: its shape is what the assertions check. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type Json = any;

export interface AppProcess {
  child: ChildProcess;
  port: number;
  base: string;
  /** Everything the process wrote, for messages when a check fails. */
  output(): string;
  /** Resolves with the exit code (null after a signal) once the process has ended. */
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  /** SIGKILL if still running, and wait for the end. */
  kill(): Promise<void>;
}

const started = new Set<AppProcess>();

/**
 * Spawns `node --import tsx server/index.ts` on a free loopback port and waits until /api/health answers 200.
 * Every process started here is remembered, and killAllAppProcesses() ends the ones still running.
 */
export async function spawnApp(env: Record<string, string>, opts: { readyTimeoutMs?: number } = {}): Promise<AppProcess> {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: join(import.meta.dirname, '..', '..'),
    env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '/tmp', NODE_ENV: 'test', LOG_LEVEL: 'warn', HOST: '127.0.0.1', PORT: String(port), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout?.on('data', (d) => (out = (out + String(d)).slice(-20_000)));
  child.stderr?.on('data', (d) => (out = (out + String(d)).slice(-20_000)));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => child.once('exit', (code, signal) => resolve({ code, signal })));
  const proc: AppProcess = {
    child,
    port,
    base: `http://127.0.0.1:${port}`,
    output: () => out,
    exited,
    async kill() {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
      await exited;
      started.delete(proc);
    },
  };
  started.add(proc);
  exited.then(() => started.delete(proc), () => undefined);
  const deadline = Date.now() + (opts.readyTimeoutMs ?? 30_000);
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the app process ended early (${child.exitCode}):\n${out}`);
    try {
      const res = await fetch(`${proc.base}/api/health`, { signal: AbortSignal.timeout(2_000) });
      if (res.status === 200) return proc;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  await proc.kill();
  throw new Error(`the app process did not answer /api/health within ${opts.readyTimeoutMs ?? 30_000} ms:\n${out}`);
}

export async function killAllAppProcesses(): Promise<void> {
  await Promise.all([...started].map((p) => p.kill()));
}

/** A cookie-keeping client over fetch, for app processes (supertest drives in-process apps only). */
export class HttpClient {
  private cookies = new Map<string, string>();
  csrf = '';
  constructor(public base: string, private extraHeaders: Record<string, string> = {}) {}

  /** Another client against a different base address sharing nothing but what is passed on explicitly. */
  withCookiesOf(other: HttpClient): this {
    for (const [k, v] of other.cookies) this.cookies.set(k, v);
    this.csrf = other.csrf;
    return this;
  }

  async request(method: string, path: string, body?: unknown, timeoutMs = 10_000): Promise<{ status: number; body: Json; headers: Headers; ms: number }> {
    const headers: Record<string, string> = { ...this.extraHeaders };
    if (this.cookies.size) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    if (method !== 'GET') headers['x-csrf-token'] = this.csrf;
    if (body !== undefined) headers['content-type'] = 'application/json';
    const t0 = Date.now();
    const res = await fetch(this.base + path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal: AbortSignal.timeout(timeoutMs) });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const eq = pair.indexOf('=');
      this.cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      // not JSON: kept as text for the message
    }
    return { status: res.status, body: parsed, headers: res.headers, ms: Date.now() - t0 };
  }

  /** The Cookie header this client sends. */
  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async fetchCsrf(): Promise<void> {
    const r = await this.request('GET', '/api/auth/csrf');
    if (r.status !== 200) throw new Error(`csrf: ${r.status} ${JSON.stringify(r.body)}`);
    this.csrf = r.body.csrfToken;
  }

  async signIn(email: string, password: string): Promise<{ status: number; body: Json; headers?: Headers }> {
    if (!this.csrf) {
      const c = await this.request('GET', '/api/auth/csrf');
      if (c.status !== 200) return c;
      this.csrf = c.body.csrfToken;
    }
    const r = await this.request('POST', '/api/auth/sign-in', { email, password });
    if (r.status === 200) this.csrf = r.body.csrfToken;
    return r;
  }
}
