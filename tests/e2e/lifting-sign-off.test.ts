import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser } from './browser.ts';
import { DEMO_USERS } from '../../seeds/01_demo.ts';

const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

async function signIn(page: Page, role: string): Promise<void> {
  const user = DEMO_USERS.find((u) => u.email.startsWith(`${role}@`))!;
  await page.goto(`${baseUrl}/`);
  await page.getByLabel('E-mail').fill(user.email);
  await page.getByLabel('Password', { exact: true }).fill(user.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

async function tourId(page: Page): Promise<string> {
  const me = await page.evaluate(async () => (await fetch('/api/auth/me')).json());
  return me.user.memberships.find((m: { productionName: string }) => /European and Canadian tour/.test(m.productionName)).productionId;
}

describe('lift plan sign-off in the browser', () => {
  it('a rigger opens the submitted drive core plan, sees figures and cautions, and approves it', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signIn(page, 'rigger');
    const id = await tourId(page);
    await page.goto(`${baseUrl}/p/${id}/lifting`);
    await page.getByRole('heading', { name: 'Lift plans' }).waitFor();
    await page.getByRole('link', { name: /^Drive core: lift off/ }).click();
    await page.waitForURL(/\/lifting\/plans\/[0-9a-f-]+$/);

    // The figures the server worked out, with the cautions and no unresolved problem.
    await page.getByText('Within capacity').first().waitFor();
    await page.getByText('Never stand or pass under a suspended load.').first().waitFor();
    expect(await page.getByTestId('dynamic-hook-load').textContent()).toMatch(/kg/);
    expect(await page.getByText('Submitted', { exact: true }).count()).toBeGreaterThan(0);

    // The 3D view loads lazily and draws.
    await page.getByRole('button', { name: 'Show 3D view' }).click();
    await page.locator('canvas').first().waitFor({ timeout: 30_000 });

    await page.getByRole('textbox', { name: /Comment/ }).fill('Checked against the venue drawing.');
    await page.getByRole('button', { name: 'Approve' }).click();
    await page.getByText('Approved for these figures.', { exact: false }).waitFor();
    expect(await page.getByText('Review comment: Checked against the venue drawing.').count()).toBe(1);
    await page.getByText('Approved', { exact: true }).first().waitFor();
    // History keeps every step.
    const history = page.getByRole('heading', { name: 'History' }).locator('xpath=ancestor::section[1]');
    expect(await history.textContent()).toMatch(/Created.*Submitted for review.*Approved/s);
    expect(errors).toEqual([]);
    await context.close();
  });
});
