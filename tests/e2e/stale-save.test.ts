import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, signIn, tourProductionId } from './browser.ts';

/**
 * Two planners (two browsers) edit the same crate. The first saves; the second, still holding the old version,
 * saves other fields and is shown both versions; "Keep mine" saves only their own change on top, so both edits
 * survive.
 */
const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

/** Calls the API from the page, with its session and a CSRF token, as the client does. */
async function call(page: Page, method: string, path: string, body?: unknown): Promise<{ status: number; body: Record<string, unknown> }> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const { csrfToken } = await (await fetch('/api/auth/csrf')).json();
      const res = await fetch(path, { method, headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken }, body: body === undefined ? undefined : JSON.stringify(body) });
      return { status: res.status, body: res.status === 204 ? {} : await res.json() };
    },
    { method, path, body },
  );
}

describe('two planners save the same crate', () => {
  it('the second is shown both versions and "Keep mine" keeps both edits', async () => {
    const [ca, cb] = [await browser.newContext(), await browser.newContext()];
    const [a, b] = [await ca.newPage(), await cb.newPage()];
    const errors: string[] = [];
    for (const p of [a, b]) p.on('pageerror', (e) => errors.push(e.message));
    await signIn(a, baseUrl, 'planner');
    await signIn(b, baseUrl, 'planner');
    const pid = await tourProductionId(a);
    const created = await call(a, 'POST', `/api/productions/${pid}/crates`, { code: 'E2E-STALE', kind: 'stock', outerMm: [1000, 800, 600], tareKg: 40 });
    expect(created.status).toBe(201);
    const crateId = (created.body.crate as { id: string }).id;
    const url = `${baseUrl}/p/${pid}/crates/${crateId}`;
    await a.goto(url);
    await b.goto(url);
    const form = (p: Page) => p.getByRole('form', { name: 'Crate details' });
    await form(a).getByLabel('Name').waitFor();
    await form(b).getByLabel('Name').waitFor();

    // B starts editing; A saves a new name meanwhile.
    await form(b).getByLabel('Notes').fill('Gears wrapped in foam');
    await form(a).getByLabel('Name').fill('Spare gears');
    const saved = a.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().includes(crateId));
    await form(a).getByRole('button', { name: 'Save crate' }).click();
    expect((await saved).status()).toBe(200);

    // B saves from the old version: refused, and both versions are shown.
    await form(b).getByRole('button', { name: 'Save crate' }).click();
    const box = b.getByRole('alert').filter({ hasText: 'Someone else saved this crate while you were editing' });
    await box.waitFor();
    expect(await box.getByRole('row', { name: /Name/ }).textContent()).toContain('Spare gears');
    expect(await box.getByRole('row', { name: /Notes/ }).textContent()).toContain('Gears wrapped in foam');
    const kept = b.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().includes(crateId) && r.status() === 200);
    await box.getByRole('button', { name: 'Keep mine' }).click();
    await kept;

    // Nothing was lost: A's name and B's notes are both on the crate.
    const now = (await call(a, 'GET', `/api/productions/${pid}/crates/${crateId}`)).body.crate as { name: string; notes: string; version: number };
    expect(now).toMatchObject({ name: 'Spare gears', notes: 'Gears wrapped in foam', version: 3 });
    expect(errors).toEqual([]);
    await call(a, 'DELETE', `/api/productions/${pid}/crates/${crateId}`);
    await ca.close();
    await cb.close();
  });
});
