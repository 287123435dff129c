/**
 * Load benchmark (`npm run bench:load`): the app on loopback against a durable PostgreSQL cluster, driven by
 * autocannon at 50 concurrent connections, signed in as the demo planner, rigger, venue user and admin.
 *
 *   npm run bench:load -- [--duration 5] [--rounds 3] [--connections 50] [--pace 2] [--only health,me,mass,page,manifest,save,pack]
 *                          [--profile DIR]
 *
 * Two ways of driving 50 clients, each endpoint measured both ways, `--rounds` rounds each, bounded in time
 * and count:
 *   saturation  50 connections that send their next request the moment an answer arrives (autocannon's
 *               default, closed loop). Shows the most this machine serves (req/s) and that nothing fails
 *               when overloaded. Latency here is queueing: by Little's law it is 50 / throughput, so p95
 *               < 50 ms would need over 1,000 req/s, more than this 2-core machine gives even /api/health
 *               (no sign-in, one `select 1`; printed as the reference). Judged on errors only.
 *   paced       50 clients, each sending `--pace` requests a second (autocannon's connectionRate), the clients
 *               started 1/50 s apart so arrivals spread over each second: 100 requests a second in all, a
 *               load far above this product's real use (a touring crew of tens of people) that leaves the
 *               machine room to answer. Judged on the latency targets and on errors.
 *
 * Endpoints, one after another (each: a short warm-up, then the measured rounds):
 *   health    GET   /api/health                        reference, not judged: no sign-in, one `select 1`; what this
 *                                                       machine gives any request at this concurrency
 *   mass      GET   …/machine/mass-properties          a section of 5,000 part lines (planner, rigger, admin)
 *   page      GET   …/machine/breakdown?limit=100      a page of 100 of that section's 5,000 lines, at a random offset
 *   manifest  GET   …/tour/engagements/:id/manifest     the Loomworks Hall manifest data (venue user, planner, rigger)
 *   save      PATCH …/machine/lines/:id                a versioned save of a part line (planner)
 *   pack      POST  …/loads/runs                       starting a packing run of the first leg (planner)
 *
 * Targets (issue 7): no errors (non-2xx, socket errors, timeouts, wrong bodies) in any round; paced reads
 * p95 < 50 ms; paced writes p95 < 150 ms. The best paced round of each endpoint (lowest p95) is judged: the
 * machine has 2 cores shared with other people's tests, so a single round can be spoilt by someone else's
 * work. Each round also prints the CPU time per request of the app, its database backends and the whole
 * machine. Exit code 1 if a target is missed.
 *
 * Database: DATABASE_URL when set (it must hold the demo, or be empty); otherwise a persistent, durable
 * cluster in .data/bench-load (fsync on, no shortcuts) with a fresh database for each run.
 *
 * The app runs as `npm start` runs it (`node --import tsx server/index.ts`: createApp + listen), in a child
 * process with NODE_ENV=production, so autocannon's own work does not share the event loop it measures.
 * Sign-in is rate-limited per account and per address: each demo user signs in once and the session cookie
 * and CSRF token are reused. The API has no other rate limit (server/http, server/app.ts).
 *
 * Versioned saves: a save must name the version it started from (409 otherwise). Each request takes a part
 * line nobody else is editing at that moment from a pool, with the version the last answer gave, and returns
 * it with the new version: saves never race each other, as two people never edit one part at one instant
 * here. A 409 would still count as an error.
 *
 * Packing runs are jobs (server/jobs) run one at a time on a worker thread: a run's POST only stores the run
 * and queues it. Each round starts at most PACK_MAX runs with a 100 ms search budget; afterwards the runs it
 * started are deleted through the API (which removes their queued jobs) and the bench waits for the one that
 * is running, so runs never pile up from round to round.
 */
import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { createWriteStream, mkdirSync, readFileSync, readdirSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Knex } from 'knex';
import { createDb } from '../../server/db/knex.ts';
import { migrateLatest } from '../../server/db/migrate.ts';
import { seed, DEMO_USERS } from '../../seeds/01_demo.ts';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && i + 1 < args.length ? args[i + 1] : dflt;
};
const DURATION_S = Number(opt('duration', '5'));
const ROUNDS = Math.max(1, Number(opt('rounds', '3')));
const CONNECTIONS = Number(opt('connections', '50'));
/** Requests a second each client sends in the paced rounds (a whole number: autocannon's connectionRate). */
const PACE = Math.max(1, Math.round(Number(opt('pace', '2'))));
const ONLY = opt('only', 'health,me,mass,page,manifest,save,pack').split(',');
/** `--profile DIR`: the app writes a V8 CPU profile there when it stops (open it in Chrome's DevTools). */
const PROFILE_DIR = opt('profile', '');
/** Hard caps on requests per measured round, whatever the duration. */
const READ_MAX = 50_000;
const SAVE_MAX = 20_000;
const PACK_MAX = 600;
const TIMEOUT_S = 10;

