import { createLogger } from '../http/logging';

/** The local stand-ins log like the server (JSON, or pino-pretty under `npm start`). */
export const fakesLog = createLogger({
  level: process.env.LOG_LEVEL ?? 'info',
  format: process.env.LOG_FORMAT === 'pretty' ? 'pretty' : 'json',
}).child({ component: 'fakes' });
