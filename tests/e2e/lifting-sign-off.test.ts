import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, signIn, tourProductionId } from './browser.ts';

const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

describe('lift plan sign-off in the browser', () => {
  it('a rigger opens the submitted drive core plan, sees figures and cautions, and approves it', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signIn(page, baseUrl, 'rigger');
    const id = await tourProductionId(page);
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