const LINES = 5_000;
const ASSEMBLIES = 50;
const PAGE = 100;
const SECTION_CODE = 'LOAD-5000';
const REBUILD = 'Orrery Seven — workshop rebuild';
const TOUR = 'Orrery Seven — European and Canadian tour';
const TARGET_MS = { read: 50, write: 150, reference: Number.POSITIVE_INFINITY } as const;

const loadNote = () => `${cpus().length} cores, load average ${loadavg().map((l) => l.toFixed(2)).join(' / ')} (1 / 5 / 15 min)`;
const log = (m: string) => console.log(m);

// ------------------------------------------------------------------------------------------- HTTP helpers

/** A signed-in demo user: the session cookie and the CSRF token of that session, reused for every request. */
class Client {
  cookies = new Map<string, string>();
  csrf = '';
  constructor(
    readonly base: string,
    readonly email: string,
  ) {}

  get cookie(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async call<T = Record<string, unknown>>(method: string, path: string, body?: unknown, expect = [200, 201, 202, 204]): Promise<T> {
    const headers: Record<string, string> = { accept: 'application/json', cookie: this.cookie };
    if (method !== 'GET') headers['x-csrf-token'] = this.csrf;
    let payload: BodyInit | undefined;
    if (body instanceof FormData) payload = body;
    else if (body !== undefined) {
      headers['content-type'] = 'application/json';
      payload = JSON.stringify(body);
    }
    const res = await fetch(this.base + path, { method, headers, body: payload, redirect: 'manual' });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const eq = pair.indexOf('=');
      this.cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
    }
    const text = await res.text();
    if (!expect.includes(res.status)) throw new Error(`${method} ${path} as ${this.email}: HTTP ${res.status} ${text.slice(0, 400)}`);
    return (text ? JSON.parse(text) : {}) as T;
  }

  static async signIn(base: string, email: string, password: string): Promise<Client> {
    const c = new Client(base, email);
    c.csrf = (await c.call<{ csrfToken: string }>('GET', '/api/auth/csrf')).csrfToken;
    c.csrf = (await c.call<{ csrfToken: string }>('POST', '/api/auth/sign-in', { email, password })).csrfToken;
    return c;
  }

  headers(write: boolean): Record<string, string> {
    return { accept: 'application/json', cookie: this.cookie, ...(write ? { 'x-csrf-token': this.csrf, 'content-type': 'application/json' } : {}) };
  }
}

// ------------------------------------------------------------------------------------------- bench data

/** A deterministic parts list of `LINES` lines in `ASSEMBLIES` assemblies, positions in a 4 m disc. */
function partsCsv(): string {
  const out = ['Part number,Name,Assembly,Quantity,Unit mass (kg),Mass source,Material,CoG x (mm),CoG y (mm),CoG z (mm)'];
  const materials = ['steel', 'aluminium', 'brass', 'plywood-birch', 'acetal'];
  const sources = ['weighed', 'catalogue', 'cad', 'estimated'];
  let s = 4242;
  const rnd = () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32;
  for (let i = 0; i < LINES; i++) {
    const a = rnd() * Math.PI * 2;
    const r = rnd() * 2000;
    out.push(
      [
        `LB-${String(i + 1).padStart(5, '0')}`,
        `Bench part ${i + 1}`,
        `LB-ASM-${String((i % ASSEMBLIES) + 1).padStart(2, '0')}`,
        1 + (i % 5),
        (0.05 + rnd() * 4).toFixed(3),
        sources[i % 4],
        materials[i % 5],
        (r * Math.cos(a)).toFixed(1),
        (r * Math.sin(a)).toFixed(1),
        (rnd() * 3000).toFixed(1),
      ].join(','),
    );
  }
  return out.join('\n');
}

interface MachineView {
  sections: { id: string; code: string }[];
  lineCount: number;
}

/**
 * The workshop rebuild production (empty in the demo) gets a section of 5,000 part lines, through the same
 * API a planner uses: the parts-list import (upload, preview, commit in one transaction), a new section, and
 * a move of the imported assemblies into it.
 */
