import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig } from '../support/browser';
import { signedIn } from '../support/browser-session';

let rig: Awaited<ReturnType<typeof startBrowserRig>>;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe('scheduled jobs in a real browser', () => {
  it('the owner runs the late-returns job for the firm and reads what it did', async () => {
    const { context, page, nav } = await signedIn(rig.browser, rig.baseUrl, 'owner@demo.test', "Owner's overview");
    await nav.getByRole('link', { name: 'Scheduled jobs' }).click();
    await page.getByRole('heading', { level: 1, name: 'Scheduled jobs' }).waitFor();
    const row = page.getByRole('row').filter({ hasText: 'late-returns' });
    await row.getByRole('button', { name: 'Run now' }).click();
    // The demo firm has one kit back late: one firm, at least one late booking, e-mailed.
    await expect.poll(() => row.innerText(), { timeout: 10_000 }).toMatch(/firms 1, late bookings [1-9]/);
    await expect.poll(() => row.innerText()).toMatch(/Run now for your firm/);
    await context.close();
  }, 60_000);
});
