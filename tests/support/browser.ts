import fs from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import nodemailer from 'nodemailer';
import type { BrowserContextOptions } from 'playwright-core';
import { buildApp } from '../../server/app';
import { readConfig } from '../../server/config';
import { openDataSource } from '../../server/data-source';
import { startPaymentFake } from '../../server/fakes/payment-fake';
import { launchChromium } from './chromium';
import { WAIT_MS } from './eventually';
import { createTestDatabase } from './test-db';
import { webhookSecret } from './test-app';

/** The real server with the built client on a free loopback port, a seeded
 * database, the payment-provider fake delivering signed webhooks to it, and
 * Debian's Chromium driven by playwright-core. Open pages through `newContext`:
 * its locators and navigations wait with the suite's patience. `reachDatabaseVia` as in createTestApp. */
export async function startBrowserRig(opts: { reachDatabaseVia?: (url: string) => string } = {}) {
  const database = await createTestDatabase({ seed: true });
  const appDb = opts.reachDatabaseVia ? await openDataSource(opts.reachDatabaseVia(database.url), 4).initialize() : database.db;
  const secret = webhookSecret();
  const payments = await startPaymentFake({ port: 0, webhookSecret: secret });
  const config = readConfig({
    NODE_ENV: 'test',
    DATABASE_URL: database.url,
    JWT_SECRET: 'browser-test-secret-long-enough-for-hs256',
    START_LOCAL_FAKES: 'false',
    RUN_SCHEDULER: 'false',
    SMTP_PORT: '9',
    CLIENT_DIR: path.resolve('dist/client'),
    PAYMENT_API_PORT: String(payments.port),
    PAYMENT_WEBHOOK_SECRET: secret,
    LOG_LEVEL: 'silent',
  });
  if (!fs.existsSync(path.join(config.CLIENT_DIR, 'index.html'))) throw new Error('The client is not built: run the suite with `npm test`.');
  const mail = nodemailer.createTransport({ host: '127.0.0.1', port: 9 });
  const { app, watch } = buildApp({ config, db: appDb, mail });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as { port: number };
  payments.store.settings.webhookUrl = `http://127.0.0.1:${port}/api/webhooks/payments`;
  const browser = await launchChromium();
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    db: database.db,
    async newContext(options: BrowserContextOptions = {}) {
      const context = await browser.newContext(options);
      context.setDefaultTimeout(WAIT_MS);
      context.setDefaultNavigationTimeout(WAIT_MS);
      return context;
    },
    async close() {
      await browser.close();
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await payments.close();
      watch.stop();
      if (appDb !== database.db && appDb.isInitialized) await appDb.destroy();
      await database.drop();
    },
  };
}

export type BrowserRig = Awaited<ReturnType<typeof startBrowserRig>>;
