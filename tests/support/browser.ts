import fs from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import nodemailer from 'nodemailer';
import { chromium, type Browser } from 'playwright-core';
import { buildApp } from '../../server/app';
import { readConfig } from '../../server/config';
import { createTestDatabase } from './test-db';

/** The real server with the built client on a free loopback port, a seeded
 * database, and Debian's Chromium driven by playwright-core (which gives each
 * launch a fresh, throwaway user-data directory). */
export async function startBrowserRig() {
  const database = await createTestDatabase({ seed: true });
  const config = readConfig({
    NODE_ENV: 'test',
    DATABASE_URL: database.url,
    JWT_SECRET: 'browser-test-secret-long-enough-for-hs256',
    START_LOCAL_FAKES: 'false',
    RUN_SCHEDULER: 'false',
    SMTP_PORT: '9',
    CLIENT_DIR: path.resolve('dist/client'),
  });
  if (!fs.existsSync(path.join(config.CLIENT_DIR, 'index.html'))) throw new Error('The client is not built: run the suite with `npm test`.');
  const mail = nodemailer.createTransport({ host: '127.0.0.1', port: 9 });
  const { app } = buildApp({ config, db: database.db, mail });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as { port: number };
  const browser: Browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    browser,
    db: database.db,
    async close() {
      await browser.close();
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await database.drop();
    },
  };
}
