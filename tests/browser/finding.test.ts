import QRCode from 'qrcode';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe('finding an item on a phone', () => {
  it('shows no camera button where there is no camera, and forgives what is typed, offering near misses', async () => {
    const { context, page } = await signedIn(rig, 'tech@demo.test', 'My kit', phone);
    await page.goto(`${rig.baseUrl}/scan`);
    await page.getByRole('heading', { level: 1, name: 'Find by label' }).waitFor();
    const input = page.getByLabel('Asset tag or RFID tag');
    await input.fill('TIP-005X');
    await page.getByRole('button', { name: 'Find' }).click();
    await eventually(() => page.locator('main').innerText()).toMatch(/Did you mean/);
    expect(await page.getByRole('button', { name: 'Scan QR label' }).count()).toBe(0);
    await page.getByRole('link', { name: 'TIP-005' }).first().click();
    await page.getByRole('heading', { level: 1, name: /TIP-005/ }).waitFor();
    await page.goBack();
    await input.fill('tip 5');
    await page.getByRole('button', { name: 'Find' }).click();
    await page.getByRole('heading', { level: 1, name: /TIP-005/ }).waitFor();
    await context.close();
  });

  it('reads a QR label from the camera without a barcode detector (jsQR in a worker)', async () => {
    const [{ id, asset_tag: tag }] = await rig.db.query(`SELECT id, asset_tag FROM assets WHERE asset_tag = 'SMR-002'`);
    // An independent encoder draws the label; the page's camera is a canvas stream showing it, and the browser's own detector is taken away.
    const { modules } = QRCode.create(tag, { errorCorrectionLevel: 'M' });
    const matrix = Array.from({ length: modules.size }, (_, r) => Array.from({ length: modules.size }, (_, c) => (modules.get(r, c) ? 1 : 0)));
    const context = await rig.newContext(phone);
    await context.addInitScript((cells: number[][]) => {
      delete (window as unknown as { BarcodeDetector?: unknown }).BarcodeDetector;
      const devices = navigator.mediaDevices;
      devices.enumerateDevices = async () => [{ kind: 'videoinput', deviceId: 'label-cam', groupId: 'g', label: 'Label camera', toJSON: () => ({}) }];
      devices.getUserMedia = async () => {
        const scale = 8;
        const side = (cells.length + 8) * scale;
        const canvas = document.createElement('canvas');
        canvas.width = canvas.height = side;
        const g = canvas.getContext('2d')!;
        const draw = () => {
          g.fillStyle = '#fff';
          g.fillRect(0, 0, side, side);
          g.fillStyle = '#000';
          cells.forEach((row, r) => row.forEach((on, c) => on && g.fillRect((c + 4) * scale, (r + 4) * scale, scale, scale)));
        };
        draw();
        setInterval(draw, 100);
        return canvas.captureStream(10);
      };
    }, matrix);
    const page = await context.newPage();
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('tech@demo.test');
    await page.getByLabel('Password').fill('nestkeeper-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'My kit' }).waitFor();
    await page.goto(`${rig.baseUrl}/scan`);
    await page.getByRole('button', { name: 'Scan QR label' }).click();
    await page.waitForURL(new RegExp(`/fleet/${id}$`));
    await page.getByRole('heading', { level: 1, name: new RegExp(tag) }).waitFor();
    await context.close();
  });
});
