import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, signIn, type DemoRole } from './browser.ts';

const baseUrl = inject('baseUrl');
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

async function navLabels(page: Page): Promise<string[]> {
  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.getByRole('link').first().waitFor();
  return (await nav.getByRole('link').allTextContents()).map((s) => s.trim());
}

describe('each role signs in and sees its own navigation', () => {
  const expected: Record<string, { has: string[]; hasNot: string[] }> = {
    planner: { has: ['Overview', 'Settings'], hasNot: ['People', 'Mail'] },
    rigger: { has: ['Overview'], hasNot: ['Settings', 'People', 'Mail'] },
    venue: { has: ['Overview'], hasNot: ['Settings', 'People', 'Mail'] },
    admin: { has: ['People', 'Mail'], hasNot: ['Settings'] },
  };
  for (const [role, want] of Object.entries(expected)) {
    it(role, async () => {
      const context = await browser.newContext();
      const page = await context.newPage();
      const errors: string[] = [];
      page.on('pageerror', (e) => errors.push(e.message));
      await signIn(page, baseUrl, role as DemoRole);
      const labels = await navLabels(page);
      for (const l of want.has) expect(labels).toContain(l);
      for (const l of want.hasNot) expect(labels).not.toContain(l);
      // Barlow ships with the app; nothing comes from a CDN.
      expect(await page.evaluate(() => document.fonts.check('16px Barlow'))).toBe(true);
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      expect(errors).toEqual([]);
      await context.close();
    });
  }
});

describe('production switcher', () => {
  it('moves the planner to the other production at the same screen', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, baseUrl, 'planner');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Settings' }).click();
    await page.waitForURL(/\/p\/[^/]+\/settings$/);
    const before = new URL(page.url()).pathname.split('/')[2];
    // The settings screen has loaded its production (no navigation still pending) before the switch.
    const name = page.getByRole('textbox', { name: 'Production name' });
    await expect.poll(() => name.inputValue(), { timeout: 20_000 }).toMatch(/European and Canadian tour/i);
    const switcher = page.getByLabel('Production', { exact: true });
    // Other tests may add productions; the demo planner's second one is the workshop rebuild.
    const options = await switcher.locator('option').evaluateAll((os) => os.map((o) => ({ value: (o as HTMLOptionElement).value, text: o.textContent ?? '' })));
    const other = options.find((o) => /workshop rebuild/i.test(o.text))!.value;
    expect(other).not.toBe(before);
    await switcher.selectOption(other);
    await page.waitForURL(new RegExp(`/p/${other}/settings$`));
    await expect.poll(() => name.inputValue(), { timeout: 10_000 }).toMatch(/workshop rebuild/i);
    await context.close();
  });
});