async function ensureBenchSection(planner: Client, productionId: string): Promise<string> {
  const base = `/api/productions/${productionId}/machine`;
  const machine = await planner.call<MachineView>('GET', `${base}/`);
  const existing = machine.sections.find((s) => s.code === SECTION_CODE);
  if (existing && machine.lineCount === LINES) return existing.id;
  if (machine.lineCount > 0 || machine.sections.length > 0) {
    throw new Error(`The production "${REBUILD}" already has a breakdown that is not the benchmark's; the load benchmark will not overwrite it. Use an empty database.`);
  }
  const t0 = Date.now();
  const form = new FormData();
  form.append('file', new Blob([partsCsv()], { type: 'text/csv' }), 'load-bench-parts.csv');
  const up = await planner.call<{ import: { id: string } }>('POST', `${base}/imports`, form);
  const options = {
    mapping: { partNumber: 'Part number', name: 'Name', assemblyNumber: 'Assembly', quantity: 'Quantity', unitMass: 'Unit mass (kg)', massSource: 'Mass source', material: 'Material', cogX: 'CoG x (mm)', cogY: 'CoG y (mm)', cogZ: 'CoG z (mm)' },
    units: { length: 'mm', mass: 'kg' },
    allowNewAssemblies: true,
  };
  const pv = await planner.call<{ preview: { ok: boolean } }>('POST', `${base}/imports/${up.import.id}/preview`, options);
  if (!pv.preview.ok) throw new Error(`The benchmark parts list does not import: ${JSON.stringify(pv).slice(0, 500)}`);
  await planner.call('POST', `${base}/imports/${up.import.id}/commit`, options);
  const { section } = await planner.call<{ section: { id: string } }>('POST', `${base}/sections`, { code: SECTION_CODE, name: 'Load benchmark: 5,000 part lines' });
  const { assemblies } = await planner.call<{ assemblies: { id: string; version: number }[] }>('GET', `${base}/breakdown?limit=1`);
  await planner.call('POST', `${base}/move`, { sectionId: section.id, assemblies: assemblies.map((a) => ({ id: a.id, version: a.version })), lines: [] });
  log(`bench data: ${LINES.toLocaleString('en-GB')} part lines in ${ASSEMBLIES} assemblies imported into section ${SECTION_CODE} of "${REBUILD}" (${((Date.now() - t0) / 1000).toFixed(1)} s)`);
  return section.id;
}

// ------------------------------------------------------------------------------------------- measuring

interface Endpoint {
  key: string;
  label: string;
  /** 'reference': measured and printed, not judged against a target. */
  kind: 'read' | 'write' | 'reference';
  method: 'GET' | 'PATCH' | 'POST';
  maxRequests: number;
  warmupRequests: number;
  /** Builds one request (path, headers, body). */
  next(): { path: string; headers: Record<string, string>; body?: string };
  /** Checks an answer; false counts as an error (a wrong body). */
  check(status: number, body: string): boolean;
  /** Runs after each round (packing: remove the runs it started). */
  after?(): Promise<string | void>;
  /** Requests a second per client in the paced rounds, when not `--pace` (may be below 1). */
  pace?: number;
  /** Why this endpoint has its own pace (printed with the results). */
  paceWhy?: string;
}

interface RoundResult {
  requests: number;
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
  non2xx: number;
  socketErrors: number;
  wrongBodies: number;
  statuses: Record<string, number>;
}

const errorsOf = (r: RoundResult) => r.non2xx + r.socketErrors + r.wrongBodies;

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

/** What a round's autocannon instances saw: every answer's latency and status, and the errors. */
class Tally {
  latencies: number[] = [];
  statuses: Record<string, number> = {};
  wrong = 0;
  non2xx = 0;
  socketErrors = 0;

  /**
   * One autocannon instance sending `ep`'s requests, counted here; resolves when it ends. `amount` caps its
   * requests (autocannon's `amount` would override the duration; maxOverallRequests keeps the time bound).
   */
  run(base: string, ep: Endpoint, o: { connections: number; amount: number; durationS: number; connectionRate?: number }): Promise<void> {
    return new Promise<void>((resolve, reject) => {
      const instance = autocannon(
        {
          url: base,
          connections: o.connections,
          pipelining: 1,
          ...(o.connectionRate ? { connectionRate: o.connectionRate } : {}),
          duration: o.durationS,
          maxOverallRequests: o.amount,
          timeout: TIMEOUT_S,
          requests: [
            {
              method: ep.method,
              setupRequest: (req) => ({ ...req, ...ep.next() }),
              onResponse: (status, body) => {
                if (status >= 200 && status < 300 && !ep.check(status, body)) this.wrong++;
                else if (status >= 300) ep.check(status, body);
              },
            },
          ],
        },
        (err, res) => {
          if (err) return reject(err);
          this.non2xx += res.non2xx;
          this.socketErrors += res.errors;
          resolve();
        },
      );
      instance.on('response', (_client: unknown, statusCode: number, _bytes: number, ms: number) => {
        this.latencies.push(ms);
        this.statuses[statusCode] = (this.statuses[statusCode] ?? 0) + 1;
      });
    });
  }

