import 'reflect-metadata';
import cluster from 'node:cluster';
import type { Server } from 'node:http';
import type { DataSource } from 'typeorm';
import { buildApp } from './app';
import { readConfig, type Config } from './config';
import { openDataSource } from './data-source';
import { startLocalFakes } from './fakes/local-fakes';
import { createLogger, type Logger } from './http/logging';
import { createMailTransport } from './notifications/mail-transport';
import { createPaymentClient } from './billing/payment-client';
import { PaymentGateway } from './billing/payment-gateway';
import { restoreAuthorizationsOnLocalFake } from './seed/demo-deposit-authorizations';

/**
 * Listens, starts the routines' scheduler and (locally) the fakes; drains on SIGTERM.
 * With WEB_CONCURRENCY > 1 the primary process starts the fakes and that many
 * workers share the port (the app is stateless, so they are interchangeable).
 */
async function serve(config: Config) {
  const db = await openDataSource(config.DATABASE_URL).initialize();
  const fakes = config.START_LOCAL_FAKES ? await startLocalFakes(config, { paymentWebhookUrl: webhookUrl(config) }) : null;
  const mail = createMailTransport(config);
  const { app, routines, watch } = buildApp({ config, db, mail, log });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
  });
  if (fakes) await restoreLocalAuthorizations(config, db, fakes.paymentPort);
  if (config.RUN_SCHEDULER) routines.start();
  if (cluster.isPrimary || cluster.worker?.id === 1) log.info(`Nestkeeper is listening on http://${config.HOST}:${config.PORT}`);

  onStop(async () => {
    await routines.stop();
    watch.stop();
    const closed = new Promise((resolve) => server.close(resolve));
    server.closeIdleConnections();
    // Requests still running after ten seconds are cut off.
    await Promise.race([closed, new Promise((resolve) => setTimeout(resolve, 10_000).unref())]);
    server.closeAllConnections();
    await fakes?.close();
    mail.close();
    await db.destroy();
  });
}

async function supervise(config: Config) {
  const fakes = config.START_LOCAL_FAKES ? await startLocalFakes(config, { paymentWebhookUrl: webhookUrl(config) }) : null;
  if (fakes) {
    const db = await openDataSource(config.DATABASE_URL, 1).initialize();
    await restoreLocalAuthorizations(config, db, fakes.paymentPort).finally(() => db.destroy());
  }
  const workerEnv = { START_LOCAL_FAKES: 'false' };
  let stopping = false;
  for (let i = 0; i < config.WEB_CONCURRENCY; i += 1) cluster.fork(workerEnv);
  cluster.on('exit', (worker, code) => {
    if (stopping) return;
    log.error(`A server worker stopped (exit ${code}); starting another.`);
    cluster.fork(workerEnv);
  });
  onStop(async () => {
    stopping = true;
    const workers = Object.values(cluster.workers ?? {}).filter((w) => !!w);
    await Promise.all(
      workers.map(
        (w) =>
          new Promise((resolve) => {
            w!.once('exit', resolve);
            w!.process.kill('SIGTERM');
          }),
      ),
    );
    await fakes?.close();
  });
}

/** The local payment fake starts empty: place the card authorizations the database still counts on again (server/seed/demo-deposit-authorizations.ts). */
async function restoreLocalAuthorizations(config: Config, db: DataSource, paymentPort: number) {
  const restored = await restoreAuthorizationsOnLocalFake(db, new PaymentGateway(createPaymentClient(config)), `http://127.0.0.1:${paymentPort}`);
  if (restored) log.info(`Placed ${restored} open deposit authorization(s) again on the local payment fake.`);
}

/** Where the local payment fake delivers its signed events. */
const webhookUrl = (config: Config) => `${config.PUBLIC_URL ?? `http://127.0.0.1:${config.PORT}`}/api/webhooks/payments`;

function onStop(stop: () => Promise<void>) {
  let stopping = false;
  const handler = (signal: string) => {
    if (stopping) return;
    stopping = true;
    if (cluster.isPrimary) log.info(`${signal}: finishing open requests, then stopping.`);
    stop().then(
      () => log.flush(() => process.exit(0)),
      (err) => {
        log.error({ err }, 'stopping failed');
        log.flush(() => process.exit(1));
      },
    );
  };
  process.on('SIGTERM', () => handler('SIGTERM'));
  process.on('SIGINT', () => handler('SIGINT'));
}

const config = (() => {
  try {
    return readConfig();
  } catch (err) {
    // No logger yet: the settings that would make one are what is wrong.
    process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
    process.exit(1);
  }
})();
const log: Logger = createLogger({ level: config.LOG_LEVEL, format: config.LOG_FORMAT });
(cluster.isPrimary && config.WEB_CONCURRENCY > 1 ? supervise(config) : serve(config)).catch((err) => {
  log.fatal({ err }, err instanceof Error ? err.message : String(err));
  log.flush(() => process.exit(1));
});
