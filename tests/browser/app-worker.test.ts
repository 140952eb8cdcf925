import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';
import { eventually, waitUntil } from '../support/eventually';

// The client is served from a copy, so a test can publish a new version of the service worker as a release would.
let clientCopy: string;
let builtWorker: string;
let rig: BrowserRig;
beforeAll(async () => {
  clientCopy = fs.mkdtempSync(path.join(os.tmpdir(), 'nk-client-'));
  fs.cpSync('dist/client', clientCopy, { recursive: true });
  builtWorker = fs.readFileSync(path.join(clientCopy, 'sw.js'), 'utf8');
  rig = await startBrowserRig({ clientDir: clientCopy });
});
afterAll(async () => {
  await rig?.close();
  fs.rmSync(clientCopy, { recursive: true, force: true });
});

type Row = { id: string; asset_tag: string };

/** A tip in the kit the technician has out, measurable in the vertical position. */
async function tipCarried(): Promise<Row> {
  const [tip]: Row[] = await rig.db.query(
    `SELECT a.id, a.asset_tag FROM booking_items bi JOIN bookings b ON b.id = bi.booking_id JOIN assets a ON a.id = bi.asset_id JOIN users u ON u.id = b.taken_by_user_id
      WHERE u.email = 'tech@demo.test' AND b.state = 'out' AND a.type = 'tip' AND a.status = 'out' AND a.specs->'positions' ? 'vertical' ORDER BY a.asset_tag LIMIT 1`,
  );
  return tip;
}

/** Signed in on a phone, the service worker active and the field copy kept: the state after one visit with signal. */
async function technicianOnPhone() {
  const session = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
  await session.page.evaluate(async () => Boolean((await navigator.serviceWorker.ready).active));
  await session.page.getByText(/Kit on this phone as of/).waitFor();
  return session;
}

const WHICH_VERSION = 'nestkeeper-test:which-version';

/** A release: the built worker with one listener more, which says it is the version `name`. */
const publishWorker = (name: string) =>
  fs.writeFileSync(
    path.join(clientCopy, 'sw.js'),
    `${builtWorker}\nself.addEventListener('message', (e) => { if (e.data === ${JSON.stringify(WHICH_VERSION)}) e.source.postMessage(${JSON.stringify(name)}); });\n`,
  );

/** What the worker controlling the page answers to WHICH_VERSION: only the new version (below) answers at all. */
const controllerAnswer = (page: Page) =>
  page.evaluate(
    (question) =>
      new Promise<string>((resolve) => {
        navigator.serviceWorker.addEventListener('message', (e) => resolve(String(e.data)));
        navigator.serviceWorker.controller?.postMessage(question);
      }),
    WHICH_VERSION,
  );