  result(seconds: number): RoundResult {
    const latencies = [...this.latencies].sort((a, b) => a - b);
    return {
      requests: latencies.length,
      rps: latencies.length / seconds,
      p50: percentile(latencies, 50),
      p95: percentile(latencies, 95),
      p99: percentile(latencies, 99),
      max: latencies[latencies.length - 1] ?? Number.NaN,
      non2xx: this.non2xx,
      socketErrors: this.socketErrors,
      wrongBodies: this.wrong,
      statuses: this.statuses,
    };
  }
}

/** Saturation: CONNECTIONS connections, each sending its next request when an answer arrives. */
async function measure(base: string, ep: Endpoint, amount: number, durationS: number): Promise<RoundResult> {
  const tally = new Tally();
  const t0 = performance.now();
  await tally.run(base, ep, { connections: CONNECTIONS, amount, durationS });
  return tally.result((performance.now() - t0) / 1000);
}

// ------------------------------------------------------------------------------------------- CPU accounting

/**
 * CPU time (user + system, seconds) of the app process, of this benchmark's database backends (processes
 * whose title names its database), and of the whole machine, read from Linux's /proc: which of them a
 * round's requests cost. Elsewhere (no /proc) it reports nothing.
 */
interface CpuSnapshot {
  /** Seconds of CPU so far per process id. */
  app: Map<string, number>;
  database: Map<string, number>;
  busy: number;
  total: number;
}
const TICK = 100; // USER_HZ on Linux
function cpuSnapshot(appPid: number | undefined, database: string): CpuSnapshot | null {
  try {
    const fields = (pid: string) => {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      return stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    };
    const seconds = (f: string[]) => (Number(f[11]) + Number(f[12])) / TICK;
    const db = new Map<string, number>();
    const app = new Map<string, number>();
    for (const pid of readdirSync('/proc')) {
      if (!/^\d+$/.test(pid)) continue;
      try {
        const f = fields(pid);
        // The app process and any process it started (worker threads are counted with their process).
        if (Number(pid) === appPid || Number(f[1]) === appPid) app.set(pid, seconds(f));
        const title = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
        if (title.startsWith('postgres: ') && title.includes(` ${database} `)) db.set(pid, seconds(f));
      } catch {
        // gone meanwhile
      }
    }
    const cpu = readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1).map(Number);
    const idle = cpu[3] + (cpu[4] ?? 0);
    const total = cpu.reduce((a, b) => a + b, 0);
    return { app, database: db, busy: (total - idle) / TICK, total: total / TICK };
  } catch {
    return null;
  }
}
/** CPU used between two snapshots by the processes alive at the second (one that ended meanwhile is left out). */
const used = (a: Map<string, number>, b: Map<string, number>) => [...b].reduce((sum, [pid, t]) => sum + t - (a.get(pid) ?? 0), 0);
function cpuNote(a: CpuSnapshot | null, b: CpuSnapshot | null, requests: number): string {
  if (!a || !b || requests === 0) return '';
  const per = (s: number) => `${((s * 1000) / requests).toFixed(2)} ms`;
  return `; CPU per request: app ${per(used(a.app, b.app))}, database ${per(used(a.database, b.database))}, machine ${per(b.busy - a.busy)} (machine ${Math.round((100 * (b.busy - a.busy)) / Math.max(1e-9, b.total - a.total))}% busy)`;
}

const paceOf = (ep: Endpoint) => ep.pace ?? PACE;

/**
 * Paced: CONNECTIONS clients of one connection each, each sending PACE requests a second, started
 * 1/CONNECTIONS s apart (one autocannon instance each: one instance's clients all tick on the same second,
 * which would send every client's requests at once). Latency is measured from each request's sending.
 */
