import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, demoProductionId, type TestApp } from './helpers.ts';
import { DEMO_USERS } from '../../seeds/01_demo.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => t.close());

describe('sign-in', () => {
  it('signs in the demo planner and returns their memberships', async () => {
    const agent = await t.signIn('planner');
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe('planner@ballast.example');
    const names = me.body.user.memberships.map((m: { productionName: string; role: string }) => `${m.productionName}: ${m.role}`);
    expect(names).toContain('Orrery Seven — European and Canadian tour: planner');
    expect(names).toContain('Orrery Seven — workshop rebuild: planner');
  });

  it('sets an httpOnly, SameSite=Lax session cookie', async () => {
    const agent = await t.anonymous();
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', agent.csrf).send({ email: 'rigger@ballast.example', password: 'demo-rigger-2027' }).expect(200);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/ballast\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('marks the cookie Secure behind an HTTPS load balancer when trust proxy is set', async () => {
    const behind = await createTestApp({ TRUST_PROXY: '1' });
    try {
      const agent = await behind.anonymous();
      const res = await agent
        .post('/api/auth/sign-in')
        .set('x-forwarded-proto', 'https')
        .set('x-csrf-token', agent.csrf)
        .send({ email: 'rigger@ballast.example', password: 'demo-rigger-2027' })
        .expect(200);
      expect(String(res.headers['set-cookie'])).toMatch(/Secure/);
    } finally {
      await behind.close();
    }
  });

  it('refuses a wrong password with 401 and names no detail', async () => {
    const agent = await t.anonymous();
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', agent.csrf).send({ email: 'rigger@ballast.example', password: 'nope-nope-nope' });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_credentials');
  });

  it('names the field for a malformed body (400, not 500)', async () => {
    const agent = await t.anonymous();
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', agent.csrf).send({ email: 'not-an-address' });
    expect(res.status).toBe(400);
    const paths = res.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toContain('email');
    expect(paths).toContain('password');
  });

  it('limits repeated failed sign-ins per account, shared through the database', async () => {
    const limited = await createTestApp({ SIGNIN_MAX_PER_ACCOUNT: '3' });
    const other = await createTestApp({ SIGNIN_MAX_PER_ACCOUNT: '3' });
    try {
      const email = 'limit-test@ballast.example';
      for (let i = 0; i < 3; i++) {
        const a = await limited.anonymous();
        const r = await a.post('/api/auth/sign-in').set('x-csrf-token', a.csrf).send({ email, password: 'wrong-password-x' });
        expect(r.status).toBe(401);
      }
      // A second app server sees the same count.
      const b = await other.anonymous();
      const r = await b.post('/api/auth/sign-in').set('x-csrf-token', b.csrf).send({ email, password: 'wrong-password-x' });
      expect(r.status).toBe(429);
      expect(r.body.error.message).toMatch(/Try again in/);
      expect(Number(r.headers['retry-after'])).toBeGreaterThan(0);
    } finally {
      await limited.close();
      await other.close();
    }
  });

  it('refuses a state-changing request without the CSRF token', async () => {
    const agent = await t.signIn('planner');
    const res = await agent.patch('/api/auth/me/preferences').send({ units: 'imperial' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
    const ok = await agent.patch('/api/auth/me/preferences').set('x-csrf-token', agent.csrf).send({ units: 'imperial' });
    expect(ok.status).toBe(200);
    expect(ok.body.user.units).toBe('imperial');
    await agent.patch('/api/auth/me/preferences').set('x-csrf-token', agent.csrf).send({ units: 'metric' }).expect(200);
  });

  it('signs out: the session no longer works', async () => {
    const agent = await t.signIn('rigger');
    await agent.post('/api/auth/sign-out').set('x-csrf-token', agent.csrf).expect(204);
    await agent.get('/api/auth/me').expect(401);
  });
});

describe('health and unknown routes', () => {
  it('reports the database as up', async () => {
    const res = await (await t.anonymous()).get('/api/health').expect(200);
    expect(res.body).toEqual({ ok: true, database: 'up' });
  });
  it('answers unknown API routes with JSON 404', async () => {
    const res = await (await t.signIn('planner')).get('/api/no-such-thing').expect(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('optimistic concurrency', () => {
  it('gives 409 with the current record to a stale save, never overwriting', async () => {
    const id = await demoProductionId(t.db);
    const a = await t.signIn('planner');
    const { body } = await a.get(`/api/productions/${id}`).expect(200);
    const v = body.production.version;
    const first = await a.patch(`/api/productions/${id}`).set('x-csrf-token', a.csrf).send({ version: v, paperSize: 'Letter' }).expect(200);
    expect(first.body.production.version).toBe(v + 1);
    const stale = await a.patch(`/api/productions/${id}`).set('x-csrf-token', a.csrf).send({ version: v, paperSize: 'A4' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.current.paperSize).toBe('Letter');
    expect(stale.body.error.current.version).toBe(v + 1);
    await a.patch(`/api/productions/${id}`).set('x-csrf-token', a.csrf).send({ version: v + 1, paperSize: 'A4' }).expect(200);
  });
});

describe('passwords', () => {
  it('stores scrypt hashes, never the password', async () => {
    const row = await t.db('users').where({ email: DEMO_USERS[0].email }).first();
    expect(row.password_hash).toMatch(/^scrypt\$32768\$8\$1\$/);
    expect(row.password_hash).not.toContain(DEMO_USERS[0].password);
  });
});
