import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './helpers.ts';

/**
 * `npm run admin:create` on an installation where nobody can sign in yet: the script (run for real, as an
 * operator would) makes the person an administrator and prints a one-time link; following it sets the password,
 * and the person signs in and reaches the admin pages.
 */
const t: TestApp = await createTestApp();
afterAll(() => t.close());

function createAdmin(email: string, name?: string): string {
  return execFileSync(process.execPath, ['--import', 'tsx', 'scripts/create-admin.ts', '--email', email, ...(name ? ['--name', name] : [])], {
    env: { ...process.env, APP_URL: 'https://ballast.test' },
    encoding: 'utf8',
  });
}

describe('first administrator', () => {
  it('creates the person, prints a one-time link, and the link sets a password that signs in as admin', async () => {
    const email = `ops-${randomUUID().slice(0, 8)}@ballast.example`;
    const out = createAdmin(email.toUpperCase(), 'Ops Lead');
    expect(out).toMatch(/Created .* as an administrator/);
    const token = new URL(/https:\/\/ballast\.test\/reset-password\?token=\S+/.exec(out)![0]).searchParams.get('token')!;
    const row = await t.db('users').whereRaw('lower(email) = ?', [email]).first();
    expect(row).toMatchObject({ email, name: 'Ops Lead', is_admin: true, active: true, password_hash: null });

    const anon = await t.anonymous();
    await anon.post('/api/auth/password-reset/complete').set('x-csrf-token', anon.csrf).send({ token, password: 'a long first password 1' }).expect((r) => expect(r.status).toBeLessThan(300));
    // The link works once.
    await anon.post('/api/auth/password-reset/complete').set('x-csrf-token', anon.csrf).send({ token, password: 'another password 22' }).expect(400);
    const admin = await t.signIn({ email, password: 'a long first password 1' });
    await admin.get('/api/admin/users').expect(200);
  });

  it('promotes an existing person without touching their password, and refuses a non-address', async () => {
    const email = `crew-${randomUUID().slice(0, 8)}@ballast.example`;
    await t.db('users').insert({ email, name: 'Crew', password_hash: 'kept-as-is', is_admin: false, active: false });
    expect(createAdmin(email)).toMatch(/Made .* an administrator/);
    expect(await t.db('users').where({ email }).first()).toMatchObject({ is_admin: true, active: true, password_hash: 'kept-as-is' });
    expect(() => execFileSync(process.execPath, ['--import', 'tsx', 'scripts/create-admin.ts', '--email', 'not-an-address'], { env: process.env, stdio: 'pipe' })).toThrow(/not an e-mail address/);
  });
});
