import { createRequire } from 'node:module';
import fs from 'node:fs';
import type { Page, Request, Response } from 'playwright-core';
import type { Capability, Role } from '../../shared/auth/roles';

/**
 * What every screen must hold for every role, at a desk and on a phone: no console error, no failed request the app did not
 * expect, no serious or critical axe-core violation, nothing wider than a 375 px phone, and dates only in the firm's style.
 * Used by tests/browser/every-page.test.ts; knows nothing of Vitest, so a page can be checked from any script.
 */

/** The records a detail page opens: the first row of each list, as the API answers it to the owner. */
export type WalkIds = {
  asset: string;
  kit: string;
  booking: string;
  bookingOut: string;
  bookingReserved: string;
  rental: string;
  customer: string;
  incident: string;
  check: string;
  impactAsset: string;
};

export type WalkPage = {
  /** The router's path pattern this page stands for (tests/browser/every-page.test.ts checks every pattern is walked). */
  route: string;
  path: (ids: WalkIds) => string;
  /** Who reaches it: the capability of its route's gate (router.tsx); none for every signed-in person. */
  capability?: Capability;
  /** A role that sees the page another way (a technician's home) still has a heading level 1: what it says. */
  heading?: RegExp;
};

/** Every signed-in screen of src/app/router.tsx, with the gate it sits behind there. */
export const walkPages: WalkPage[] = [
  { route: '/', path: () => '/' },
  { route: 'account', path: () => '/account', heading: /My account/ },
  { route: 'fleet', path: () => '/fleet', capability: 'fleet.read', heading: /Fleet/ },
  { route: 'fleet/:id', path: (i) => `/fleet/${i.asset}`, capability: 'fleet.read' },
  { route: 'fleet/:id/record', path: (i) => `/fleet/${i.asset}/record`, capability: 'fleet.read', heading: /record/i },
  { route: 'kits', path: () => '/kits', capability: 'fleet.read', heading: /Kits/ },
  { route: 'kits/:id', path: (i) => `/kits/${i.kit}`, capability: 'fleet.read' },
  { route: 'scan', path: () => '/scan', capability: 'fleet.read' },
  { route: 'checks/:id', path: (i) => `/checks/${i.check}`, capability: 'fleet.read' },
  { route: 'incidents', path: () => '/incidents', capability: 'fleet.read', heading: /Incidents/ },
  { route: 'incidents/:id', path: (i) => `/incidents/${i.incident}`, capability: 'fleet.read' },
  { route: 'calibration/impact/:assetId', path: (i) => `/calibration/impact/${i.impactAsset}`, capability: 'fleet.read' },
  { route: 'calibration', path: () => '/calibration', capability: 'reports.read' },
  { route: 'rentals', path: () => '/rentals', capability: 'reports.read', heading: /Rentals/ },
  { route: 'rentals/:id', path: (i) => `/rentals/${i.rental}`, capability: 'reports.read' },
  { route: 'invoices', path: () => '/invoices', capability: 'reports.read', heading: /Invoices/ },
  { route: 'customers', path: () => '/customers', capability: 'reports.read', heading: /Customers/ },
  { route: 'customers/:id', path: (i) => `/customers/${i.customer}`, capability: 'reports.read' },
  { route: 'billing/reports', path: () => '/billing/reports', capability: 'reports.read' },
  { route: 'audit-pack', path: () => '/audit-pack', capability: 'audit.pack' },
  { route: 'rentals/new', path: () => '/rentals/new', capability: 'rentals.write' },
  { route: 'fleet/:id/calibrate', path: (i) => `/fleet/${i.asset}/calibrate`, capability: 'calibration.record' },
  { route: 'calibration/plan/:assetId', path: (i) => `/calibration/plan/${i.asset}`, capability: 'calibration.record' },
  { route: 'calibration/plan', path: (i) => `/calibration/plan?assets=${i.asset}`, capability: 'calibration.record' },
  { route: 'calibration/trips', path: () => '/calibration/trips', capability: 'calibration.record' },
  { route: 'checks/new', path: (i) => `/checks/new?assetId=${i.asset}`, capability: 'checks.record' },
  { route: 'outbox', path: () => '/outbox', capability: 'checks.record' },
  { route: 'incidents/new', path: (i) => `/incidents/new?assetId=${i.asset}`, capability: 'incidents.report', heading: /Report damage/ },
  { route: 'board', path: () => '/board', capability: 'bookings.read' },
  { route: 'bookings/:id', path: (i) => `/bookings/${i.booking}`, capability: 'bookings.read' },
  { route: 'jobs', path: () => '/jobs', capability: 'bookings.read' },
  { route: 'bookings/new', path: () => '/bookings/new', capability: 'bookings.write' },
  { route: 'bookings/:id/checkout', path: (i) => `/bookings/${i.bookingReserved}/checkout`, capability: 'bookings.hand_over' },
  { route: 'bookings/:id/return', path: (i) => `/bookings/${i.bookingOut}/return`, capability: 'bookings.hand_over' },
  { route: 'fleet/new', path: () => '/fleet/new', capability: 'fleet.write' },
  { route: 'fleet/:id/edit', path: (i) => `/fleet/${i.asset}/edit`, capability: 'fleet.write' },
  { route: 'settings', path: () => '/settings', capability: 'settings.manage', heading: /Settings/ },
  { route: 'users', path: () => '/users', capability: 'users.manage', heading: /Users/ },
  { route: 'mailbox', path: () => '/mailbox', capability: 'mailbox.read', heading: /Mailbox/ },
  { route: 'admin/routines', path: () => '/admin/routines', capability: 'routines.run', heading: /Routines/ },
];

