import pg from 'pg';
import type { Config } from '../config';
import { startPaymentFake } from './payment-fake';
import { pgSinkStore, startSmtpSink } from './smtp-sink';
import { fakesLog } from './log';

export type FakesOptions = {
  /** Where both fakes listen; loopback unless a container network needs otherwise. */
  host?: string;
  smtpPort: number;
  paymentPort: number;
  /** The sink keeps mail in `mail_sink_messages` of this database. */
  databaseUrl: string;
  paymentApiKey?: string;
  paymentWebhookUrl?: string;
  paymentWebhookSecret?: string;
};

export type RunningFakes = {
  smtpPort: number;
  paymentPort: number;
  close(): Promise<void>;
};

/** Starts the SMTP sink (storing in PostgreSQL) and the payment-provider fake. */
export async function startFakes(opts: FakesOptions): Promise<RunningFakes> {
  const host = opts.host ?? '127.0.0.1';
  const pool = new pg.Pool({ connectionString: opts.databaseUrl, max: 2 });
  pool.on('error', (err) => fakesLog.warn({ err }, 'idle database connection of the fakes failed'));
  const closers: Array<() => Promise<void>> = [() => pool.end()];
  const closeAll = async () => {
    for (const close of closers.reverse()) await close().catch((err) => fakesLog.error({ err }, 'closing a fake failed'));
    closers.length = 0;
  };
  try {
    const sink = await startSmtpSink({ host, port: opts.smtpPort, store: pgSinkStore(pool) });
    closers.push(() => sink.close());
    const payments = await startPaymentFake({
      host,
      port: opts.paymentPort,
      apiKey: opts.paymentApiKey,
      webhookUrl: opts.paymentWebhookUrl,
      webhookSecret: opts.paymentWebhookSecret,
    });
    closers.push(() => payments.close());
    return { smtpPort: sink.port, paymentPort: payments.port, close: closeAll };
  } catch (err) {
    await closeAll();
    throw err;
  }
}

/** The fakes `npm start` runs beside the app (START_LOCAL_FAKES=true), on loopback. */
export function startLocalFakes(
  config: Pick<Config, 'DATABASE_URL' | 'SMTP_PORT' | 'PAYMENT_API_PORT' | 'PAYMENT_API_KEY' | 'PAYMENT_WEBHOOK_SECRET'>,
  extra: { paymentWebhookUrl?: string } = {},
): Promise<RunningFakes> {
  return startFakes({
    smtpPort: config.SMTP_PORT,
    paymentPort: config.PAYMENT_API_PORT,
    databaseUrl: config.DATABASE_URL,
    paymentApiKey: config.PAYMENT_API_KEY,
    paymentWebhookSecret: config.PAYMENT_WEBHOOK_SECRET,
    paymentWebhookUrl: extra.paymentWebhookUrl,
  });
}
