import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe('fleet register in a real browser', () => {
  it('a manager registers a tip, finds it in the fleet grid, and opens its label', async () => {
    const { context, page, nav } = await signedIn(rig, 'manager@demo.test', 'Shop floor today');
    await nav.getByRole('link', { name: 'Fleet' }).click();
    await page.getByRole('heading', { level: 1, name: 'Fleet' }).waitFor();
    await page
      .getByRole('link', { name: 'Add asset' })
      .or(page.getByRole('button', { name: 'Add asset' }))
      .first()
      .click();
    await page.getByRole('heading', { level: 1, name: 'Register an asset' }).waitFor();
    await page.getByLabel('Type').selectOption('tip');
    await page.getByLabel('Asset tag').fill('TIP-777');
    await page.getByLabel('Serial number').fill('PT-77701');
    await page.getByLabel('RFID tag').fill('E2:80:77:01');
    await page.getByLabel('Tip length (mm)').fill('120');
    await page.getByLabel('Vertical').check();
    await page.getByRole('button', { name: 'Save asset' }).click();
    await page.getByRole('heading', { level: 1, name: 'TIP-777' }).waitFor();

    await nav.getByRole('link', { name: 'Fleet' }).click();
    await page.getByLabel('Search the fleet').fill('TIP-777');
    await eventually(() => page.locator('.ag-row').allInnerTexts()).toEqual([expect.stringContaining('TIP-777')]);
    await page.locator('.ag-row').first().click();
    await page.getByRole('heading', { level: 1, name: 'TIP-777' }).waitFor();

    const label = await page.getByRole('link', { name: 'Print label' }).getAttribute('href');
    const pdf = await page.request.get(new URL(label!, rig.baseUrl).toString());
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await context.close();
  });

  it('a technician on a phone finds an asset by typing its RFID tag', async () => {
    const [tip] = await rig.db.query(`SELECT asset_tag, rfid_tag FROM assets WHERE type = 'tip' AND rfid_tag IS NOT NULL ORDER BY asset_tag LIMIT 1`);
    const { context, page, nav } = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
    await page.getByRole('link', { name: 'Find an item by its label' }).click();
    await page.getByRole('heading', { level: 1, name: 'Find by label' }).waitFor();
    await page.getByLabel('Asset tag or RFID tag').fill(tip.rfid_tag.toLowerCase());
    await page.getByRole('button', { name: 'Find' }).click();
    await page.getByRole('heading', { level: 1, name: tip.asset_tag }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    // A technician reads the register but does not change it.
    expect(await page.getByRole('button', { name: 'Retire' }).count()).toBe(0);
    expect(nav).toBeTruthy();
    await context.close();
  });
});
