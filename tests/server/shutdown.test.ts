import { afterAll, describe, expect, it } from 'vitest';
import { request } from 'node:http';
import { DEMO_USERS } from '../../seeds/01_demo.ts';
import { HttpClient, killAllAppProcesses, spawnApp } from './reliability-helpers.ts';

/**
 * Graceful shutdown of a real app process (`node --import tsx server/index.ts`): SIGTERM arrives while a
 * request is still coming in slowly; the process stops taking new connections, finishes that request with its
 * normal answer, and exits 0. The process is killed at the end whatever happens.
 */

const planner = DEMO_USERS.find((u) => u.email.startsWith('planner@'))!;

afterAll(async () => killAllAppProcesses());

describe('graceful shutdown', () => {
  it('finishes a request in flight on SIGTERM, refuses new connections, then exits 0', async () => {
    const app = await spawnApp({ DATABASE_URL: process.env.DATABASE_URL!, BALLAST_MIGRATE_ON_START: 'false', BALLAST_DEMO: 'false', LOG_LEVEL: 'info' }, { readyTimeoutMs: 60_000 });
    const client = new HttpClient(app.base);
    expect((await client.signIn(planner.email, planner.password)).status).toBe(200);
    const me = await client.request('GET', '/api/auth/me');
    const units = me.body.user.units as string;

    // A save whose body arrives in two parts, the second only after SIGTERM.
    let answered = '';
    const answer = new Promise<number>((resolve, reject) => {
      const req = request(
        `${app.base}/api/auth/me/preferences`,
        { method: 'PATCH', headers: { 'content-type': 'application/json', cookie: client.cookieHeader(), 'x-csrf-token': client.csrf, 'transfer-encoding': 'chunked' } },
        (res) => {
          res.on('data', (d) => (answered += String(d)));
          res.on('end', () => resolve(res.statusCode ?? 0));
        },
      );
      req.on('error', reject);
      req.write('{"units":');
      setTimeout(() => {
        app.child.kill('SIGTERM');
        setTimeout(async () => {
          try {
            // Still running: the request is open. New connections are no longer taken.
            expect(app.child.exitCode).toBeNull();
            await expect(fetch(`${app.base}/api/health`, { signal: AbortSignal.timeout(3_000) })).rejects.toThrow();
            req.end(`${JSON.stringify(units)}}`);
          } catch (err) {
            reject(err);
          }
        }, 1_000);
      }, 500);
    });
    const status = await answer;
    expect(status, answered).toBe(200);
    expect(JSON.parse(answered).user.units).toBe(units);
    const exit = await Promise.race([app.exited, new Promise<'timeout'>((r) => setTimeout(() => r('timeout'), 15_000))]);
    expect(exit, app.output()).toEqual({ code: 0, signal: null });
    expect(app.output()).toMatch(/shutting down/);
  }, 90_000);
});
