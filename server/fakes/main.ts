// Runs the hosted-service fakes on their own: `tsx server/fakes/main.ts`
// (the `fakes` service of docker/compose.yaml). Settings from the environment.
import { z } from 'zod';
import { startFakes } from './local-fakes';
import { fakesLog } from './log';

const port = z.coerce.number().int().min(0).max(65535);
const environment = z.object({
  DATABASE_URL: z.string().url(),
  /** 127.0.0.1 by default; 0.0.0.0 inside a private container network. */
  FAKES_HOST: z.string().default('127.0.0.1'),
  SMTP_SINK_PORT: port.default(4625),
  PAYMENT_FAKE_PORT: port.default(4610),
  PAYMENT_API_KEY: z.string().startsWith('sk_test_').optional(),
  PAYMENT_WEBHOOK_URL: z.string().url().optional(),
  PAYMENT_WEBHOOK_SECRET: z.string().optional(),
});

async function main() {
  const parsed = environment.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`The Nestkeeper fakes cannot start; fix these settings:\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  const fakes = await startFakes({
    host: env.FAKES_HOST,
    smtpPort: env.SMTP_SINK_PORT,
    paymentPort: env.PAYMENT_FAKE_PORT,
    databaseUrl: env.DATABASE_URL,
    paymentApiKey: env.PAYMENT_API_KEY,
    paymentWebhookUrl: env.PAYMENT_WEBHOOK_URL,
    paymentWebhookSecret: env.PAYMENT_WEBHOOK_SECRET,
  });
  fakesLog.info(`Nestkeeper fakes: SMTP sink on ${env.FAKES_HOST}:${fakes.smtpPort}, payment provider on http://${env.FAKES_HOST}:${fakes.paymentPort}`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    fakesLog.info(`${signal}: stopping the fakes.`);
    await fakes.close();
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}

main().catch((err) => {
  fakesLog.fatal({ err }, err instanceof Error ? err.message : String(err));
  process.exit(1);
});
