import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, signIn } from './browser.ts';

const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

/** A phone: 390 × 844 CSS pixels, touch. */
async function phone(): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return { context, page, errors };
}

const count = (page: Page, which: string) => page.getByTestId(`count-${which}`).textContent().then((t) => Number(t));

describe('check-in on a phone', () => {
  it('venue staff open Check-in from the menu, tick a crate in and see the count change', async () => {
    const { context, page, errors } = await phone();
    await signIn(page, baseUrl, 'venue', 'production');
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Check-in' }).click();
    // Venue staff of Loomworks Hall see their own engagement only.
    const engagements = page.getByRole('link', { name: /Loomworks Hall/ });
    await engagements.first().waitFor();
    expect(await page.getByRole('link', { name: /Sala Ventolina/ }).count()).toBe(0);
    await engagements.first().click();
    await page.getByRole('heading', { name: 'Check in: Loomworks Hall' }).waitFor();

    const expected = await count(page, 'expected');
    expect(expected).toBeGreaterThan(0);
    const before = await count(page, 'here');
    const crate = page.getByRole('list', { name: 'Crates' }).getByRole('listitem').first();
    const code = (await crate.locator('span.font-semibold').first().textContent())!.trim();
    await crate.getByRole('button', { name: `${code}: here` }).click();
    await expect.poll(() => count(page, 'here')).toBe(before + 1);
    await expect.poll(() => page.getByTestId(`state-${code}`).textContent()).toBe('here');
    // Nothing is wider than the phone.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('a scan made offline is kept on the phone and sent when the connection returns', async () => {
    const { context, page } = await phone();
    await signIn(page, baseUrl, 'venue', 'production');
    const productionId = /\/p\/([0-9a-f-]{36})/.exec(page.url())![1];
    await page.goto(`${baseUrl}/p/${productionId}/check-in`);
    await page.getByRole('link', { name: /Loomworks Hall/ }).first().click();
    await page.getByRole('heading', { name: 'Check in: Loomworks Hall' }).waitFor();
    const crate = page.getByRole('list', { name: 'Crates' }).getByRole('listitem').nth(1);
    const code = (await crate.locator('span.font-semibold').first().textContent())!.trim();
    const before = await count(page, 'here');

    await context.setOffline(true);
    await crate.getByRole('button', { name: `${code}: here` }).click();
    await expect.poll(() => count(page, 'here')).toBe(before + 1);
    await page.getByText(/1 scan waiting to be sent/).waitFor();
    await page.getByText(/kept on this phone/).first().waitFor();

    await context.setOffline(false);
    await page.getByText(/waiting to be sent/).waitFor({ state: 'detached', timeout: 20_000 });
    // The server has it now.
    const engagementId = /check-in\/([0-9a-f-]{36})/.exec(page.url())![1];
    const status = await page.evaluate(async (url) => (await fetch(url)).json(), `/api/productions/${productionId}/tour/engagements/${engagementId}/check`);
    const row = status.status.crates.find((c: { code: string }) => c.code === code);
    expect(row.in.state).toBe('arrived');
    await context.close();
  });
});
