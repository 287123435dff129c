import supertest from 'supertest';
import type { Express } from 'express';
import { pino } from 'pino';
import { loadConfig } from '../../server/config/env.ts';
import { openDeps } from '../../server/deps.ts';
import { createApp } from '../../server/app.ts';
import { DEMO_USERS } from '../../seeds/01_demo.ts';
import type { Knex } from 'knex';

export type Agent = ReturnType<typeof supertest.agent> & { csrf: string };

export interface TestApp {
  app: Express;
  db: Knex;
  close(): Promise<void>;
  /** A fresh cookie jar with a CSRF token, not signed in. */
  anonymous(): Promise<Agent>;
  /** Signs in as a demo user (admin, planner, rigger, venue) or any email/password. */
  signIn(who: DemoRole | { email: string; password: string }): Promise<Agent>;
}

export type DemoRole = 'admin' | 'planner' | 'rigger' | 'venue';

export async function createTestApp(overrides: Record<string, string> = {}): Promise<TestApp> {
  const config = loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: process.env.TEST_LOG_LEVEL ?? 'silent', ...overrides });
  const deps = await openDeps(config, pino({ level: process.env.TEST_LOG_LEVEL ?? 'silent' }));
  const app = createApp(deps);
  const anonymous = async (): Promise<Agent> => {
    const agent = supertest.agent(app) as Agent;
    const res = await agent.get('/api/auth/csrf').expect(200);
    agent.csrf = res.body.csrfToken;
    return agent;
  };
  return {
    app,
    db: deps.db,
    close: () => deps.close(),
    anonymous,
    async signIn(who) {
      const cred = typeof who === 'string' ? DEMO_USERS.find((u) => u.email.startsWith(`${who}@`))! : who;
      const agent = await anonymous();
      const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', agent.csrf).send({ email: cred.email, password: cred.password });
      if (res.status !== 200) throw new Error(`sign-in as ${cred.email} failed: ${res.status} ${JSON.stringify(res.body)}`);
      agent.csrf = res.body.csrfToken;
      return agent;
    },
  };
}

export async function demoProductionId(db: Knex, name = 'Orrery Seven — European and Canadian tour'): Promise<string> {
  const row = await db('productions').where({ name }).first();
  return row.id;
}
