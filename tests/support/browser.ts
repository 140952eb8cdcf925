import fs from 'node:fs';
import { createServer, type Server } from 'node:http';
import path from 'node:path';
import nodemailer from 'nodemailer';
import type { BrowserContextOptions } from 'playwright-core';
import { buildApp } from '../../server/app';
import { readConfig } from '../../server/config';
import { startPaymentFake } from '../../server/fakes/payment-fake';
import { launchChromium } from './chromium';
import { WAIT_MS } from './eventually';
import { createTestDatabase } from './test-db';
import { webhookSecret } from './test-app';

/** The real server with the built client on a free loopback port, a seeded
 * database, the payment-provider fake delivering signed webhooks to it, and
 * Debian's Chromium driven by playwright-core. Open pages through `newContext`:
 * its locators and navigations wait with the suite's patience. */
export async function startBrowserRig() {
  const database = await createTestDatabase({ seed: true });
  const secret = webhookSecret();
  const payments = await startPaymentFake({ port: 0, webhookSecret: secret });
  // The app's own address goes into links it mails and the provider's return address, so it is known before the app is built.
  const port = await freePort();
  const config = readConfig({
    NODE_ENV: 'test',
    PORT: String(port),
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    DATABASE_URL: database.url,
    JWT_SECRET: 'browser-test-secret-long-enough-for-hs256',
    START_LOCAL_FAKES: 'false',
    RUN_SCHEDULER: 'false',
    SMTP_PORT: '9',
    CLIENT_DIR: path.resolve('dist/client'),
    PAYMENT_API_PORT: String(payments.port),
    PAYMENT_WEBHOOK_SECRET: secret,
  });
  if (!fs.existsSync(path.join(config.CLIENT_DIR, 'index.html'))) throw new Error('The client is not built: run the suite with `npm test`.');
  const mail = nodemailer.createTransport({ host: '127.0.0.1', port: 9 });
  const { app } = buildApp({ config, db: database.db, mail });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  payments.store.settings.webhookUrl = `http://127.0.0.1:${port}/api/webhooks/payments`;
  const browser = await launchChromium();
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    db: database.db,
    payments,
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
      await database.drop();
    },
  };
}

/** A loopback port nothing listens on right now. */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
    probe.on('error', reject);
  });
}

export type BrowserRig = Awaited<ReturnType<typeof startBrowserRig>>;
