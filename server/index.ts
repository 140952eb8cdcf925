import 'reflect-metadata';
import type { Server } from 'node:http';
import { buildApp } from './app';
import { readConfig } from './config';
import { createDataSource } from './db/data-source';
import { startLocalFakes } from './fakes/local-fakes';
import { createMailTransport } from './notifications/mail-transport';

/** Listens, starts the scheduler and (locally) the fakes; drains on SIGTERM. */
async function main() {
  const config = readConfig();
  const db = await createDataSource(config.DATABASE_URL).initialize();
  const fakes = config.START_LOCAL_FAKES ? await startLocalFakes(config) : null;
  const mail = createMailTransport(config);
  const { app, jobs } = buildApp({ config, db, mail });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
  });
  if (config.RUN_SCHEDULER) jobs.start();
  console.log(`Nestkeeper is listening on http://${config.HOST}:${config.PORT}`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: finishing open requests, then stopping.`);
    await jobs.stop();
    await new Promise((resolve) => server.close(resolve));
    server.closeAllConnections();
    await fakes?.close();
    mail.close();
    await db.destroy();
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
