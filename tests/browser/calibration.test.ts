import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { renderPdf } from '../../server/documents/pdf';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';
import { activeChanges, certificateWith } from '../support/pdf-fixtures';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe("the owner's calibration review in a real browser", () => {
  it('plans a lab trip in a free window, takes the item back with an out-of-tolerance certificate, and works through the impact review', async () => {
    const today = todayIn('Europe/Berlin');
    // Arrange: an SMR of Kit Alder (out on job J-2611 since its last good calibration) is overdue.
    await rig.db.query(`UPDATE assets SET due_on = $1 WHERE asset_tag = 'SMR-001'`, [addDays(today, -1)]);
    const [smr] = await rig.db.query(`SELECT id FROM assets WHERE asset_tag = 'SMR-001'`);
    const certificate = await renderPdf({ size: 'A4' }, (doc) => doc.text('Certificate FCL-TEST-1 (test document)'));

    const { context, page, nav } = await signedIn(rig, 'owner@demo.test', "Owner's overview");
    await nav.getByRole('link', { name: 'Calibration' }).click();
    await page.getByRole('heading', { level: 1, name: 'Calibration review' }).waitFor();
    await page.getByRole('row').filter({ hasText: 'SMR-001' }).getByRole('link', { name: 'Plan lab trip' }).first().click();
    await page.getByRole('button', { name: 'Plan this trip' }).first().click();
    await page.getByRole('button', { name: 'Send to the lab' }).click();
    await eventually(async () => (await rig.db.query(`SELECT status FROM assets WHERE id = $1`, [smr.id]))[0].status).toBe('at_lab');

    await page.goto(`${rig.baseUrl}/fleet/${smr.id}/calibrate`);
    await page.getByRole('heading', { level: 1, name: 'Record a calibration' }).waitFor();
    await page.getByLabel('Performed on').fill(today);
    await page.getByLabel('Certificate number').fill('FCL-TEST-1');
    await page.getByLabel('As found').selectOption('out_of_tolerance');
    await page.getByLabel('As left').selectOption('in_tolerance');
    // A certificate with a script that runs on opening is refused, and the form says why beside the file.
    const scripted = await certificateWith(activeChanges.openActionJavaScript);
    await page.getByLabel('Certificate (PDF)').setInputFiles({ name: 'FCL-TEST-1-scripted.pdf', mimeType: 'application/pdf', buffer: scripted });
    await page.getByRole('button', { name: 'Save calibration' }).click();
    await page.getByText('"FCL-TEST-1-scripted.pdf" contains JavaScript and an action run when the document opens.', { exact: false }).waitFor();
    expect(await page.getByLabel('Certificate (PDF)').getAttribute('aria-invalid')).toBe('true');
    await page.getByLabel('Certificate (PDF)').setInputFiles({ name: 'FCL-TEST-1.pdf', mimeType: 'application/pdf', buffer: certificate });
    await page.getByRole('button', { name: 'Save calibration' }).click();
    await page.getByRole('link', { name: 'Open the impact review' }).click();
    await page.getByRole('heading', { level: 1, name: /^Impact review/ }).waitFor();
    expect((await rig.db.query(`SELECT status FROM assets WHERE id = $1`, [smr.id]))[0].status).toBe('ready');

    await page.getByLabel('Assessment: J-2611').selectOption('customer_notified');
    await page.getByRole('button', { name: 'Draft notices' }).click();
    await eventually(() => page.locator('main').innerText()).toMatch(/quality@larkspur-aero\.test/);
    await page.getByRole('button', { name: 'Close review' }).click();
    await eventually(
      async () => (await rig.db.query(`SELECT state FROM impact_reviews WHERE asset_id = $1 ORDER BY created_at DESC LIMIT 1`, [smr.id]))[0].state,
    ).toBe('closed');
    await context.close();
  }, 120_000);
});
