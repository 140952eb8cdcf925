import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { eventually } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

async function signIn(page: Page, email: string, password = 'nestkeeper-demo') {
  await page.goto(`${rig.baseUrl}/`);
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

const navLinks = async (page: Page) => (await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link').allInnerTexts()).map((t) => t.trim());

const roles = [
  {
    email: 'owner@demo.test',
    heading: "Owner's overview",
    sees: ['Home', 'Fleet', 'Kits', 'Users', 'Mailbox', 'Routines', 'Settings', 'My account'],
    hidden: [],
  },
  {
    email: 'manager@demo.test',
    heading: 'Shop floor today',
    sees: ['Home', 'Fleet', 'Kits', 'Find by label', 'My account'],
    hidden: ['Users', 'Mailbox', 'Routines', 'Settings'],
  },
  { email: 'tech@demo.test', heading: 'My kit', sees: ['Home', 'Fleet', 'Find by label', 'My account'], hidden: ['Users', 'Mailbox', 'Routines', 'Settings'] },
  { email: 'billing@demo.test', heading: 'Billing desk', sees: ['Home', 'Fleet', 'My account'], hidden: ['Users', 'Mailbox', 'Routines', 'Settings'] },
];

describe('signing in, in a real browser', () => {
  for (const role of roles) {
    it(`${role.email} lands on their own home page with their own navigation`, async () => {
      const context = await rig.newContext();
      const page = await context.newPage();
      await signIn(page, role.email);
      await eventually(() => page.getByRole('heading', { level: 1 }).first().innerText()).toBe(role.heading);
      const links = await navLinks(page);
      for (const name of role.sees) expect(links).toContain(name);
      for (const name of role.hidden) expect(links).not.toContain(name);
      await context.close();
    });
  }

  it('says so when the password is wrong, and stays on the sign-in page', async () => {
    const context = await rig.newContext();
    const page = await context.newPage();
    await signIn(page, 'owner@demo.test', 'wrong-password');
    await eventually(() => page.getByRole('alert').first().innerText()).toMatch(/do not match/);
    expect(page.url()).toMatch(/\/sign-in/);
    await context.close();
  });

  it('shows the owner the mailbox with the welcome message', async () => {
    const context = await rig.newContext();
    const page = await context.newPage();
    await signIn(page, 'owner@demo.test');
    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Mailbox' }).click();
    await eventually(() => page.getByRole('heading', { level: 1 }).first().innerText()).toMatch(/Mailbox/i);
    await context.close();
  });

  it('works on a phone: the technician opens the menu and signs out', async () => {
    const context = await rig.newContext({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
    const page = await context.newPage();
    await signIn(page, 'tech@demo.test');
    await eventually(() => page.getByRole('heading', { level: 1 }).first().innerText()).toBe('My kit');
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    const nav = page.getByRole('navigation', { name: 'Main navigation' });
    await page.getByRole('button', { name: 'Menu' }).click();
    await nav.getByRole('link', { name: 'My account' }).click();
    await page.getByRole('heading', { level: 1, name: 'My account' }).waitFor();
    await page.getByRole('button', { name: 'Sign out', exact: true }).click();
    await page.waitForURL(/\/sign-in/);
    await context.close();
  });

  it('shows a 404 page for an unknown address', async () => {
    const context = await rig.newContext();
    const page = await context.newPage();
    await signIn(page, 'manager@demo.test');
    await page.getByRole('heading', { level: 1, name: 'Shop floor today' }).waitFor();
    await page.goto(`${rig.baseUrl}/no/such/page`);
    await eventually(() => page.locator('body').innerText()).toMatch(/Page not found/);
    await context.close();
  });
});