/** The router's patterns no signed-in walk opens, and why. */
export const notWalked: Record<string, string> = {
  '/sign-in': 'signed out (the session probe test opens it)',
  '/forgot-password': 'signed out',
  '/reset-password': 'opened from a mailed link (accounts tests)',
  '/join': 'opened from a mailed link (accounts tests)',
  '/renter/returned': "the renter's page, no role",
  '/renter/:token': "the renter's page, no role",
  'scan/:code': 'the same screen as scan, with a label read',
  'admin/jobs': 'a redirect to admin/routines',
  'account/password': 'a redirect to account',
  '*': 'page not found',
};

type ApiGet = (path: string) => Promise<{ status: number; body: unknown }>;

/** The first row of each list the detail pages open, read through the API as the owner sees it. */
export async function firstRows(get: ApiGet): Promise<WalkIds> {
  const first = async (path: string, pick: (body: never) => string | undefined = (b: { items: { id: string }[] }) => b.items[0]?.id) => {
    const reply = await get(path);
    const id = reply.status === 200 ? pick(reply.body as never) : undefined;
    if (!id) throw new Error(`The demo data has no row for ${path} (status ${reply.status}).`);
    return id;
  };
  const wide = 'from=2000-01-01&to=2199-12-31';
  return {
    asset: await first('/assets?limit=1'),
    kit: await first('/kits?limit=1'),
    booking: await first(`/bookings?${wide}&limit=1`),
    bookingOut: await first(`/bookings?${wide}&state=out&limit=1`),
    bookingReserved: await first(`/bookings?${wide}&state=reserved&limit=1`),
    rental: await first('/rentals?view=all&limit=1'),
    customer: await first('/customers?limit=1'),
    incident: await first('/incidents?limit=1'),
    check: await first('/checks?limit=1'),
    impactAsset: await first('/calibration/review', (b: { impactReviews: { assetId: string }[] }) => b.impactReviews[0]?.assetId),
  };
}

export const pagesOf = (role: Role, can: (role: Role, capability: Capability) => boolean) => walkPages.filter((p) => !p.capability || can(role, p.capability));

/** What one page showed. Empty lists mean the page holds. */
export type PageFindings = {
  consoleErrors: string[];
  failedRequests: string[];
  axe: { id: string; impact: string; targets: string[] }[];
  overflow: string[];
  dateStyles: string[];
};

