import { randomBytes } from 'node:crypto';
import nodemailer from 'nodemailer';
import request from 'supertest';
import { buildApp } from '../../server/app';
import { readConfig, type Config } from '../../server/config';
import type { Logger } from '../../server/http/logging';
import { openDataSource } from '../../server/data-source';
import { DEMO_PASSWORD } from '../../server/seed/demo-people';
import { createTestDatabase } from './test-db';

/** The real app on a fresh seeded database, with supertest and sign-in helpers.
 * `reachDatabaseVia` lets the app reach the database another way (a proxy a test can cut); `log` reads its log lines (silent otherwise). */
export async function createTestApp(
  overrides: Partial<Record<keyof Config, string>> = {},
  opts: { reachDatabaseVia?: (url: string) => string; log?: Logger } = {},
) {
  const database = await createTestDatabase({ seed: true });
  const appDb = opts.reachDatabaseVia ? await openDataSource(opts.reachDatabaseVia(database.url), 2).initialize() : database.db;
  const config = readConfig({
    NODE_ENV: 'test',
    DATABASE_URL: database.url,
    JWT_SECRET: 'test-secret-that-is-long-enough-for-hs256-signing',
    START_LOCAL_FAKES: 'false',
    RUN_SCHEDULER: 'false',
    SMTP_PORT: '9', // nothing listens: tests that send mail start their own sink
    PAYMENT_WEBHOOK_SECRET: webhookSecret(),
    LOG_LEVEL: 'silent',
    ...overrides,
  });
  const mail = nodemailer.createTransport({ host: '127.0.0.1', port: config.SMTP_PORT, secure: false, ignoreTLS: true });
  const { app, routines, watch } = buildApp({ config, db: appDb, mail, log: opts.log });
  const api = request(app);

  async function tokenFor(email: string, password = DEMO_PASSWORD): Promise<string> {
    const res = await api.post('/api/auth/login').send({ email, password });
    if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.token as string;
  }

  const close = async () => {
    watch.stop();
    if (appDb !== database.db && appDb.isInitialized) await appDb.destroy();
    await database.drop();
  };
  return { app, api, routines, watch, db: database.db, config, tokenFor, close };
}

/** A webhook signing secret of the test's own (nothing is built in). */
export const webhookSecret = () => `whsec_${randomBytes(24).toString('base64url')}`;

export type TestApp = Awaited<ReturnType<typeof createTestApp>>;
export const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

/** A supertest parser that keeps a binary body (a PDF, an image) as one Buffer. */
export const binaryBody = (res: import('superagent').Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
