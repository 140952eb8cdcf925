import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';
import { startTcpProxy } from '../support/tcp-proxy';

let rig: BrowserRig;
let proxy: Awaited<ReturnType<typeof startTcpProxy>>;
beforeAll(async () => {
  const server = new URL(process.env.TEST_PG_URL!);
  proxy = await startTcpProxy({ host: server.hostname, port: Number(server.port) });
  rig = await startBrowserRig({ reachDatabaseVia: (url) => Object.assign(new URL(url), { host: `127.0.0.1:${proxy.port}` }).toString() });
});
afterAll(async () => {
  await proxy?.restore().catch(() => undefined);
  await rig?.close();
  await proxy?.close();
});

const BANNER = 'Nestkeeper cannot reach its database; retrying…';

describe('while the database is away', () => {
  it.each([
    ['at 1280 px', {}],
    ['on a phone', phone],
  ])(
    '%s the manager sees one calm banner, no errors, and the page fills in by itself when it is back',
    async (_name, options) => {
      const { context, page } = await signedIn(rig, 'manager@demo.test', 'Shop floor today', options);
      await page.goto(`${rig.baseUrl}/incidents`);
      await page.getByRole('heading', { level: 1, name: 'Incidents' }).waitFor();
      await proxy.cut();
      try {
        await page.goto(`${rig.baseUrl}/fleet`);
        await page.getByText(BANNER).waitFor();
        expect(await page.getByText(BANNER).count()).toBe(1);
        expect(await page.getByRole('alert').count()).toBe(0);
      } finally {
        await proxy.restore();
      }
      await page.getByText(BANNER).waitFor({ state: 'detached' });
      await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Fleet');
      await eventually(() => page.getByText(/\d+ assets/).count()).toBe(1);
      await context.close();
    },
    90_000,
  );
});
