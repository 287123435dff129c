import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, signIn, tourProductionId } from './browser.ts';

const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

/** Signs in and returns the production the app opened. */
async function signInTo(page: Page, role: 'planner' | 'venue'): Promise<string> {
  await signIn(page, baseUrl, role, 'production');
  return /\/p\/([0-9a-f-]{36})/.exec(page.url())![1];
}

describe('the planner follows the tour', () => {
  it('sees per engagement what is expected, here, missing and damaged, the flag before the next leg, the manifest and the access matrix', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    const productionId = await signInTo(page, 'planner');
    // The demo tour is the planner's first production; make sure we are on it.
    const tourId = await tourProductionId(page);
    await page.goto(`${baseUrl}/p/${tourId ?? productionId}/tour`);
    await page.getByRole('heading', { name: 'Tour & venues', level: 1 }).waitFor();
    const kelderwerf = page.getByRole('listitem').filter({ has: page.getByRole('link', { name: 'Kelderwerf Hall' }) });
    await kelderwerf.getByText('missing 1').waitFor();
    await kelderwerf.getByText('damaged 1').waitFor();
    await kelderwerf.getByText(/is due on the leg to Sala Ventolina leaving 2027-03-05/).waitFor();

    await page.getByRole('link', { name: 'Sala Ventolina' }).first().click();
    await page.getByRole('heading', { name: /Sala Ventolina, Barcelona/ }).waitFor();
    await page.getByRole('table', { name: 'Crates in unloading order' }).getByText('corridor door B2', { exact: false }).first().waitFor();
    await page.getByRole('button', { name: 'Send the manifest' }).waitFor();

    await page.goto(`${baseUrl}/p/${tourId}/tour/matrix`);
    const matrix = page.getByRole('table', { name: /Access matrix/ });
    await matrix.waitFor();
    expect(await matrix.getByRole('columnheader').count()).toBe(9);
    await page.getByRole('heading', { name: /Failures \(\d+\)/ }).waitFor();
    expect(errors).toEqual([]);
    await context.close();
  });

  it('venue staff edit their own venue, and are refused another one', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const productionId = await signInTo(page, 'venue');
    const venues = await page.evaluate(async (p) => (await (await fetch(`/api/productions/${p}/venues`)).json()).venues, productionId);
    expect(venues.map((v: { name: string }) => v.name)).toEqual(['Loomworks Hall']);
    await page.goto(`${baseUrl}/p/${productionId}/tour/venues/${venues[0].id}`);
    await page.getByRole('heading', { name: 'Loomworks Hall', level: 1 }).waitFor();
    const city = page.getByLabel('City', { exact: true });
    await city.fill('Salford');
    await page.getByRole('button', { name: 'Save venue' }).click();
    await page.getByText('Venue saved.').waitFor();
    await city.fill('Manchester');
    await page.getByRole('button', { name: 'Save venue' }).click();
    await expect.poll(async () => (await page.evaluate(async (u) => (await (await fetch(u)).json()).venue.city, `/api/productions/${productionId}/venues/${venues[0].id}`))).toBe('Manchester');
    const other = await page.evaluate(async (p) => (await fetch(`/api/productions/${p}/venues/00000000-0000-4000-8000-000000000000`)).status, productionId);
    expect(other).toBe(403);
    await context.close();
  });
});
