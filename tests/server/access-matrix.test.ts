import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { routeTable, type MountedRoute } from '../../server/http/routes.ts';
import { roleMay, ACTIONS } from '../../src/domain/policy/index.ts';
import { createTestApp, demoProductionId, type Agent, type DemoRole, type TestApp } from './helpers.ts';

/**
 * Generated from the route table that the app itself mounts, so a new route is covered here
 * without anyone remembering to add it.
 */
// Built at collection time (top-level await), so that the route table is filled before the
// test cases are generated from it.
const t: TestApp = await createTestApp();
let productionId: string;
let strangerProductionId: string;
const agents = {} as Record<DemoRole, Agent>;
let anonymous: Agent;

const PUBLIC_ROUTES = new Set([
  'get /api/health',
  'get /api/auth/csrf',
  'post /api/auth/sign-in',
  'get /api/invitations/:token',
  'post /api/invitations/:token/accept',
  'post /api/auth/password-reset/request',
  'post /api/auth/password-reset/complete',
]);

beforeAll(async () => {
  productionId = await demoProductionId(t.db);
  const [stranger] = await t.db('productions').insert({ name: `Stranger production ${randomUUID()}` }).returning('id');
  strangerProductionId = stranger.id;
  anonymous = await t.anonymous();
  for (const role of ['admin', 'planner', 'rigger', 'venue'] as DemoRole[]) agents[role] = await t.signIn(role);
});
afterAll(async () => t.close());

function concrete(path: string, production: string): string {
  return path.replace(/:(\w+)/g, (_, name: string) => (name === 'productionId' ? production : name === 'token' ? 'not-a-token-at-all' : randomUUID()));
}

function send(agent: Agent, r: MountedRoute, production = productionId) {
  const url = concrete(r.path, production);
  const req = agent[r.method](url);
  return r.method === 'get' ? req : req.set('x-csrf-token', agent.csrf).send({});
}

describe('route table', () => {
  it('has routes, and exactly the public ones need no sign-in', () => {
    expect(routeTable.length).toBeGreaterThan(10);
    const publicOnes = routeTable.filter((r) => r.access.kind === 'public').map((r) => `${r.method} ${r.path}`);
    expect(new Set(publicOnes)).toEqual(PUBLIC_ROUTES);
  });
  it('names only actions the policy knows', () => {
    for (const r of routeTable) if (r.access.kind === 'action') expect(ACTIONS).toContain(r.access.action);
  });
});

describe('anonymous requests get 401 on every non-public route', () => {
  it.each(routeTable.filter((r) => r.access.kind !== 'public').map((r) => [`${r.method.toUpperCase()} ${r.path}`, r] as const))('%s', async (_name, r) => {
    const res = await send(anonymous, r);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('each role is refused outside its rights', () => {
  const roles: DemoRole[] = ['admin', 'planner', 'rigger', 'venue'];
  const cases = routeTable
    .filter((r) => r.access.kind === 'action')
    .flatMap((r) => roles.map((role) => [`${role} ${r.method.toUpperCase()} ${r.path}`, role, r] as const));
  it.each(cases)('%s', async (_name, role, r) => {
    if (r.access.kind !== 'action') return;
    const isAdmin = role === 'admin';
    const productionRole = role === 'admin' ? null : role;
    const allowed = roleMay(productionRole, isAdmin, r.access.action);
    const res = await send(agents[role], r);
    if (!allowed) {
      expect(res.status, JSON.stringify(res.body)).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    } else {
      expect(res.status).not.toBe(401);
      // Venue users may still be refused by venue scope inside the service.
      if (role !== 'venue') expect(res.status, JSON.stringify(res.body)).not.toBe(403);
    }
  });
});

describe('a member of one production cannot reach another by id', () => {
  const scoped = routeTable.filter((r) => r.path.includes(':productionId') && r.access.kind === 'action' && r.access.action !== 'people.manage');
  it.each(scoped.map((r) => [`${r.method.toUpperCase()} ${r.path}`, r] as const))('%s', async (_name, r) => {
    for (const role of ['planner', 'rigger', 'venue'] as DemoRole[]) {
      const res = await send(agents[role], r, strangerProductionId);
      expect(res.status).toBe(403);
    }
  });
});
