import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, signIn } from './browser.ts';

const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

describe('the split advisor in the browser', () => {
  it('a planner opens the advisor, sees the limits with their sources and the proposals (nothing adopted)', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signIn(page, baseUrl, 'planner');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Split advisor' }).click();
    const size = page.getByRole('region', { name: 'Size limit' });
    await size.waitFor({ timeout: 20_000 });
    // The demo tour's tightest door is named as the source of the crate width.
    expect(await size.textContent()).toMatch(/width: .* set by Sala Ventolina/);
    // On the whole tour the demo machine has no split: the assemblies that make it impossible are named.
    await page.getByRole('button', { name: 'Propose splits' }).click();
    await page.getByRole('list', { name: 'What makes it impossible' }).waitFor({ timeout: 30_000 });
    // By mass alone, proposals appear side by side.
    await page.getByLabel('Crate size from').selectOption('none');
    await page.getByRole('region', { name: 'Mass limit' }).waitFor();
    await page.getByRole('button', { name: 'Propose splits' }).click();
    await page.getByRole('region', { name: 'Proposal 1' }).waitFor({ timeout: 30_000 });
    expect(await page.getByRole('button', { name: /Adopt proposal/ }).count()).toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await context.close();
  });
});
