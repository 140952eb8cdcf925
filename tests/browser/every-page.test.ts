import fs from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { can, roles, type Role } from '../../shared/auth/roles';
import { navItems } from '../../src/app/shell/nav-items';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';
import { WAIT_MS } from '../support/eventually';
import {
  firstRows,
  inFlight,
  inspectPage,
  listen,
  notWalked,
  openAndSettle,
  pagesOf,
  summarize,
  walkPages,
  type PageFindings,
  type WalkIds,
} from '../support/page-walk';

// Every page each role reaches, at a desk (1280 px) and on a phone (375 px): no console error, no failed request, no serious
// or critical axe-core violation, nothing wider than the phone, and dates only in the firm's style (en-GB, "7 Dec 2026").
// One browser; one signed-in desk context per role, whose cookies the phone context takes over.

const people: Record<Role, { email: string; home: string }> = {
  owner: { email: 'owner@demo.test', home: "Owner's overview" },
  manager: { email: 'manager@demo.test', home: 'Shop floor today' },
  technician: { email: 'tech@demo.test', home: 'My kit' },
  billing: { email: 'billing@demo.test', home: 'Billing desk' },
};

let rig: BrowserRig;
let ids: WalkIds;
beforeAll(async () => {
  rig = await startBrowserRig();
  ids = await firstRows(await rig.apiAs('owner@demo.test'));
});
afterAll(() => rig?.close());

type Result = { role: string; viewport: string; path: string; findings: PageFindings };

async function walk(role: string, viewport: '1280' | '375', page: Page, paths: { path: string; heading?: RegExp }[]): Promise<Result[]> {
  const heard = listen(page);
  const pending = inFlight(page);
  const results: Result[] = [];
  for (const { path, heading } of paths) {
    heard.take();
    let drawn: string[] = [];
    try {
      await openAndSettle(page, `${rig.baseUrl}${path}`, pending, WAIT_MS, heading);
    } catch (err) {
      drawn = [`not drawn: ${(err as Error).message.split('\n')[0]}`];
    }
    const found = await inspectPage(page, { phone: viewport === '375' });
    const { consoleErrors, failedRequests } = heard.take();
    results.push({ role, viewport, path, findings: { ...found, consoleErrors: [...drawn, ...consoleErrors], failedRequests } });
  }
  return results;
}

describe('every page', () => {
  it('walks every screen of the router, and every entry of each role’s navigation', () => {
    const router = fs.readFileSync('src/app/router.tsx', 'utf8');
    const patterns = [...router.matchAll(/path: '([^']+)'/g), ...router.matchAll(/\['(\/[^']*)', \(\) => import/g)].map((m) => m[1]);
    const walked = new Set(walkPages.map((p) => p.route));
    expect(patterns.filter((p) => !walked.has(p) && !(p in notWalked))).toEqual([]);
    for (const role of roles) {
      const reached = pagesOf(role, can).map((p) => p.path(ids).split('?')[0]);
      const nav = navItems.filter((n) => !n.capability || can(role, n.capability)).map((n) => n.to);
      expect(nav.filter((to) => !reached.includes(to))).toEqual([]);
    }
  });

  it('starts signed out without an error: the sign-in page, with nothing in the console', async () => {
    const context = await rig.newContext();
    const page = await context.newPage();
    const pending = inFlight(page);
    const heard = listen(page);
    const results: Result[] = [];
    for (const [path, heading] of [
      ['/', /Sign in/],
      ['/forgot-password', /password/i],
    ] as const) {
      await openAndSettle(page, `${rig.baseUrl}${path}`, pending, WAIT_MS, heading);
      results.push({ role: 'signed out', viewport: '1280', path, findings: { ...(await inspectPage(page, { phone: false })), ...heard.take() } });
    }
    expect(new URL(page.url()).pathname).toBe('/forgot-password');
    expect(summarize(results), 'pages with problems').toBe('');
    await context.close();
  }, 60_000);

  // A role's walk takes about a minute on a quiet machine: two widths of up to 40 pages, each waited for and checked.
  it.each(roles)(
    'as %s, at 1280 px and 375 px',
    async (role) => {
      const person = people[role];
      const { context: desk, page } = await signedIn(rig, person.email, person.home, { viewport: { width: 1280, height: 900 } });
      const pocket = await rig.newContext({ ...phone, storageState: await desk.storageState() });
      const paths = pagesOf(role, can).map((p) => ({ path: p.path(ids), heading: p.heading }));
      const results = [...(await walk(role, '1280', page, paths)), ...(await walk(role, '375', await pocket.newPage(), paths))];
      await Promise.all([desk.close(), pocket.close()]);
      expect(results).toHaveLength(paths.length * 2);
      expect(summarize(results), `${role}: pages with problems`).toBe('');
    },
    600_000,
  );
});