async function measurePaced(base: string, ep: Endpoint, durationS: number): Promise<RoundResult> {
  const pace = paceOf(ep);
  // Below one request a second a client sends its share of the round's requests at once, and the clients'
  // starts spread over 1 / pace seconds instead of one second.
  const perClientMax = Math.max(1, Math.min(Math.ceil(ep.maxRequests / CONNECTIONS), Math.round(durationS * pace)));
  const spreadMs = 1000 / Math.min(1, pace);
  const tally = new Tally();
  const t0 = performance.now();
  const runs: Promise<void>[] = [];
  for (let i = 0; i < CONNECTIONS; i++) {
    if (i > 0) await new Promise((r) => setTimeout(r, spreadMs / CONNECTIONS));
    runs.push(tally.run(base, ep, { connections: 1, amount: perClientMax, durationS, connectionRate: Math.max(1, Math.round(pace)) }));
  }
  await Promise.all(runs);
  // At one request a second or more, each client runs for the round's duration: the rate is counted over
  // that, not over the second in which the clients start one after another.
  const seconds = (performance.now() - t0) / 1000;
  const startSpreadS = pace >= 1 ? ((CONNECTIONS - 1) * spreadMs) / CONNECTIONS / 1000 : 0;
  return tally.result(Math.max(seconds - startSpreadS, 1e-3));
}

const ms = (v: number) => (Number.isFinite(v) ? `${v < 10 ? v.toFixed(1) : v.toFixed(0)} ms` : '—');
const pad = (s: string, n: number) => s.padEnd(n);
const lpad = (s: string, n: number) => s.padStart(n);

// ------------------------------------------------------------------------------------------- main

