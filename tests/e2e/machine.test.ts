import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, signIn } from './browser.ts';

const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

describe('machine screen in the browser', () => {
  it('a planner opens Machine and sees the demo sections with their masses', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signIn(page, baseUrl, 'planner');
    const nav = page.getByRole('navigation', { name: 'Main' });
    // The demo tour holds the machine; the switcher may have landed on the other production.
    const switcher = page.getByLabel('Production', { exact: true });
    const tour = await switcher.locator('option', { hasText: 'European' }).getAttribute('value');
    if (tour && !page.url().includes(tour)) await switcher.selectOption(tour);
    await nav.getByRole('link', { name: 'Machine' }).click();
    await page.waitForURL(/\/p\/[^/]+\/machine$/);
    await page.getByRole('heading', { name: /^BQ1/ }).waitFor({ timeout: 20_000 });
    for (const code of ['BQ1', 'BQ2', 'BQ3', 'BQ4', 'DC', 'AC', 'PC', 'CD', 'TF']) {
      await expect(page.getByRole('heading', { name: new RegExp(`^${code}`) }).count()).resolves.toBe(1);
    }
    const masses = await page.getByTestId('section-mass').allTextContents();
    expect(masses).toHaveLength(9);
    // Every section of the demo weighs something, in kilograms (the planner's units are metric).
    for (const m of masses) expect(m).toMatch(/^[\d,]+\.\d kg$/);
    const dc = Number(masses[4].replace(/[^\d.]/g, ''));
    expect(dc).toBeGreaterThan(400);
    expect(dc).toBeLessThan(480);
    // The breakdown table scrolls through the demo's lines.
    await page.getByRole('tab', { name: 'Breakdown' }).click();
    await page.getByRole('table', { name: 'Machine breakdown' }).waitFor();
    await expect(page.getByText(/2,5\d\d lines/).count()).resolves.toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await context.close();
  });
});
