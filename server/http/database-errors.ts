import type { RequestHandler } from 'express';
import { AppError } from './errors';

/** Seconds a caller should wait before trying again while the database is away. */
export const RETRY_AFTER_SECONDS = 5;

export const databaseUnavailable = () =>
  new AppError(503, 'unavailable', 'Nestkeeper cannot reach its database just now; nothing was changed. Try again in a moment.');

type DriverError = { code?: unknown; severity?: unknown; detail?: unknown; message?: unknown };

// Socket failures on the way to PostgreSQL, and node-postgres' own words for a lost or unobtainable connection.
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  'ECONNABORTED',
]);
const UNREACHABLE_MESSAGES =
  /Connection terminated|Connection ended unexpectedly|timeout exceeded when trying to connect|is not queryable|Cannot use a pool after calling end/i;

/**
 * PostgreSQL's refusals as the API's errors, by SQLSTATE class (PostgreSQL 15
 * documentation, Appendix A "Error Codes"): values it cannot store are the
 * caller's 400, integrity rules 404/409/422, and an unreachable or
 * overloaded database 503. Anything else (our own SQL being wrong) stays a 500.
 * TypeORM's QueryFailedError carries the driver error as `driverError`.
 */
export function fromDatabaseError(err: unknown): AppError | null {
  const outer = err as DriverError & { driverError?: DriverError };
  for (const e of [outer?.driverError, outer]) {
    if (!e) continue;
    const code = typeof e.code === 'string' ? e.code : '';
    if (typeof e.severity === 'string' && /^[0-9A-Z]{5}$/.test(code)) return fromSqlState(code, String(e.detail ?? ''));
    if (UNREACHABLE_CODES.has(code) || UNREACHABLE_MESSAGES.test(String(e.message ?? ''))) return databaseUnavailable();
  }
  return null;
}

function fromSqlState(code: string, detail: string): AppError | null {
  const cls = code.slice(0, 2);
  // 08 connection exception, 53 insufficient resources, 57P0x shut down / starting up, 57014 cancelled (statement timeout).
  if (cls === '08' || cls === '53' || code.startsWith('57P') || code === '57014') return databaseUnavailable();
  // 40001 serialization failure, 40P01 deadlock: two changes met; the same request will likely pass now.
  if (cls === '40') return new AppError(409, 'conflict', 'Someone changed the same records at the same moment; nothing was saved. Try again.');
  if (code === '23505') return new AppError(409, 'conflict', 'Another record already uses that value.');
  if (code === '23P01') return new AppError(409, 'conflict', 'That overlaps with a record already stored.');
  if (code === '23503') {
    return /is not present/.test(detail)
      ? new AppError(404, 'not_found', 'A record this refers to was not found.')
      : new AppError(409, 'conflict', 'Other records still refer to this one.');
  }
  if (cls === '23') return new AppError(422, 'constraint_failed', 'The change breaks a rule the stored records keep; nothing was saved.');
  // 22 data exception: out of range, too long, malformed text for its type, NUL and bad encodings.
  if (cls === '22') return new AppError(400, 'invalid_input', 'A value in the request cannot be stored: it is out of range, too long or malformed.');
  // 54 program limit exceeded: e.g. a value too long for an index row.
  if (cls === '54') return new AppError(400, 'invalid_input', 'A value in the request is too long to store.');
  return null;
}

/**
 * While the database is known to be away, a request waits for the one probe under way instead of a pool connection of
 * its own, and is answered 503 at once if the database is still away. A 503 for an unreachable database makes the watch look.
 */
/** What the gate needs of db/reachability's DatabaseWatch (declared here so http/ stays below db/). */
export interface DatabaseReachability {
  readonly reachable: boolean;
  suspect(): void;
  check(): Promise<boolean>;
}

export function databaseGate(watch: DatabaseReachability): RequestHandler {
  return (_req, res, next) => {
    res.once('finish', () => {
      if (res.locals.errorCode === 'unavailable') watch.suspect();
    });
    if (watch.reachable) return next();
    void watch.check().then((answered) => next(answered ? undefined : databaseUnavailable()));
  };
}
