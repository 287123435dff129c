import { chromium, type Browser, type Page } from 'playwright-core';
import { DEMO_USERS } from '../../seeds/01_demo.ts';

/**
 * Debian's Chromium, headless, with no background traffic (the machine has no open network). With `webgl`,
 * WebGL runs on its software rasteriser, so a 3D view can draw without a GPU.
 */
export function launchBrowser(options: { webgl?: boolean } = {}): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      ...(options.webgl ? ['--use-angle=swiftshader', '--enable-unsafe-swiftshader', '--ignore-gpu-blocklist'] : ['--disable-gpu']),
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export type DemoRole = 'admin' | 'planner' | 'rigger' | 'venue';

/**
 * Signs in through the sign-in form as a demo user and waits until the app has let them in: the main
 * navigation is there, or (`until: 'production'`, for phones where the navigation sits behind a menu) the
 * address names a production.
 */
export async function signIn(page: Page, baseUrl: string, role: DemoRole, until: 'navigation' | 'production' = 'navigation'): Promise<void> {
  const user = DEMO_USERS.find((u) => u.email.startsWith(`${role}@`))!;
  await page.goto(`${baseUrl}/`);
  await page.getByLabel('E-mail').fill(user.email);
  await page.getByLabel('Password', { exact: true }).fill(user.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  if (until === 'production') await page.waitForURL(/\/p\/[0-9a-f-]{36}/);
  else await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

/** The id of the demo tour production, as the signed-in person's memberships name it. */
export async function tourProductionId(page: Page): Promise<string> {
  const me = await page.evaluate(async () => (await fetch('/api/auth/me')).json());
  return me.user.memberships.find((m: { productionName: string }) => /European and Canadian tour/.test(m.productionName)).productionId;
}
