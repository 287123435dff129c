import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { createTestApp, demoProductionId, type TestApp } from './helpers.ts';
import { loadConfig } from '../../server/config/env.ts';

let t: TestApp;
let productionId: string;
beforeAll(async () => {
  t = await createTestApp();
  productionId = await demoProductionId(t.db);
});
afterAll(async () => t.close());

/** Waits for the SMTP catcher (a real SMTP server on loopback) to store a message to `to`. */
async function caughtMail(to: string): Promise<{ subject: string; text: string }> {
  const admin = await t.signIn('admin');
  for (let i = 0; i < 50; i++) {
    const res = await admin.get('/api/admin/mail').expect(200);
    const m = res.body.messages.find((x: { to: string }) => x.to.includes(to));
    if (m) return m;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to}`);
}

describe('invitations', () => {
  it('admin invites by e-mail; the invitee sets a password from the link and is a member', async () => {
    const email = `crew-${randomUUID().slice(0, 8)}@ballast.example`;
    const admin = await t.signIn('admin');
    const res = await admin
      .post('/api/admin/invitations')
      .set('x-csrf-token', admin.csrf)
      .send({ email, name: 'New Rigger', membership: { productionId, role: 'rigger' } })
      .expect(201);
    expect(res.body.invitation.delivered).toBe(true);

    const mail = await caughtMail(email);
    expect(mail.subject).toMatch(/invited/i);
    const token = /\/invite\/([\w-]+)/.exec(mail.text)![1];

    const visitor = await t.anonymous();
    const peek = await visitor.get(`/api/invitations/${token}`).expect(200);
    expect(peek.body.email).toBe(email);
    const accepted = await visitor.post(`/api/invitations/${token}/accept`).set('x-csrf-token', visitor.csrf).send({ name: 'Nia Rigger', password: 'a-long-passphrase' }).expect(200);
    expect(accepted.body.user.memberships[0]).toMatchObject({ productionId, role: 'rigger' });

    // The invitation works once only.
    await visitor.post(`/api/invitations/${token}/accept`).set('x-csrf-token', accepted.body.csrfToken).send({ name: 'Again', password: 'a-long-passphrase' }).expect(404);
    await t.signIn({ email, password: 'a-long-passphrase' });
  });

  it('refuses an invitation for an e-mail that has an account, naming the field', async () => {
    const admin = await t.signIn('admin');
    const res = await admin.post('/api/admin/invitations').set('x-csrf-token', admin.csrf).send({ email: 'planner@ballast.example', name: 'Dup' }).expect(400);
    expect(res.body.error.issues[0].path).toBe('email');
  });

  it('refuses a venue membership without venues', async () => {
    const admin = await t.signIn('admin');
    const res = await admin
      .post('/api/admin/invitations')
      .set('x-csrf-token', admin.csrf)
      .send({ email: `v-${randomUUID().slice(0, 6)}@ballast.example`, name: 'V', membership: { productionId, role: 'venue' } })
      .expect(400);
    expect(res.body.error.issues[0].path).toBe('membership.venueIds');
  });
});

describe('password reset and change', () => {
  it('resets a forgotten password by e-mail, once', async () => {
    const email = `reset-${randomUUID().slice(0, 8)}@ballast.example`;
    const admin = await t.signIn('admin');
    await admin.post('/api/admin/invitations').set('x-csrf-token', admin.csrf).send({ email, name: 'Forgetful' }).expect(201);
    const token = /\/invite\/([\w-]+)/.exec((await caughtMail(email)).text)![1];
    const v = await t.anonymous();
    await v.post(`/api/invitations/${token}/accept`).set('x-csrf-token', v.csrf).send({ name: 'Forgetful', password: 'first-password-1' }).expect(200);

    const anon = await t.anonymous();
    await anon.post('/api/auth/password-reset/request').set('x-csrf-token', anon.csrf).send({ email }).expect(202);
    // Unknown addresses get the same answer.
    await anon.post('/api/auth/password-reset/request').set('x-csrf-token', anon.csrf).send({ email: 'nobody@ballast.example' }).expect(202);
    let link = '';
    for (let i = 0; i < 50 && !link; i++) {
      const res = await admin.get('/api/admin/mail').expect(200);
      const m = res.body.messages.find((x: { to: string; subject: string }) => x.to.includes(email) && /reset/i.test(x.subject));
      if (m) link = m.text;
      else await new Promise((r) => setTimeout(r, 100));
    }
    const resetToken = decodeURIComponent(/token=([^\s]+)/.exec(link)![1]);
    await anon.post('/api/auth/password-reset/complete').set('x-csrf-token', anon.csrf).send({ token: resetToken, password: 'second-password-2' }).expect(204);
    const again = await anon.post('/api/auth/password-reset/complete').set('x-csrf-token', anon.csrf).send({ token: resetToken, password: 'third-password-3' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
    const agent = await t.signIn({ email, password: 'second-password-2' });

    // Change password needs the current one.
    const wrong = await agent.post('/api/auth/me/password').set('x-csrf-token', agent.csrf).send({ currentPassword: 'nope', newPassword: 'fourth-password-4' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.issues[0].path).toBe('currentPassword');
    await agent.post('/api/auth/me/password').set('x-csrf-token', agent.csrf).send({ currentPassword: 'second-password-2', newPassword: 'fourth-password-4' }).expect(204);
    await t.signIn({ email, password: 'fourth-password-4' });
  });
});

describe('memberships', () => {
  it('admin changes a role; the change applies to the next request at once', async () => {
    const admin = await t.signIn('admin');
    const email = `m-${randomUUID().slice(0, 8)}@ballast.example`;
    await admin.post('/api/admin/invitations').set('x-csrf-token', admin.csrf).send({ email, name: 'Mover', membership: { productionId, role: 'rigger' } }).expect(201);
    const token = /\/invite\/([\w-]+)/.exec((await caughtMail(email)).text)![1];
    const v = await t.anonymous();
    const acc = await v.post(`/api/invitations/${token}/accept`).set('x-csrf-token', v.csrf).send({ name: 'Mover', password: 'mover-password-1' }).expect(200);
    const userId = acc.body.user.id;
    const patch = () => v.patch(`/api/productions/${productionId}`).set('x-csrf-token', acc.body.csrfToken).send({ version: 0 });
    expect((await patch()).status).toBe(403);
    await admin.put(`/api/admin/productions/${productionId}/members/${userId}`).set('x-csrf-token', admin.csrf).send({ role: 'planner' }).expect(200);
    // Now a planner: the request gets as far as the version check.
    expect((await patch()).status).toBe(409);
    await admin.delete(`/api/admin/productions/${productionId}/members/${userId}`).set('x-csrf-token', admin.csrf).expect(204);
    expect((await v.get(`/api/productions/${productionId}`)).status).toBe(403);
  });
});

describe('configuration', () => {
  it('refuses to start with a clear message naming the variable', () => {
    const bad = () => loadConfig({ DATABASE_URL: 'mysql://x', PORT: 'abc' });
    expect(bad).toThrow(/DATABASE_URL: must be a postgres:\/\/ connection URL/);
    expect(bad).toThrow(/PORT: /);
    expect(() => loadConfig({ DATABASE_URL: 'postgres://x/y', NODE_ENV: 'production' })).toThrow(/SESSION_SECRET: is required in production/);
  });
});
