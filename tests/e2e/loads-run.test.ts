import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, signIn } from './browser.ts';

const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser({ webgl: true });
});
afterAll(async () => browser?.close());

describe('a packing run in the browser', () => {
  it('opens the demo run of the first leg and shows its figures and the 3D load', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signIn(page, baseUrl, 'planner');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Crates & loads' }).click();
    await page.getByRole('link', { name: 'BQ1' }).waitFor();
    await page.getByRole('link', { name: /Vehicles and packing runs/ }).click();
    await page.getByRole('link', { name: /^Leg 1/ }).click();
    const figures = page.getByTestId('run-figures');
    await figures.waitFor();
    expect(await figures.textContent()).toMatch(/crates in 1 vehicle/);
    // The arm carousel crate fits no road vehicle: said with the reason.
    expect(await page.getByText(/did not fit/).count()).toBeGreaterThan(0);
    const view = page.getByRole('img', { name: /3D view of/ });
    await view.locator('canvas').waitFor({ timeout: 20_000 });
    const box = await view.locator('canvas').boundingBox();
    expect(box!.width).toBeGreaterThan(100);
    expect(box!.height).toBeGreaterThan(100);
    // Stepping back through the load order draws fewer crates.
    const slider = page.getByRole('slider', { name: 'Crates loaded' });
    await slider.fill('3');
    expect(await page.getByText(/Load order: 3 of/).count()).toBe(1);
    expect(errors).toEqual([]);
    await context.close();
  });
});