describe('the service worker on the phone', () => {
  it('a new version is announced while a form is half written, keeps the typed value, and is loaded when the person asks', async () => {
    const tip = await tipCarried();
    const { context, page } = await technicianOnPhone();
    // The first visit installed the worker; from the next page load on it controls the page.
    await page.goto(`${rig.baseUrl}/`);
    await page.getByRole('heading', { level: 1, name: 'My kit' }).waitFor();
    expect(await page.evaluate(() => navigator.serviceWorker.controller?.state)).toBe('activated');

    publishWorker('next');

    // Opening the form is a page load: the browser looks for a new worker while the technician types.
    await page.goto(`${rig.baseUrl}/checks/new?assetId=${tip.id}`);
    await page.getByRole('heading', { level: 1, name: 'Record a check' }).waitFor();
    await page.evaluate(() => Object.assign(window, { halfWrittenForm: true }));
    await page.getByLabel('Reference X (mm)').fill('1000.125');
    await page.getByText('A new version of Nestkeeper is ready. Finish and save what you are writing first.').waitFor();
    const reload = page.getByRole('button', { name: 'Reload for the new version' });
    await reload.waitFor();

    // Announced, not swapped: the new worker waits, the page was not reloaded and the typed value is still there.
    expect(await page.evaluate(async () => Boolean((await navigator.serviceWorker.getRegistration())?.waiting))).toBe(true);
    expect(await page.evaluate(() => 'halfWrittenForm' in window)).toBe(true);
    expect(await page.getByLabel('Reference X (mm)').inputValue()).toBe('1000.125');

    await Promise.all([page.waitForEvent('load'), reload.click()]);
    await page.getByRole('heading', { level: 1, name: 'Record a check' }).waitFor();
    expect(await page.evaluate(() => 'halfWrittenForm' in window)).toBe(false);
    expect(await controllerAnswer(page)).toBe('next');
    expect(await page.evaluate(async () => Boolean((await navigator.serviceWorker.getRegistration())?.waiting))).toBe(false);
    expect(await reload.count()).toBe(0);
    await context.close();
  }, 120_000);

  it('a new version published while the app stays open is announced when the person comes back to it, without a page load', async () => {
    const { context, page } = await technicianOnPhone();
    await page.goto(`${rig.baseUrl}/`);
    await page.getByRole('heading', { level: 1, name: 'My kit' }).waitFor();
    await page.evaluate(() => Object.assign(window, { openAllDay: true }));
    // The look the page load started is over (update jobs of one registration queue), so only the one below can find the release.
    await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.update());
    publishWorker('later');

    // What the browser tells the page when the phone shows the app again.
    await page.evaluate(() => document.dispatchEvent(new Event('visibilitychange')));
    const reload = page.getByRole('button', { name: 'Reload for the new version' });
    await reload.waitFor();
    expect(await page.evaluate(() => 'openAllDay' in window)).toBe(true);
    await Promise.all([page.waitForEvent('load'), reload.click()]);
    await page.getByRole('heading', { level: 1, name: 'My kit' }).waitFor();
    expect(await controllerAnswer(page)).toBe('later');
    await context.close();
  }, 120_000);

  it("the worker's Background Sync sends a check recorded without signal, with the app closed, and the server holds it once", async () => {
    const tip = await tipCarried();
    const startedAt = new Date();
    const { context, page } = await technicianOnPhone();
    await context.setOffline(true);
    await page.goto(`${rig.baseUrl}/checks/new?assetId=${tip.id}`);
    await page.getByLabel('Position').selectOption('vertical');
    await page.getByLabel('Reference X (mm)').fill('1000');
    await page.getByLabel('Reference Y (mm)').fill('200');
    await page.getByLabel('Reference Z (mm)').fill('50');
    // Four readings 4 µm from the reference along different axes.
    await page.getByLabel('Paste readings').fill(['1000.004\t200\t50', '999.996\t200\t50', '1000\t200.004\t50', '1000\t200\t50.004'].join('\n'));
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.getByRole('heading', { name: 'Saved on this phone — waiting for signal' }).waitFor();
    // The outbox asked the browser for a sync, which the browser fires when signal returns, the app open or not.
    const tags = await page.evaluate(async () => {
      const registration = (await navigator.serviceWorker.ready) as ServiceWorkerRegistration & { sync: { getTags(): Promise<string[]> } };
      return registration.sync.getTags();
    });
    expect(tags).toEqual(['nestkeeper-outbox']);

    // The app is closed; a blank tab only carries the DevTools session that plays the browser's part.
    const blank = await context.newPage();
    await page.close();
    const cdp = await context.newCDPSession(blank);
    const registrations: { registrationId: string; scopeURL: string; isDeleted: boolean }[] = [];
    cdp.on('ServiceWorker.workerRegistrationUpdated', (e) => registrations.push(...e.registrations));
    await cdp.send('ServiceWorker.enable');
    const registration = await waitUntil("the app's service worker registration", () =>
      registrations.find((r) => r.scopeURL === `${rig.baseUrl}/` && !r.isDeleted),
    );

    const stored = async () =>
      (await rig.db.query(`SELECT count(*)::int AS n FROM field_checks WHERE asset_id = $1 AND created_at >= $2`, [tip.id, startedAt]))[0].n;
    expect(await stored()).toBe(0);
    await context.setOffline(false);
    // What the browser does when signal returns: it fires the sync the outbox asked for.
    await cdp.send('ServiceWorker.dispatchSyncEvent', {
      origin: rig.baseUrl,
      registrationId: registration.registrationId,
      tag: 'nestkeeper-outbox',
      lastChance: false,
    });
    await eventually(stored).toBe(1);

    // Opened again, the app shows it sent, and sending on start adds nothing.
    const again = await context.newPage();
    await again.goto(`${rig.baseUrl}/outbox`);
    await again.getByRole('heading', { level: 1, name: 'Records on this phone' }).waitFor();
    await again.getByText('Sent', { exact: true }).waitFor();
    expect(await again.getByText('Waiting', { exact: true }).count()).toBe(0);
    expect(await stored()).toBe(1);
    await context.close();
  }, 120_000);
});
