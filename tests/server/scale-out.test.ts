import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes, randomUUID } from 'node:crypto';
import { DEMO_USERS } from '../../seeds/01_demo.ts';
import { createDb } from '../../server/db/knex.ts';
import { HttpClient, killAllAppProcesses, spawnApp, type AppProcess } from './reliability-helpers.ts';

/**
 * Two app processes (`node --import tsx server/index.ts`) on their own loopback ports against the one
 * database of the test run, with the same SESSION_SECRET, as two servers behind a load balancer: a session
 * started on one is seen by the other, a failed sign-in counted on one counts on the other, and a packing job
 * started on one is seen (and its progress followed) on the other. Both processes are killed at the end.
 */

const url = process.env.DATABASE_URL!;
const secret = randomBytes(32).toString('hex');
/** RFC 5737 documentation address, unique to this run: the per-address sign-in count stays ours. */
const address = `203.0.113.${10 + Math.floor(Math.random() * 200)}`;
const planner = DEMO_USERS.find((u) => u.email.startsWith('planner@'))!;
let a: AppProcess;
let b: AppProcess;

beforeAll(async () => {
  const env = {
    DATABASE_URL: url,
    SESSION_SECRET: secret,
    BALLAST_MIGRATE_ON_START: 'false',
    TRUST_PROXY: 'true',
    SIGNIN_MAX_PER_ACCOUNT: '3',
    SIGNIN_MAX_PER_ADDRESS: '1000',
    BALLAST_DEMO: 'false',
  };
  [a, b] = await Promise.all([spawnApp(env, { readyTimeoutMs: 60_000 }), spawnApp(env, { readyTimeoutMs: 60_000 })]);
}, 90_000);

afterAll(async () => {
  await killAllAppProcesses();
  const db = createDb(url, 1);
  await db('rate_limits').where('key', 'like', '%scale-out-%').orWhere('key', 'like', `%${address}%`).delete().catch(() => undefined);
  await db.destroy();
});

const headers = { 'x-forwarded-for': address };

describe('two app servers on one database', () => {
  it('run as two processes on two ports', () => {
    expect(a.port).not.toBe(b.port);
    expect(a.child.pid).not.toBe(b.child.pid);
  });

  it('a session started on one is seen by the other, and signing out on the other ends it on both', async () => {
    const onA = new HttpClient(a.base, headers);
    const r = await onA.signIn(planner.email, planner.password);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const onB = new HttpClient(b.base, headers).withCookiesOf(onA);
    const me = await onB.request('GET', '/api/auth/me');
    expect(me.status, JSON.stringify(me.body)).toBe(200);
    expect(me.body.user.email).toBe(planner.email);
    // A state-changing request on B with the CSRF token issued by A: the token lives in the shared session.
    const pref = await onB.request('PATCH', '/api/auth/me/preferences', { units: me.body.user.units });
    expect(pref.status, JSON.stringify(pref.body)).toBe(200);
    const out = await onB.request('POST', '/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect((await onA.request('GET', '/api/auth/me')).status).toBe(401);
  });

  it('failed sign-ins counted on one server are refused on the other', async () => {
    const email = `scale-out-${randomUUID()}@example.com`;
    const servers = [a, b, a];
    for (const s of servers) {
      const r = await new HttpClient(s.base, headers).signIn(email, 'wrong password 1');
      expect(r.status, JSON.stringify(r.body)).toBe(401);
    }
    // The limit is 3 per account: the fourth try is refused, on either server, before the password is checked.
    for (const s of [b, a]) {
      const r = await new HttpClient(s.base, headers).signIn(email, 'wrong password 1');
      expect(r.status, JSON.stringify(r.body)).toBe(429);
      expect(r.body.error.code).toBe('rate_limited');
      expect(Number(r.headers?.get('retry-after'))).toBeGreaterThan(0);
    }
  });

  it('a packing job started on one server is seen on the other, and finishes', async (ctx) => {
    const onA = new HttpClient(a.base, headers);
    expect((await onA.signIn(planner.email, planner.password)).status).toBe(200);
    const onB = new HttpClient(b.base, headers).withCookiesOf(onA);
    const me = await onA.request('GET', '/api/auth/me');
    const productionId = me.body.user.memberships[0].productionId as string;
    const vehicles = await onA.request('GET', `/api/productions/${productionId}/loads/vehicles`);
    const crates = await onA.request('GET', `/api/productions/${productionId}/crates/`);
    if (vehicles.status === 404 || crates.status === 404 || !vehicles.body?.vehicles?.length || !crates.body?.crates?.length) {
      ctx.skip('no packing runs yet in this build (loads routes or demo vehicles and crates missing)');
      return;
    }
    const started = await onA.request('POST', `/api/productions/${productionId}/loads/runs`, {
      name: `Scale-out ${randomUUID().slice(0, 6)}`,
      vehicleIds: [vehicles.body.vehicles[0].id],
      crates: crates.body.crates.slice(0, 3).map((c: { id: string }) => ({ crateId: c.id })),
      timeLimitMs: 500,
    });
    expect(started.status, JSON.stringify(started.body)).toBe(202);
    const runId = started.body.run.id as string;
    // Seen on B at once (queued or already running), and followed there to its end.
    const seen = await onB.request('GET', `/api/productions/${productionId}/loads/runs/${runId}`);
    expect(seen.status, JSON.stringify(seen.body)).toBe(200);
    expect(seen.body.run.id).toBe(runId);
    let status = seen.body.run.status as string;
    const deadline = Date.now() + 60_000;
    while (!['done', 'failed'].includes(status) && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 300));
      status = (await onB.request('GET', `/api/productions/${productionId}/loads/runs/${runId}`)).body.run.status;
    }
    expect(status).toBe('done');
    await onA.request('DELETE', `/api/productions/${productionId}/loads/runs/${runId}`);
  }, 90_000);

  it('both keep serving afterwards', async () => {
    for (const s of [a, b]) expect((await new HttpClient(s.base).request('GET', '/api/health')).status).toBe(200);
  });
});