/** Collects the console errors and failed requests of a page from now on; `take()` hands over what came and starts again. */
export function listen(page: Page, expected: (url: string, status: number) => boolean = () => false) {
  let consoleErrors: string[] = [];
  let failedRequests: string[] = [];
  page.on('console', (msg) => {
    if (msg.type() === 'error') consoleErrors.push(`${msg.text()}${msg.location().url ? ` (${msg.location().url})` : ''}`);
  });
  page.on('pageerror', (err) => consoleErrors.push(`uncaught: ${err.message}`));
  page.on('response', (res: Response) => {
    if (res.status() >= 400 && !expected(res.url(), res.status()))
      failedRequests.push(`${res.request().method()} ${new URL(res.url()).pathname} ${res.status()}`);
  });
  page.on('requestfailed', (req: Request) => {
    // A query abandoned because its page went away is not a failure.
    if (req.failure()?.errorText !== 'net::ERR_ABORTED') failedRequests.push(`${req.method()} ${new URL(req.url()).pathname} ${req.failure()?.errorText}`);
  });
  return {
    take() {
      const taken = { consoleErrors, failedRequests };
      consoleErrors = [];
      failedRequests = [];
      return taken;
    },
  };
}

const axeSource = fs.readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

/** Tracks requests in flight, so a page counts as drawn only once its data has come. */
export function inFlight(page: Page) {
  const open = new Set<Request>();
  page.on('request', (r) => {
    if (['fetch', 'xhr', 'script', 'document'].includes(r.resourceType())) open.add(r);
  });
  const done = (r: Request) => open.delete(r);
  page.on('requestfinished', done);
  page.on('requestfailed', done);
  return () => open.size;
}

/**
 * Opens `path` and waits, with `waitMs` of patience, for a level-1 heading (`heading` when given), no request in flight and
 * no loading panel, seen twice in a row (a screen's second query starts when its first has answered).
 */
export async function openAndSettle(page: Page, url: string, pending: () => number, waitMs: number, heading?: RegExp) {
  await page.goto(url);
  await page.getByRole('heading', { level: 1, name: heading }).first().waitFor({ timeout: waitMs });
  const quiet = async () =>
    pending() === 0 &&
    (await page.evaluate(
      () =>
        !document.querySelector('[role=status] svg.animate-spin, .ag-overlay-loading-center, .ag-loading') &&
        ![...document.querySelectorAll('[role=status]')].some((s) => /Loading|Opening/.test(s.textContent ?? '')),
    ));
  const deadline = Date.now() + waitMs;
  let calmLooks = 0;
  while (calmLooks < 2) {
    if (Date.now() > deadline) throw new Error(`${url} kept loading for ${waitMs / 1000} s`);
    calmLooks = (await quiet()) ? calmLooks + 1 : 0;
    // One animation frame between looks, not a fixed sleep: a look needs the page to have drawn again.
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => setTimeout(r, 50))));
  }
}

/** The date styles a reader must never meet: ISO dates, numeric slashed dates (mm/dd/yyyy or dd/mm/yyyy) and "Feb 28, 2025". */
export const foreignDateStyles = [
  /\b\d{4}-\d{2}-\d{2}\b/g,
  /\b\d{1,2}\/\d{1,2}\/\d{4}\b/g,
  /\b(?:Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)[a-z]* \d{1,2}, \d{4}\b/g,
];

/** The checks of one drawn page. `phone`: also nothing wider than the screen, nothing sticking out of it and no control on its edge. */
export async function inspectPage(page: Page, opts: { phone: boolean }) {
  // tsx and Vitest compile with esbuild's keepNames: a function sent into the page calls its `__name` helper.
  await page.evaluate(`${axeSource};globalThis.__name ??= (fn) => fn;`);
  const axe = await page.evaluate(async () => {
    const w = window as unknown as {
      axe: { run: (ctx: Document, o: object) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }> };
    };
    const result = await w.axe.run(document, { resultTypes: ['violations'] });
    return result.violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map((v) => ({ id: v.id, impact: v.impact, targets: v.nodes.slice(0, 5).map((n) => n.target.join(' ')) }));
  });
  const text = await page.evaluate(() => document.body.innerText);
  const dateStyles = [...new Set(foreignDateStyles.flatMap((re) => text.match(re) ?? []))];
  // The screen's width as set, not innerWidth: a mobile browser widens its layout viewport to the content it overflows with.
  const overflow = opts.phone ? await page.evaluate(phoneOverflow, page.viewportSize()?.width ?? 375) : [];
  return { axe, dateStyles, overflow };
}

