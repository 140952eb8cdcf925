import { afterAll, beforeAll, describe, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe('routines in a real browser', () => {
  it('the owner runs the late-returns routine for the firm and reads what it did', async () => {
    const { context, page, nav } = await signedIn(rig, 'owner@demo.test', "Owner's overview");
    await nav.getByRole('link', { name: 'Routines' }).click();
    await page.getByRole('heading', { level: 1, name: 'Routines' }).waitFor();
    const row = page.getByRole('row').filter({ hasText: 'late-returns' });
    await row.getByRole('button', { name: 'Run now' }).click();
    // The demo firm has one kit back late: one firm, at least one late booking, e-mailed.
    await eventually(() => row.innerText()).toMatch(/firms 1, late bookings [1-9]/);
    await eventually(() => row.innerText()).toMatch(/Run now for your firm/);
    await context.close();
  }, 60_000);
});
