import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

/** Four readings within a few micrometres of the reference, as copied from a spreadsheet. */
const pastedReadings = ['1000.004\t200.000\t50.000', '999.997\t200.002\t50.001', '1000.001\t199.996\t50.000', '1000.000\t200.001\t49.997'].join('\n');

describe('damage report, hold and release in a real browser', () => {
  it('a technician on a phone reports a dropped tip with a photo; the manager re-validates it and releases it', async () => {
    const [tip] = await rig.db.query(
      `SELECT id, asset_tag FROM assets WHERE type = 'tip' AND status = 'ready' AND kit_id IS NOT NULL ORDER BY asset_tag LIMIT 1`,
    );

    const tech = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
    await tech.page.getByRole('link', { name: 'Find an item by its label' }).click();
    await tech.page.getByLabel('Asset tag or RFID tag').fill(tip.asset_tag);
    await tech.page.getByRole('button', { name: 'Find' }).click();
    await tech.page.getByRole('heading', { level: 1, name: tip.asset_tag }).waitFor();
    await tech.page
      .getByRole('link', { name: 'Report damage' })
      .or(tech.page.getByRole('button', { name: 'Report damage' }))
      .first()
      .click();
    await tech.page.getByRole('heading', { level: 1, name: 'Report damage' }).waitFor();
    await tech.page.getByLabel('Dropped').check();
    await tech.page.getByLabel('What happened').fill('Slipped off the probe onto the floor plate during a tip change.');
    const photo = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#7a6a55' } })
      .jpeg()
      .toBuffer();
    await tech.page.getByLabel('Photos').setInputFiles({ name: 'floor.jpg', mimeType: 'image/jpeg', buffer: photo });
    await tech.page.getByRole('button', { name: 'Send report' }).click();
    await eventually(() => tech.page.locator('main').innerText()).toMatch(/on hold/i);
    expect(await tech.page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await tech.context.close();

    const [{ status }] = await rig.db.query(`SELECT status FROM assets WHERE id = $1`, [tip.id]);
    expect(status).toBe('held');
    const [photoRow] = await rig.db.query(
      `SELECT content_type, thumbnail IS NOT NULL AS thumb FROM incident_photos p JOIN incidents i ON i.id = p.incident_id WHERE i.asset_id = $1`,
      [tip.id],
    );
    expect(photoRow).toEqual({ content_type: 'image/jpeg', thumb: true });

    const manager = await signedIn(rig, 'manager@demo.test', 'Shop floor today');
    const page = manager.page;
    await page.goto(`${rig.baseUrl}/fleet/${tip.id}`);
    await page.getByRole('heading', { level: 1, name: tip.asset_tag }).waitFor();
    await page.getByRole('button', { name: 'Release' }).click();
    await eventually(() => page.locator('main').innerText()).toMatch(/no passing vertical tip validation since the hold began/i);

    for (const position of ['vertical', 'horizontal']) {
      await page.goto(`${rig.baseUrl}/fleet/${tip.id}`);
      await page
        .getByRole('link', { name: 'Record a check' })
        .or(page.getByRole('button', { name: 'Record a check' }))
        .first()
        .click();
      await page.getByRole('heading', { level: 1, name: 'Record a check' }).waitFor();
      await page.getByLabel('Position').selectOption(position);
      await page.getByLabel('Reference X (mm)').fill('1000');
      await page.getByLabel('Reference Y (mm)').fill('200');
      await page.getByLabel('Reference Z (mm)').fill('50');
      await page.getByLabel('Paste readings').fill(pastedReadings);
      await eventually(() => page.getByLabel('Reading 4 Z (mm)').inputValue()).toBe('49.997');
      await page.getByRole('button', { name: 'Save check' }).click();
      await eventually(() => page.locator('main').innerText()).toMatch(/Pass/);
    }
    await page.goto(`${rig.baseUrl}/fleet/${tip.id}`);
    await page.getByRole('button', { name: 'Release' }).click();
    await eventually(async () => (await rig.db.query(`SELECT status FROM assets WHERE id = $1`, [tip.id]))[0].status).toBe('ready');
    await manager.context.close();
  }, 120_000);
});