/**
 * In the page: is the document wider than the screen, what part of an element shows beyond it, and which control sits on its
 * edge. What shows of an element is its box cut by every box that clips it: an ancestor with overflow that is (or holds) its
 * containing block. An absolutely placed element escapes a scroller that is not positioned, and widens the page.
 */
function phoneOverflow(width: number): string[] {
  const found: string[] = [];
  const doc = document.documentElement;
  if (doc.scrollWidth > width) found.push(`page is ${doc.scrollWidth - width} px wider than the ${width} px screen`);
  const describe = (el: Element) => {
    const label = (el.getAttribute('aria-label') ?? el.textContent ?? '').trim().replace(/\s+/g, ' ').slice(0, 40);
    const cls = typeof el.className === 'string' ? el.className.split(' ').slice(0, 3).join('.') : '';
    return `<${el.tagName.toLowerCase()}${cls ? ` .${cls}` : ''}> "${label}"`;
  };
  const shown = (el: Element) => {
    const r = el.getBoundingClientRect();
    let [left, right] = [r.left, r.right];
    let position = getComputedStyle(el).position;
    for (let p = el.parentElement; p && position !== 'fixed'; p = p.parentElement) {
      const s = getComputedStyle(p);
      const holdsIt = position !== 'absolute' || s.position !== 'static';
      if (holdsIt && s.overflowX !== 'visible') {
        const clip = p.getBoundingClientRect();
        [left, right] = [Math.max(left, clip.left), Math.min(right, clip.right)];
      }
      if (position === 'absolute' && s.position !== 'static') position = s.position;
    }
    return { left, right, empty: right - left < 1 || r.height === 0 };
  };
  const beyond = new Set<Element>();
  for (const el of document.body.querySelectorAll('*')) {
    const s = getComputedStyle(el);
    if (s.display === 'none' || s.visibility === 'hidden' || (el.closest('details:not([open])') && !el.closest('summary'))) continue;
    const v = shown(el);
    if (v.empty) continue;
    // A visually hidden one-pixel box (sr-only's -1 px margin) on the left widens nothing; on the right it widens the page.
    if (v.right > width + 0.5 || (v.left < -0.5 && v.right - v.left > 1)) beyond.add(el);
    // A control shown at one pixel is visually hidden (a skip link until it has the focus): it touches nothing.
    else if (el.matches('button, a[href], input, select, textarea') && v.right - v.left > 1 && (v.left < 1 || v.right > width - 1)) {
      found.push(`${describe(el)} touches the screen edge (${Math.round(v.left)}…${Math.round(v.right)} px shown)`);
    }
  }
  // Name where it starts: an element beyond the screen inside a parent that already is counts as the parent's.
  for (const el of beyond) {
    if (el.parentElement && beyond.has(el.parentElement)) continue;
    const r = el.getBoundingClientRect();
    found.push(`${describe(el)} reaches ${Math.round(r.left)}…${Math.round(r.right)} px`);
  }
  return found.slice(0, 8);
}

/** One line per page and problem, for a failure message a person reads. */
export function summarize(results: { role: string; viewport: string; path: string; findings: PageFindings }[]): string {
  const lines: string[] = [];
  for (const { role, viewport, path, findings: f } of results) {
    const parts = [
      ...f.consoleErrors.map((e) => `console: ${e}`),
      ...f.failedRequests.map((e) => `request: ${e}`),
      ...f.axe.map((v) => `axe ${v.impact} ${v.id}: ${v.targets.join(' | ')}`),
      ...f.overflow.map((o) => `overflow: ${o}`),
      ...(f.dateStyles.length ? [`date style: ${f.dateStyles.slice(0, 5).join(', ')}`] : []),
    ];
    if (parts.length) lines.push(`${role} ${viewport} ${path}`, ...parts.map((p) => `    ${p}`));
  }
  return lines.join('\n');
}
