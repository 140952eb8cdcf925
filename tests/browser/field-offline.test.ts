import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

/** Four readings `offsetUm` from R = (1000, 200, 50) along different axes, as rows pasted from a spreadsheet. */
const pasted = (offsetUm: number) => {
  const d = offsetUm / 1000;
  return [
    [1000 + d, 200, 50],
    [1000 - d, 200, 50],
    [1000, 200 + d, 50],
    [1000, 200, 50 + d],
  ]
    .map((p) => p.map((v) => v.toFixed(4)).join('\t'))
    .join('\n');
};

type Row = { id: string; asset_tag: string };

describe('field work without signal', () => {
  it('a technician opens home and the kit offline, records a passing and a failing validation and a damage report with a photo, closes the page; back online each reaches the server exactly once', async () => {
    const [booking] = await rig.db.query(
      `SELECT b.id, b.kit_id, k.name FROM bookings b JOIN kits k ON k.id = b.kit_id JOIN users u ON u.id = b.taken_by_user_id
        WHERE u.email = 'tech@demo.test' AND b.state = 'out' ORDER BY b.starts_on DESC LIMIT 1`,
    );
    const tips: Row[] = await rig.db.query(
      `SELECT a.id, a.asset_tag FROM booking_items bi JOIN assets a ON a.id = bi.asset_id
        WHERE bi.booking_id = $1 AND a.type = 'tip' AND a.status = 'out' AND a.specs->'positions' ? 'vertical' ORDER BY a.asset_tag LIMIT 2`,
      [booking.id],
    );
    const [smr]: Row[] = await rig.db.query(
      `SELECT a.id, a.asset_tag FROM booking_items bi JOIN assets a ON a.id = bi.asset_id WHERE bi.booking_id = $1 AND a.type = 'smr' AND a.status = 'out' LIMIT 1`,
      [booking.id],
    );
    expect(tips).toHaveLength(2);
    const [passing, failing] = tips;
    const startedAt = new Date();

    // One visit with signal: the service worker installs and the phone copies the kit.
    const { context, page } = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
    expect(await page.evaluate(async () => Boolean((await navigator.serviceWorker.ready).active))).toBe(true);
    await page.getByText(/Kit on this phone as of/).waitFor();

    await context.setOffline(true);
    await page.goto(`${rig.baseUrl}/`);
    await page.getByRole('heading', { level: 1, name: 'My kit' }).waitFor();
    await page.getByText('No signal', { exact: true }).first().waitFor();
    await page.getByRole('link', { name: booking.name }).first().click();
    await page.getByRole('heading', { level: 1, name: booking.name }).waitFor();
    await page.getByRole('link', { name: new RegExp(passing.asset_tag) }).click();
    await page.getByRole('heading', { level: 1, name: passing.asset_tag }).waitFor();
    await page.getByRole('link', { name: 'Record a check' }).click();

    const validate = async (tip: Row, offsetUm: number) => {
      await page.getByRole('heading', { level: 1, name: 'Record a check' }).waitFor();
      await page.getByLabel('Position').selectOption('vertical');
      await page.getByLabel('Reference X (mm)').fill('1000');
      await page.getByLabel('Reference Y (mm)').fill('200');
      await page.getByLabel('Reference Z (mm)').fill('50');
      await page.getByLabel('Paste readings').fill(pasted(offsetUm));
      await page.getByRole('button', { name: 'Save check' }).click();
      await page.getByRole('heading', { name: 'Saved on this phone — waiting for signal' }).waitFor();
      await eventually(() => page.locator('main').innerText()).toContain(tip.asset_tag);
    };
    await validate(passing, 5);
    // The offline preview is the shared computation: 500 µm fails any tip tolerance of the demo firm.
    await page.goto(`${rig.baseUrl}/checks/new?assetId=${failing.id}`);
    await validate(failing, 500);
    await page.getByText(`Do not use ${failing.asset_tag}`).waitFor();

    await page.goto(`${rig.baseUrl}/incidents/new?assetId=${smr.id}`);
    await page.getByRole('heading', { level: 1, name: 'Report damage' }).waitFor();
    await page.getByLabel('Dropped').check();
    await page.getByLabel('What happened').fill('Rolled off the nest onto the hull plate; the glass looks chipped.');
    const photo = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#5e6b78' } })
      .jpeg()
      .toBuffer();
    await page.getByLabel('Photos').setInputFiles({ name: 'hull.jpg', mimeType: 'image/jpeg', buffer: photo });
    await page.getByRole('button', { name: 'Send report' }).click();
    await page.getByRole('heading', { name: 'Saved on this phone — waiting for signal' }).waitFor();
    await page.getByRole('link', { name: /Records on this phone: 3 to send/ }).waitFor();

    // Closing the browser's page keeps the records on the phone.
    await page.close();
    const again = await context.newPage();
    await again.goto(`${rig.baseUrl}/outbox`);
    await again.getByRole('heading', { level: 1, name: 'Records on this phone' }).waitFor();
    await eventually(() => again.getByText('Waiting', { exact: true }).count()).toBe(3);
    const newRecords = async () => {
      const [checks] = await rig.db.query(`SELECT count(*)::int AS n FROM field_checks WHERE asset_id = ANY($1) AND created_at >= $2`, [
        [passing.id, failing.id],
        startedAt,
      ]);
      const [incidents] = await rig.db.query(`SELECT count(*)::int AS n FROM incidents WHERE asset_id = $1 AND created_at >= $2`, [smr.id, startedAt]);
      return checks.n + incidents.n;
    };
    expect(await newRecords()).toBe(0);

    await context.setOffline(false);
    await eventually(() => again.getByText('Sent', { exact: true }).count()).toBe(3);
    expect(await newRecords()).toBe(3);
    const status = async (id: string) => (await rig.db.query(`SELECT status FROM assets WHERE id = $1`, [id]))[0].status;
    expect(await status(failing.id)).toBe('held');
    expect(await status(passing.id)).toBe('out');
    const [hold] = await rig.db.query(`SELECT reason FROM holds WHERE asset_id = $1 AND released_at IS NULL`, [failing.id]);
    expect(hold.reason).toBe('failed_check');
    const [mail] = await rig.db.query(`SELECT count(*)::int AS n FROM outbox_messages WHERE subject = $1`, [
      `${failing.asset_tag} is on hold: tip validation failed`,
    ]);
    expect(mail.n).toBe(1);
    const [photoRow] = await rig.db.query(`SELECT count(*)::int AS n FROM incident_photos p JOIN incidents i ON i.id = p.incident_id WHERE i.asset_id = $1`, [
      smr.id,
    ]);
    expect(photoRow.n).toBe(1);
    await again.getByText('The server decided: failed — the item is on hold').waitFor();

    // A retry of the same records (as a phone whose reply was lost would send them) creates nothing new.
    const records = await again.evaluate(
      () =>
        new Promise<{ request: { kind: string; payload?: unknown; fields?: Record<string, string> } }[]>((resolve, reject) => {
          const open = indexedDB.open('nestkeeper-field');
          open.onerror = () => reject(open.error);
          open.onsuccess = () => {
            const all = open.result.transaction('outbox').objectStore('outbox').getAll();
            all.onsuccess = () => resolve(all.result);
          };
        }),
    );
    expect(records).toHaveLength(3);
    const csrf = (await context.cookies()).find((c) => c.name === 'nk_csrf')!.value;
    for (const r of records) {
      const reply =
        r.request.kind === 'check'
          ? await again.request.post(`${rig.baseUrl}/api/checks`, { data: r.request.payload, headers: { 'X-CSRF-Token': csrf } })
          : await again.request.post(`${rig.baseUrl}/api/incidents`, { multipart: r.request.fields!, headers: { 'X-CSRF-Token': csrf } });
      expect(reply.status()).toBe(200);
    }
    expect(await newRecords()).toBe(3);
    const [holds] = await rig.db.query(`SELECT count(*)::int AS n FROM holds WHERE asset_id = $1 AND started_at >= $2`, [failing.id, startedAt]);
    expect(holds.n).toBe(1);
    await context.close();
  }, 150_000);

  it('a record the server refuses (the item was retired meanwhile) shows the reason and waits to be discarded; signing out with records waiting asks first', async () => {
    const [battery]: Row[] = await rig.db.query(
      `SELECT a.id, a.asset_tag FROM booking_items bi JOIN bookings b ON b.id = bi.booking_id JOIN assets a ON a.id = bi.asset_id, users u
        WHERE u.email = 'tech@demo.test' AND b.state = 'reserved' AND b.job_id IN (SELECT id FROM jobs WHERE lead_technician_id = u.id) AND a.type = 'battery' AND a.status = 'ready'
        ORDER BY a.asset_tag LIMIT 1`,
    );
    const { context, page } = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
    await page.evaluate(async () => Boolean((await navigator.serviceWorker.ready).active));
    await page.getByText(/Kit on this phone as of/).waitFor();
    await context.setOffline(true);
    await page.goto(`${rig.baseUrl}/scan`);
    await page.getByLabel('Asset tag or RFID tag').fill(battery.asset_tag.toLowerCase());
    await page.getByRole('button', { name: 'Find' }).click();
    await page.getByRole('heading', { level: 1, name: battery.asset_tag }).waitFor();
    await page.getByRole('link', { name: 'Report damage' }).click();
    await page.getByLabel('Not working right').check();
    await page.getByLabel('What happened').fill('Stops charging at half; the case is warm.');
    await page.getByRole('button', { name: 'Send report' }).click();
    await page.getByRole('heading', { name: 'Saved on this phone — waiting for signal' }).waitFor();

    // Meanwhile the shop retires the battery.
    const manager = await signedIn(rig, 'manager@demo.test', 'Shop floor today');
    const csrf = (await manager.context.cookies()).find((c) => c.name === 'nk_csrf')!.value;
    const retired = await manager.page.request.post(`${rig.baseUrl}/api/assets/${battery.id}/retire`, {
      data: { reason: 'End of life: capacity below 70 %' },
      headers: { 'X-CSRF-Token': csrf },
    });
    expect(retired.status()).toBe(200);
    await manager.context.close();

    await page.getByRole('button', { name: 'Sign out' }).click();
    const ask = page.getByRole('dialog', { name: 'Sign out with records not sent?' });
    await ask.waitFor();
    await ask.getByRole('button', { name: 'Stay signed in' }).click();

    await context.setOffline(false);
    await page.goto(`${rig.baseUrl}/outbox`);
    await page.getByText('Refused', { exact: true }).waitFor();
    await page.getByText(`${battery.asset_tag} is retired.`, { exact: false }).waitFor();
    await page.getByRole('link', { name: 'Records on this phone: 1 refused' }).waitFor();
    expect((await rig.db.query(`SELECT count(*)::int AS n FROM incidents WHERE asset_id = $1 AND description LIKE 'Stops charging%'`, [battery.id]))[0].n).toBe(
      0,
    );
    await page.getByRole('button', { name: 'Discard' }).click();
    await page.getByRole('button', { name: 'Discard for good' }).click();
    await page.getByRole('heading', { name: 'Nothing on this phone' }).waitFor();
    await context.close();
  }, 120_000);

  it('a check refused because the firm changed its tolerance meanwhile opens again as written, is corrected and arrives once', async () => {
    const [tip]: Row[] = await rig.db.query(
      `SELECT a.id, a.asset_tag FROM booking_items bi JOIN bookings b ON b.id = bi.booking_id JOIN assets a ON a.id = bi.asset_id JOIN users u ON u.id = b.taken_by_user_id
        WHERE u.email = 'tech@demo.test' AND b.state = 'out' AND a.type = 'tip' AND a.status = 'out' AND a.specs->'positions' ? 'vertical' ORDER BY a.asset_tag DESC LIMIT 1`,
    );
    const { context, page } = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
    await page.evaluate(async () => Boolean((await navigator.serviceWorker.ready).active));
    await page.getByText(/Kit on this phone as of/).waitFor();
    await context.setOffline(true);
    await page.goto(`${rig.baseUrl}/checks/new?assetId=${tip.id}`);
    await page.getByLabel('Position').selectOption('vertical');
    await page.getByLabel('Reference X (mm)').fill('1000');
    await page.getByLabel('Reference Y (mm)').fill('200');
    await page.getByLabel('Reference Z (mm)').fill('50');
    await page.getByLabel('Paste readings').fill(pasted(8));
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.getByRole('heading', { name: 'Saved on this phone — waiting for signal' }).waitFor();

    // Meanwhile the owner makes the tip tolerance depend on the distance from the tracker.
    const owner = await signedIn(rig, 'owner@demo.test', "Owner's overview");
    const csrf = (await owner.context.cookies()).find((c) => c.name === 'nk_csrf')!.value;
    const changed = await owner.page.request.patch(`${rig.baseUrl}/api/settings`, {
      data: { tolerances: { tip_validation: { kind: 'range', aUm: 30, bUmPerM: 10 } } },
      headers: { 'X-CSRF-Token': csrf },
    });
    expect(changed.status()).toBe(200);
    await owner.context.close();

    await context.setOffline(false);
    await page.goto(`${rig.baseUrl}/outbox`);
    await page.getByText('Refused', { exact: true }).waitFor();
    await page.getByText(/the tolerance for this check depends on the distance from the tracker/).waitFor();
    await page.getByRole('link', { name: 'Correct it' }).click();
    await page.getByText('Correcting a refused check').waitFor();
    expect(await page.getByLabel('Reading 4 Z (mm)').inputValue()).toBe('50.008');
    await page.getByLabel('Distance from tracker (m)').fill('4');
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.getByRole('heading', { name: 'Check saved' }).waitFor();
    const [stored] = await rig.db.query(
      `SELECT count(*)::int AS n, max(tolerance_um) AS tolerance FROM field_checks WHERE asset_id = $1 AND inputs->>'distanceM' = '4'`,
      [tip.id],
    );
    // A + B·L = 30 µm + 10 µm/m × 4 m = 70 µm.
    expect(stored).toEqual({ n: 1, tolerance: 70 });
    await page.goto(`${rig.baseUrl}/outbox`);
    await eventually(() => page.getByText('Refused', { exact: true }).count()).toBe(0);
    await context.close();
  }, 120_000);

  describe('the photos a phone keeps waiting (at most 30, or 150 MB)', () => {
    /** An item of the kit the technician has out that is neither a tip nor an SMR (the tests above use those). */
    async function itemCarried(): Promise<Row> {
      const [item]: Row[] = await rig.db.query(
        `SELECT a.id, a.asset_tag FROM booking_items bi JOIN bookings b ON b.id = bi.booking_id JOIN assets a ON a.id = bi.asset_id JOIN users u ON u.id = b.taken_by_user_id
          WHERE u.email = 'tech@demo.test' AND b.state = 'out' AND a.type NOT IN ('tip', 'smr') AND a.status = 'out' ORDER BY a.asset_tag DESC LIMIT 1`,
      );
      return item;
    }

    /** Fills a damage report for the item without signal and sends it; the photos are files on disk or small buffers. */
    async function reportDamage(page: Page, item: Row, photos: string[] | { name: string; mimeType: string; buffer: Buffer }[]) {
      await page.goto(`${rig.baseUrl}/incidents/new?assetId=${item.id}`);
      await page.getByRole('heading', { level: 1, name: 'Report damage' }).waitFor();
      await page.getByLabel('Dropped').check();
      await page.getByLabel('What happened').fill('Knocked off the stand by a forklift; the housing is cracked.');
      await page.getByLabel('Photos').setInputFiles(photos);
      await page.getByRole('button', { name: 'Send report' }).click();
    }

    const saved = (page: Page) => page.getByRole('heading', { name: 'Saved on this phone — waiting for signal' }).waitFor();

    /** The refused report keeps what was written; leaving its photos out, it is saved. */
    async function leavePhotosOut(page: Page, count: number) {
      expect(await page.getByLabel('What happened').inputValue()).toBe('Knocked off the stand by a forklift; the housing is cracked.');
      for (let i = count; i >= 1; i--) await page.getByRole('button', { name: new RegExp(`^Remove photo ${i} `) }).click();
      await page.getByRole('button', { name: 'Send report' }).click();
      await saved(page);
    }

    it('the 31st photo is refused with what to do, the report keeps its words, and without photos it is saved', async () => {
      const item = await itemCarried();
      const { context, page } = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
      await page.evaluate(async () => Boolean((await navigator.serviceWorker.ready).active));
      await page.getByText(/Kit on this phone as of/).waitFor();
      await context.setOffline(true);
      const jpeg = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#8a6d3b' } })
        .jpeg()
        .toBuffer();
      // Six photos is the most one report takes: five reports fill the phone's 30.
      const six = Array.from({ length: 6 }, (_, i) => ({ name: `crack-${i + 1}.jpg`, mimeType: 'image/jpeg', buffer: jpeg }));
      for (let report = 1; report <= 5; report++) {
        await reportDamage(page, item, six);
        await saved(page);
      }
      await page.getByRole('link', { name: /Records on this phone: 5 to send/ }).waitFor();

      await reportDamage(page, item, six.slice(0, 1));
      await page
        .getByText(
          'This phone already keeps 30 photos (under 1 MB) waiting to be sent, and holds at most 30 photos or 150 MB. Send what waits first (find signal), or leave some photos out.',
        )
        .waitFor();
      await page.getByRole('link', { name: /Records on this phone: 5 to send/ }).waitFor();
      await leavePhotosOut(page, 1);
      await page.getByRole('link', { name: /Records on this phone: 6 to send/ }).waitFor();
      await context.close();
    }, 150_000);

    it('photos past 150 MB are refused even under 30 photos', async () => {
      const item = await itemCarried();
      // Each photo exactly at the 10 MB a photo may have: fifteen reach the phone's 150 MB, the sixteenth goes over.
      const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'nk-photos-'));
      const large = Array.from({ length: 6 }, (_, i) => path.join(folder, `hull-${i + 1}.jpg`));
      large.forEach((file, i) => fs.writeFileSync(file, Buffer.alloc(10 * 1024 * 1024, i + 1)));
      try {
        const { context, page } = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
        await page.evaluate(async () => Boolean((await navigator.serviceWorker.ready).active));
        await page.getByText(/Kit on this phone as of/).waitFor();
        await context.setOffline(true);
        for (const photos of [large, large, large.slice(0, 3)]) {
          await reportDamage(page, item, photos);
          await saved(page);
        }
        const small = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#44505c' } })
          .jpeg()
          .toBuffer();
        await reportDamage(page, item, [{ name: 'label.jpg', mimeType: 'image/jpeg', buffer: small }]);
        await page
          .getByText(
            'This phone already keeps 15 photos (150 MB) waiting to be sent, and holds at most 30 photos or 150 MB. Send what waits first (find signal), or leave some photos out.',
          )
          .waitFor();
        await leavePhotosOut(page, 1);
        await page.getByRole('link', { name: /Records on this phone: 4 to send/ }).waitFor();
        await context.close();
      } finally {
        fs.rmSync(folder, { recursive: true, force: true });
      }
    }, 150_000);
  });
});
