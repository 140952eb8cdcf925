import type { BrowserContextOptions } from 'playwright-core';
import type { BrowserRig } from './browser';

/** A fresh browser context signed in as `email` (demo password), waiting on the role's home heading. */
export async function signedIn(rig: BrowserRig, email: string, heading: string, options: BrowserContextOptions = {}) {
  const context = await rig.newContext(options);
  const page = await context.newPage();
  await page.goto(`${rig.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('nestkeeper-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: heading }).waitFor();
  return { context, page, nav: page.getByRole('navigation', { name: 'Main navigation' }) };
}

export const phone: BrowserContextOptions = { viewport: { width: 375, height: 740 }, hasTouch: true, isMobile: true };
