import fs from 'node:fs';
import { createServer } from 'node:http';
import path from 'node:path';
import nodemailer from 'nodemailer';
import pg from 'pg';
import type { BrowserContextOptions } from 'playwright-core';
import { buildApp } from '../../server/app';
import { readConfig } from '../../server/config';
import { openDataSource } from '../../server/data-source';
import { startPaymentFake } from '../../server/fakes/payment-fake';
import { pgSinkStore, startSmtpSink } from '../../server/fakes/smtp-sink';
import { launchChromium } from './chromium';
import { WAIT_MS } from './eventually';
import { createTestDatabase } from './test-db';
import { webhookSecret } from './test-app';

/** The real server with the built client on a free loopback port, a seeded
 * database, the payment-provider fake delivering signed webhooks to it, the SMTP
 * sink whose mail the owner's Mailbox shows (`deliverMail` sends the outbox now), and
 * Debian's Chromium driven by playwright-core. Open pages through `newContext`:
 * its locators and navigations wait with the suite's patience. `reachDatabaseVia` as in createTestApp; `clientDir` serves the
 * client from another folder (a copy whose files a test changes, as a new release would). */
export async function startBrowserRig(opts: { reachDatabaseVia?: (url: string) => string; clientDir?: string } = {}) {
  const database = await createTestDatabase({ seed: true });
  const appDb = opts.reachDatabaseVia ? await openDataSource(opts.reachDatabaseVia(database.url), 4).initialize() : database.db;
  const secret = webhookSecret();
  const payments = await startPaymentFake({ port: 0, webhookSecret: secret });
  const sinkPool = new pg.Pool({ connectionString: database.url, max: 2 });
  const sink = await startSmtpSink({ port: 0, store: pgSinkStore(sinkPool) });
  // Listening first, so the links the app mails carry its real address.
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  const config = readConfig({
    NODE_ENV: 'test',
    PORT: String(port),
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    DATABASE_URL: database.url,
    JWT_SECRET: 'browser-test-secret-long-enough-for-hs256',
    START_LOCAL_FAKES: 'false',
    RUN_SCHEDULER: 'false',
    SMTP_PORT: String(sink.port),
    CLIENT_DIR: path.resolve(opts.clientDir ?? 'dist/client'),
    PAYMENT_API_PORT: String(payments.port),
    PAYMENT_WEBHOOK_SECRET: secret,
    LOG_LEVEL: 'silent',
  });
  if (!fs.existsSync(path.join(config.CLIENT_DIR, 'index.html'))) throw new Error('The client is not built: run the suite with `npm test`.');
  const mail = nodemailer.createTransport({ host: '127.0.0.1', port: sink.port, secure: false, ignoreTLS: true });
  const { app, routines, watch } = buildApp({ config, db: appDb, mail });
  server.on('request', app);
  payments.store.settings.webhookUrl = `http://127.0.0.1:${port}/api/webhooks/payments`;
  const browser = await launchChromium();
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    db: database.db,
    /** What the deliver-outbox routine does on its schedule: queued mail goes to the sink (and the owner's Mailbox). */
    deliverMail: () => routines.run('deliver-outbox', 'manual'),
    payments,
    /** The API as a demo person, beside the browser (arranging data a test does not walk through): GET, or POST with a body. */
    async apiAs(email: string) {
      const login = await fetch(`http://127.0.0.1:${port}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email, password: 'nestkeeper-demo' }),
      });
      const { token } = (await login.json()) as { token: string };
      return (path: string, body?: unknown) =>
        fetch(`http://127.0.0.1:${port}/api${path}`, {
          method: body ? 'POST' : 'GET',
          headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
          body: body ? JSON.stringify(body) : undefined,
        }).then(async (r) => ({ status: r.status, body: await r.json() }));
    },
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
      await sink.close();
      await sinkPool.end();
      await database.drop();
    },
  };
}

export type BrowserRig = Awaited<ReturnType<typeof startBrowserRig>>;
