import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

const zipEntryNames = (path: string) =>
  new Promise<string[]>((resolve, reject) =>
    yauzl.open(path, { lazyEntries: false }, (err, zip) => {
      if (err || !zip) return reject(err);
      const names: string[] = [];
      zip.on('entry', (e: yauzl.Entry) => names.push(e.fileName));
      zip.on('end', () => resolve(names));
      zip.on('error', reject);
    }),
  );

describe('the record an auditor reads, in a real browser', () => {
  it('the owner reads the out-of-tolerance tracker’s record on a phone, then downloads a kit’s audit pack', async () => {
    const [trk] = await rig.db.query(`SELECT id FROM assets WHERE asset_tag = 'TRK-001'`);
    const { context, page, nav } = await signedIn(rig, 'owner@demo.test', "Owner's overview", phone);
    await page.goto(`${rig.baseUrl}/fleet/${trk.id}/record`);
    await page.getByRole('heading', { name: 'Calibrations and certificates (2)' }).waitFor();
    const main = page.locator('main');
    expect(await main.innerText()).toMatch(/As found out of tolerance · as left in tolerance/);
    expect(await main.innerText()).toContain('Length check');
    expect(await main.innerText()).toMatch(/Found out of tolerance as found on .* review open/);
    expect(await main.innerText()).toContain('The item was not on hold in the period.');
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);

    // A period from today on keeps only the certificate that covers today; the PDF link asks for the same period.
    const today = new Date().toISOString().slice(0, 10);
    await page.getByLabel('First day').fill(today);
    await page.getByRole('heading', { name: /^Calibrations and certificates \([01]\)$/ }).waitFor();
    expect(await page.getByRole('link', { name: 'Download PDF' }).getAttribute('href')).toContain(`from=${today}`);
    await page.getByRole('button', { name: 'All time' }).click();
    await page.getByRole('heading', { name: 'Calibrations and certificates (2)' }).waitFor();
    expect(await page.getByRole('link', { name: 'Download PDF' }).getAttribute('href')).not.toContain('from=');
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);

    await page.getByRole('button', { name: 'Menu' }).click();
    await nav.getByRole('link', { name: 'Audit pack' }).click();
    await page.getByRole('heading', { level: 1, name: 'Audit pack' }).waitFor();
    await page.getByLabel('Items').selectOption('kit');
    await page.getByLabel('Kit', { exact: true }).selectOption({ label: 'Kit Alder' });
    const [{ n }] = await rig.db.query(`SELECT count(*)::int AS n FROM assets a JOIN kits k ON k.id = a.kit_id WHERE k.name = 'Kit Alder'`);
    await page.getByText(new RegExp(`^${n} item\\(s\\),`)).waitFor();
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Build and download the pack' }).click();
    const file = await (await download).path();
    await page.getByText('Pack saved').waitFor();
    const names = await zipEntryNames(file);
    expect(names.filter((f) => f.startsWith('records/'))).toHaveLength(n);
    expect(names).toEqual(expect.arrayContaining(['summary.pdf', 'index.csv']));
    await context.close();
  });
});