async function main(): Promise<void> {
  log(`Ballast load benchmark: ${CONNECTIONS} connections, ${ROUNDS} round(s) of at most ${DURATION_S} s per endpoint`);
  log(`machine: ${loadNote()} — other people's work on this machine makes the figures noisy; the best round counts`);

  const cleanups: (() => Promise<void> | void)[] = [];
  const cleanup = async () => {
    while (cleanups.length) {
      try {
        await cleanups.pop()!();
      } catch (e) {
        console.error('cleanup:', (e as Error).message);
      }
    }
  };
  let interrupted = false;
  const onSignal = () => {
    interrupted = true;
    void cleanup().then(() => process.exit(130));
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);

  try {
    // --- database
    let url = process.env.DATABASE_URL;
    const dataDir = join(root, '.data', 'bench-load');
    mkdirSync(dataDir, { recursive: true });
    if (url) {
      log('database: DATABASE_URL (the demo is seeded only into an empty database)');
    } else {
      // @ts-expect-error plain JS module without types
      const { startCluster } = await import('../lib/postgres.mjs');
      const cluster = await startCluster({ dataDir: join(dataDir, 'cluster'), persistent: true, log: () => undefined });
      cleanups.push(() => cluster.stop({ remove: false }));
      url = cluster.createDatabase('ballast_bench_load') as string;
      log(`database: durable cluster in ${cluster.pgdata} (fsync on), fresh database ballast_bench_load on port ${cluster.port}`);
    }
    const dbName = new URL(url).pathname.slice(1);
    const setupDb: Knex = createDb(url, 2);
    cleanups.push(() => setupDb.destroy());
    await migrateLatest(setupDb);
    await seed(setupDb);

    // --- the app, as `npm start` runs it
    // @ts-expect-error plain JS module without types
    const { freePort } = await import('../lib/postgres.mjs');
    const port: number = await freePort();
    const base = `http://127.0.0.1:${port}`;
    const appLog = join(dataDir, 'app.log');
    const out = createWriteStream(appLog, { flags: 'w' });
    const app: ChildProcess = spawn(process.execPath, [...(PROFILE_DIR ? ['--cpu-prof', '--cpu-prof-dir', PROFILE_DIR] : []), '--import', 'tsx', 'server/index.ts'], {
      cwd: root,
      env: {
        PATH: process.env.PATH,
        NODE_ENV: 'production',
        DATABASE_URL: url,
        SESSION_SECRET: randomBytes(32).toString('hex'),
        HOST: '127.0.0.1',
        PORT: String(port),
        LOG_LEVEL: 'warn',
        BALLAST_MIGRATE_ON_START: 'false',
        ...(process.env.DATABASE_POOL_MAX ? { DATABASE_POOL_MAX: process.env.DATABASE_POOL_MAX } : {}),
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    app.stdout!.pipe(out);
    app.stderr!.pipe(out);
    const exited = new Promise<number | null>((resolve) => app.once('exit', (code) => resolve(code)));
    cleanups.push(async () => {
      if (app.exitCode === null && app.signalCode === null) {
        app.kill('SIGTERM');
        const timer = setTimeout(() => app.kill('SIGKILL'), 15_000);
        await exited;
        clearTimeout(timer);
      }
    });
    for (let i = 0; ; i++) {
      if (app.exitCode !== null) throw new Error(`The app stopped at start (exit ${app.exitCode}); see ${appLog}`);
      try {
        if ((await fetch(`${base}/api/health`)).ok) break;
      } catch {
        // not listening yet
      }
      if (i > 300) throw new Error(`The app did not answer /api/health in 30 s; see ${appLog}`);
      await new Promise((r) => setTimeout(r, 100));
    }
    log(`app: ${base} (NODE_ENV=production, database pool ${process.env.DATABASE_POOL_MAX ?? 10}, log ${appLog})`);

    // --- sign in once per demo user
    const who = (role: string) => DEMO_USERS.find((u) => u.email.startsWith(`${role}@`))!;
    const [planner, rigger, venue, admin] = await Promise.all(['planner', 'rigger', 'venue', 'admin'].map((r) => Client.signIn(base, who(r).email, who(r).password)));
    const me = await planner.call<{ user: { memberships: { productionId: string; productionName: string }[] } }>('GET', '/api/auth/me');
    const productionId = (name: string) => {
      const m = me.user.memberships.find((x) => x.productionName === name);
      if (!m) throw new Error(`The planner is not a member of "${name}": the database does not hold the demo.`);
      return m.productionId;
    };
    const rebuildId = productionId(REBUILD);
    const tourId = productionId(TOUR);

    // The admin reads the bench production as a rigger: granted through the admin API, as an admin would.
    const { users } = await admin.call<{ users: { id: string; email: string }[] }>('GET', '/api/admin/users');
    const adminId = users.find((u) => u.email === admin.email)!.id;
    await admin.call('PUT', `/api/admin/productions/${rebuildId}/members/${adminId}`, { role: 'rigger', venueIds: [] });
    const sectionId = await ensureBenchSection(planner, rebuildId);

    const { lines: benchLines, total } = await planner.call<{ lines: { id: string; version: number }[]; total: number }>(
      'GET',
      `/api/productions/${rebuildId}/machine/breakdown?sectionId=${sectionId}&limit=${LINES}&sort=partNumber`,
    );
    if (total !== LINES) throw new Error(`Section ${SECTION_CODE} holds ${total} lines, not ${LINES}.`);

    const { tour } = await planner.call<{
      tour: { engagements: { id: string; venueId: string }[]; venues: { id: string; name: string }[]; legs: { id: string; vehicles: unknown[]; crates: unknown[] }[] };
    }>('GET', `/api/productions/${tourId}/tour`);
    const loomworks = tour.venues.find((v) => v.name === 'Loomworks Hall')!;
    const engagementId = tour.engagements.find((e) => e.venueId === loomworks.id)!.id;
    const leg = tour.legs.find((l) => l.vehicles.length > 0 && l.crates.length > 0);
    if (!leg) throw new Error('No leg of the demo tour has vehicles and crates to pack.');

    // --- endpoints
    const rr = <T>(xs: T[]) => {
      let i = 0;
      return () => xs[i++ % xs.length];
    };
    const machineReaders = rr([planner, rigger, admin]);
    const manifestReaders = rr([venue, venue, planner, rigger]);
    const json = (body: string): Record<string, unknown> | null => {
      try {
        return JSON.parse(body) as Record<string, unknown>;
      } catch {
        return null;
      }
    };
    let checkEvery = 0;
    const sample = () => checkEvery++ % 10 === 0;

    // Saves: a pool of lines nobody is editing right now, each with its last known version.
    const free: { id: string; version: number }[] = benchLines.slice(0, 1000).map((l) => ({ id: l.id, version: l.version }));
    const busy = new Set<string>();
    let saveSeq = 0;
    // Packing: the runs each round started, removed afterwards.
    const startedRuns: string[] = [];

    const endpoints: Endpoint[] = [
      {
        key: 'health',
        label: 'GET /api/health (reference: no sign-in)',
        kind: 'reference',
        method: 'GET',
        maxRequests: READ_MAX,
        warmupRequests: 500,
        next: () => ({ path: '/api/health', headers: { accept: 'application/json' } }),
        check: (_s, body) => body.includes('"database":"up"'),
      },
      {
        key: 'me',
        label: 'GET /api/auth/me (reference: signed in)',
        kind: 'reference',
        method: 'GET',
        maxRequests: READ_MAX,
        warmupRequests: 500,
        // The least a signed-in request costs here: the session and the person with their memberships.
        next: () => ({ path: '/api/auth/me', headers: machineReaders().headers(false) }),
        check: (_s, body) => body.includes('"memberships"'),
      },
      {
        key: 'mass',
        label: 'GET mass properties (section of 5,000 lines)',
        kind: 'read',
        method: 'GET',
        maxRequests: READ_MAX,
        warmupRequests: 500,
        next: () => ({ path: `/api/productions/${rebuildId}/machine/mass-properties`, headers: machineReaders().headers(false) }),
        check: (_s, body) => {
          if (!sample()) return body.length > 0;
          const mp = (json(body)?.massProperties ?? null) as { sections?: Record<string, { massKg: number }> } | null;
          return Boolean(mp?.sections?.[sectionId] && mp.sections[sectionId].massKg > 0);
        },
      },
      {
        key: 'page',
        label: `GET breakdown page (${PAGE} of ${LINES.toLocaleString('en-GB')} lines)`,
        kind: 'read',
        method: 'GET',
        maxRequests: READ_MAX,
        warmupRequests: 500,
        next: () => {
          const offset = PAGE * Math.floor(Math.random() * (LINES / PAGE));
          return { path: `/api/productions/${rebuildId}/machine/breakdown?sectionId=${sectionId}&offset=${offset}&limit=${PAGE}`, headers: machineReaders().headers(false) };
        },
        check: (_s, body) => {
          if (!sample()) return body.length > 0;
          const b = json(body) as { lines?: { effectiveSectionId: string }[]; total?: number } | null;
          return Boolean(b && b.total === LINES && b.lines?.length === PAGE && b.lines.every((l) => l.effectiveSectionId === sectionId));
        },
      },
      {
        key: 'manifest',
        label: 'GET venue manifest data (Loomworks Hall)',
        kind: 'read',
        method: 'GET',
        maxRequests: READ_MAX,
        warmupRequests: 500,
        next: () => ({ path: `/api/productions/${tourId}/tour/engagements/${engagementId}/manifest`, headers: manifestReaders().headers(false) }),
        check: (_s, body) => {
          if (!sample()) return body.length > 0;
          const m = (json(body)?.manifest ?? null) as { venue?: { name: string }; crates?: unknown[] } | null;
          return m?.venue?.name === 'Loomworks Hall' && Array.isArray(m.crates);
        },
      },
      {
        key: 'save',
        label: 'PATCH part line (versioned save)',
        kind: 'write',
        method: 'PATCH',
        maxRequests: SAVE_MAX,
        warmupRequests: 300,
        next: () => {
          const line = free.shift();
          if (!line) throw new Error('No free part line to save (more answers lost than the pool holds).');
          busy.add(line.id);
          saveSeq++;
          const body = JSON.stringify({ version: line.version, unitMassKg: Number((0.05 + (saveSeq % 400) / 100).toFixed(3)), notes: `load bench save ${saveSeq}` });
          return { path: `/api/productions/${rebuildId}/machine/lines/${line.id}`, headers: planner.headers(true), body };
        },
        check: (status, body) => {
          const b = json(body) as { line?: { id: string; version: number }; details?: { current?: { id: string; version: number } } } | null;
          // The answer names the line and its new version (a 409 names the current one): back into the pool.
          const line = status === 200 ? b?.line : b?.details?.current;
          if (line && busy.delete(line.id)) free.push({ id: line.id, version: line.version });
          return status === 200 && Boolean(b?.line);
        },
      },
      {
        key: 'pack',
        label: 'POST packing run (queued as a job)',
        kind: 'write',
        pace: 0.2,
        paceWhy: 'a packing run is a long computation that a planner starts and then waits for: each of the 50 clients starts one run in the same 5 s',
        method: 'POST',
        maxRequests: PACK_MAX,
        warmupRequests: 50,
        next: () => ({
          path: `/api/productions/${tourId}/loads/runs`,
          headers: planner.headers(true),
          body: JSON.stringify({ name: 'Load bench run', legId: leg.id, timeLimitMs: 100, seed: 1 }),
        }),
        check: (status, body) => {
          const run = (json(body)?.run ?? null) as { id: string } | null;
          if (run) startedRuns.push(run.id);
          return status === 202 && Boolean(run);
        },
        after: async () => {
          const ids = startedRuns.splice(0);
          // Remove what this round started (queued jobs go with their runs), a few at a time.
          let removed = 0;
          for (let i = 0; i < ids.length; i += 8) {
            await Promise.all(ids.slice(i, i + 8).map((id) => planner.call('DELETE', `/api/productions/${tourId}/loads/runs/${id}`, undefined, [204, 404]).then(() => removed++)));
          }
          // …and let the run a worker is on finish.
          const t0 = Date.now();
          for (;;) {
            const [{ n }] = await setupDb('jobs').where({ kind: 'packing-run' }).whereIn('status', ['queued', 'running']).count<{ n: string }[]>('* as n');
            if (Number(n) === 0) break;
            if (Date.now() - t0 > 120_000) return `${removed} runs removed; ${n} packing job(s) still queued or running after 2 min`;
            await new Promise((r) => setTimeout(r, 250));
          }
          return `${ids.length} runs started, removed afterwards; queue drained in ${((Date.now() - t0) / 1000).toFixed(1)} s`;
        },
      },
    ];

    const chosen = endpoints.filter((e) => ONLY.includes(e.key));
    const summary: { ep: Endpoint; saturation: RoundResult; paced: RoundResult; errors: number }[] = [];
    const bestOf = (rounds: RoundResult[]) => [...rounds].sort((a, b) => errorsOf(a) - errorsOf(b) || a.p95 - b.p95)[0];
    for (const ep of chosen) {
      if (interrupted) break;
      log(`\n== ${ep.label}`);
      await measure(base, ep, ep.warmupRequests, DURATION_S);
      await ep.after?.();
      const rounds: Record<'saturation' | 'paced', RoundResult[]> = { saturation: [], paced: [] };
      for (const mode of ['saturation', 'paced'] as const) {
        for (let r = 1; r <= ROUNDS; r++) {
          const cpu0 = cpuSnapshot(app.pid, dbName);
          const res = mode === 'saturation' ? await measure(base, ep, ep.maxRequests, DURATION_S) : await measurePaced(base, ep, DURATION_S);
          const cpu = cpuNote(cpu0, cpuSnapshot(app.pid, dbName), res.requests);
          rounds[mode].push(res);
          const note = await ep.after?.();
          const codes = Object.entries(res.statuses)
            .map(([k, v]) => `${k}×${v}`)
            .join(' ');
          log(
            `  ${mode} ${r}: ${res.requests} requests, ${res.rps.toFixed(0)} req/s, p50 ${ms(res.p50)}, p95 ${ms(res.p95)}, p99 ${ms(res.p99)}, max ${ms(res.max)}; ` +
              `errors ${errorsOf(res)} (non-2xx ${res.non2xx}, socket ${res.socketErrors}, wrong body ${res.wrongBodies}) [${codes}]${note ? `; ${note}` : ''}${cpu}`,
          );
        }
      }
      // Best of the rounds: fewest errors, then lowest p95 (noise from other work on the machine only adds).
      const all = [...rounds.saturation, ...rounds.paced];
      summary.push({ ep, saturation: bestOf(rounds.saturation), paced: bestOf(rounds.paced), errors: all.reduce((n, r) => n + errorsOf(r), 0) });
    }

    // --- report
    log(`\nBest of ${ROUNDS} round(s) per endpoint and mode; ${CONNECTIONS} clients; paced: ${PACE} request(s) a second each; machine: ${loadNote()}`);
    log(`${pad('', 46)} ${pad('saturation', 16)} ${pad(`paced (offered: ${CONNECTIONS * PACE} req/s unless said)`, 34)}`);
    log(`${pad('endpoint', 46)} ${lpad('req/s', 7)} ${lpad('p95', 8)} ${lpad('req/s', 7)} ${lpad('p50', 8)} ${lpad('p95', 8)} ${lpad('p99', 8)} ${lpad('errors', 7)}  target`);
    let failed = 0;
    for (const { ep, saturation, paced, errors } of summary) {
      const target = TARGET_MS[ep.kind];
      const pass = errors === 0 && paced.p95 < target;
      if (!pass && ep.kind !== 'reference') failed++;
      const verdict = ep.kind === 'reference' ? 'not judged' : `${pass ? 'PASS' : 'FAIL'} (${ep.kind}: no errors in any round, paced p95 < ${target} ms)`;
      log(
        `${pad(ep.label + (ep.pace ? ` [paced ${(CONNECTIONS * ep.pace).toFixed(0)} req/s offered]` : ''), 46)} ${lpad(saturation.rps.toFixed(0), 7)} ${lpad(ms(saturation.p95), 8)} ${lpad(paced.rps.toFixed(0), 7)} ${lpad(ms(paced.p50), 8)} ${lpad(ms(paced.p95), 8)} ${lpad(ms(paced.p99), 8)} ${lpad(String(errors), 7)}  ${verdict}`,
      );
    }
    for (const { ep } of summary) if (ep.paceWhy) log(`${ep.label}: paced at ${ep.pace} request(s) a second per client, because ${ep.paceWhy}.`);
    if (failed) process.exitCode = 1;
  } finally {
    await cleanup();
  }
}

await main();
